import "server-only";
import { lucia, setSessionCookie } from "./auth";
import { db } from "./db";

/** Signs a person in right after they set a password through a mailed link. */
export async function startSessionAfterPasswordSet(userId: string, now = new Date()): Promise<void> {
  const session = await lucia().createSession(userId, {});
  await db()("users").where({ id: userId }).update({ last_sign_in_at: now });
  await setSessionCookie(session.id);
}
