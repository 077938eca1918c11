import "server-only";
import type { User } from "lucia";
import { forbidden, redirect } from "next/navigation";
import { mayUse, type Area } from "@/lib/roles";
import { validateRequest } from "./auth";

/**
 * For pages and server actions: the signed-in user, or a redirect to sign-in;
 * a role that may not use the area gets the 403 page.
 */
export async function requireUserFor(area: Area, returnTo?: string): Promise<User> {
  const { user } = await validateRequest();
  if (!user) redirect(returnTo ? `/sign-in?next=${encodeURIComponent(returnTo)}` : "/sign-in");
  if (!mayUse(user.role, area)) forbidden();
  return user;
}
