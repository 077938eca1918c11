"use server";

import { redirect } from "next/navigation";
import { clearSessionCookie, lucia, validateRequest } from "@/server/auth";

export async function signOutAction(): Promise<void> {
  const { session } = await validateRequest();
  if (session) await lucia().invalidateSession(session.id);
  await clearSessionCookie();
  redirect("/sign-in");
}
