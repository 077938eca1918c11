"use server";

import { redirect } from "next/navigation";
import type { SetPasswordState } from "@/lib/schemas/people";
import { acceptInvitation } from "@/server/invitations";
import { setPasswordFromLink } from "@/server/set-password-action";

// Public by nature: the token in the link is the credential, checked inside acceptInvitation.
export async function acceptInvitationAction(token: string, _prev: SetPasswordState, formData: FormData): Promise<SetPasswordState> {
  const state = await setPasswordFromLink(formData, ({ password, ip }) => acceptInvitation({ token, password, ip }));
  if (state) return state;
  redirect("/");
}
