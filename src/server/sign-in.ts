import "server-only";
import { db } from "./db";
import { lucia } from "./auth";
import { AppError } from "./errors";
import { burnVerifyTime, verifyPassword } from "./passwords";
import { noteFailedSignIn } from "./sign-in-bursts";

// Failed attempts allowed per address and per client within the window before answers become 429.
export const SIGN_IN_LIMITS = { windowMinutes: 15, perEmail: 5, perIp: 20 } as const;

export interface SignedIn {
  user: { id: string; email: string; name: string; role: string };
  sessionId: string;
}

async function failedAttemptsSince(email: string, ip: string, since: Date) {
  const [row] = await db()("sign_in_attempts")
    .where("attempted_at", ">=", since)
    .andWhere("succeeded", false)
    .select(
      db().raw("SUM(email = ?) AS by_email", [email]),
      db().raw("SUM(ip = ?) AS by_ip", [ip]),
    );
  return { byEmail: Number(row?.by_email ?? 0), byIp: Number(row?.by_ip ?? 0) };
}

export async function signIn(input: { email: string; password: string; ip: string; now?: Date }): Promise<SignedIn> {
  const now = input.now ?? new Date();
  const email = input.email.trim().toLowerCase();
  const since = new Date(now.getTime() - SIGN_IN_LIMITS.windowMinutes * 60_000);
  const failures = await failedAttemptsSince(email, input.ip, since);
  if (failures.byEmail >= SIGN_IN_LIMITS.perEmail || failures.byIp >= SIGN_IN_LIMITS.perIp) {
    throw new AppError(
      "too_many_attempts",
      `Too many failed sign-ins. Wait ${SIGN_IN_LIMITS.windowMinutes} minutes, or ask an administrator to reset your password.`,
      "too_many_attempts",
      undefined,
      { "Retry-After": String(SIGN_IN_LIMITS.windowMinutes * 60) },
    );
  }

  const user = await db()("users").where({ email }).first();
  const passwordOk = user?.password_hash ? await verifyPassword(user.password_hash, input.password) : (await burnVerifyTime(input.password), false);
  await db()("sign_in_attempts").insert({ email, ip: input.ip, succeeded: passwordOk, attempted_at: now });
  if (!passwordOk) {
    await noteFailedSignIn({ email, ip: input.ip, userId: user?.id ?? null, failuresBefore: failures, limits: SIGN_IN_LIMITS, now });
  }
  if (!user || !passwordOk) {
    throw new AppError("unauthenticated", "The e-mail address or password is not right.", "bad_credentials", {
      password: "The e-mail address or password is not right.",
    });
  }
  if (user.status === "deactivated") {
    throw new AppError("forbidden", "This account has been deactivated. Ask an administrator if you need access again.", "account_deactivated");
  }
  if (user.status !== "active") {
    throw new AppError("forbidden", "This account has not been activated yet: use the link in your invitation e-mail.", "account_invited");
  }

  const session = await lucia().createSession(user.id, {});
  await db()("users").where({ id: user.id }).update({ last_sign_in_at: now });
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, sessionId: session.id };
}

export async function signOut(sessionId: string): Promise<void> {
  await lucia().invalidateSession(sessionId);
}
