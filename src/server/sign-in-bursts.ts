import "server-only";
import { recordAccountEvent } from "./account-events";
import { db } from "./db";

/**
 * Called after a failed sign-in is stored: when that failure is the one that reaches the limit for
 * the address or for the client, the burst goes into the account audit trail (once per crossing,
 * not once per refused attempt).
 */
export async function noteFailedSignIn(input: {
  email: string;
  ip: string;
  userId: string | null;
  failuresBefore: { byEmail: number; byIp: number };
  limits: { windowMinutes: number; perEmail: number; perIp: number };
  now: Date;
}): Promise<void> {
  const byAddress = input.failuresBefore.byEmail + 1 === input.limits.perEmail;
  const byClient = input.failuresBefore.byIp + 1 === input.limits.perIp;
  if (!byAddress && !byClient) return;
  await recordAccountEvent(db(), {
    kind: "sign_in_locked",
    subjectUserId: byAddress ? input.userId : null,
    subjectEmail: byAddress ? input.email : null,
    ip: input.ip,
    occurredAt: input.now,
    details: {
      lockedBy: byAddress && byClient ? "address and client" : byAddress ? "address" : "client",
      failures: byAddress ? input.limits.perEmail : input.limits.perIp,
      windowMinutes: input.limits.windowMinutes,
      lastEmailTried: input.email,
    },
  });
}
