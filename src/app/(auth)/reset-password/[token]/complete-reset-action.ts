"use server";

import { redirect } from "next/navigation";
import type { SetPasswordState } from "@/lib/schemas/people";
import { completePasswordReset } from "@/server/password-resets";
import { setPasswordFromLink } from "@/server/set-password-action";

// Public by nature: the token in the link is the credential, checked inside completePasswordReset.
export async function completeResetAction(token: string, _prev: SetPasswordState, formData: FormData): Promise<SetPasswordState> {
  const state = await setPasswordFromLink(formData, ({ password, ip }) => completePasswordReset({ token, password, ip }));
  if (state) return state;
  redirect("/");
}
