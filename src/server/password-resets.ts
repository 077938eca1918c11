import "server-only";
import { recordAccountEvent } from "./account-events";
import { linkRefusalError } from "./account-links";
import { findToken, issueToken, linkFor, markTokenUsed, revokeTokens, tokenState, type TokenState } from "./account-tokens";
import { db } from "./db";
import { serverEnv } from "./env";
import { AppError } from "./errors";
import { kickOutbox, queueMail } from "./mail";
import { hashPassword } from "./passwords";
import { assertPasswordAcceptable } from "./password-policy";

// Password reset by e-mail. The request is answered the same way whether or not the address has
// an account, so the form tells nobody who works here; what happened is in the audit trail.

export const RESET_LIMITS = {
  /** Mails per address per hour; further requests are recorded but send nothing. */
  mailsPerAddressPerHour: 3,
  /** Requests per client address per hour before answers become 429, whatever the e-mail. */
  requestsPerClientPerHour: 20,
} as const;

export const RESET_REQUEST_ANSWER = {
  message: "If an account uses that address, a link to choose a new password is on its way. It works once, for one hour.",
} as const;

function resetMail(input: { to: string; name: string; link: string; expiresAt: Date }) {
  return {
    to: input.to,
    subject: "Choose a new Threadline password",
    text: [
      `Hello ${input.name},`,
      "",
      "Someone (hopefully you) asked to reset the password of your Threadline account.",
      "Open this link to choose a new password; every other session of your account is then signed out:",
      "",
      input.link,
      "",
      `The link works once and expires at ${input.expiresAt.toISOString().slice(0, 16).replace("T", " ")} UTC.`,
      "If you did not ask for this, ignore this mail: your password stays as it is.",
    ].join("\n"),
  };
}

export async function requestPasswordReset(input: { email: string; ip: string; now?: Date }): Promise<void> {
  const now = input.now ?? new Date();
  const hourAgo = new Date(now.getTime() - 60 * 60_000);
  const [{ count: fromClient }] = await db()("account_events")
    .where({ kind: "password_reset_requested", ip: input.ip })
    .andWhere("occurred_at", ">=", hourAgo)
    .count({ count: "*" });
  if (Number(fromClient) >= RESET_LIMITS.requestsPerClientPerHour) {
    throw new AppError("too_many_attempts", "Too many password reset requests from this device. Wait an hour and try again.", "too_many_attempts", undefined, {
      "Retry-After": "3600",
    });
  }

  let mailed = false;
  await db().transaction(async (trx) => {
    // Locking the person's row makes concurrent requests for one address count one after another.
    const user = await trx("users").where({ email: input.email }).forUpdate().first("id", "name", "email", "status");
    let reason: string | null = null;
    if (!user) reason = "no account";
    else if (user.status !== "active") reason = `account ${user.status}`;
    else {
      const [{ count: recent }] = await trx("account_tokens")
        .where({ user_id: user.id, purpose: "password_reset" })
        .andWhere("created_at", ">=", hourAgo)
        .count({ count: "*" });
      if (Number(recent) >= RESET_LIMITS.mailsPerAddressPerHour) reason = "hourly limit reached";
    }
    if (user && reason === null) {
      const { token, expiresAt } = await issueToken(trx, { userId: user.id, purpose: "password_reset", now });
      await queueMail(trx, resetMail({ to: user.email, name: user.name, link: linkFor(serverEnv().APP_URL, "/reset-password", token), expiresAt }));
      mailed = true;
    }
    await recordAccountEvent(trx, {
      kind: "password_reset_requested",
      subjectUserId: user?.id ?? null,
      subjectEmail: input.email,
      ip: input.ip,
      occurredAt: now,
      details: { mailed, ...(reason ? { reason } : {}) },
    });
  });
  if (mailed) kickOutbox();
}

export async function resetForPage(token: string, now = new Date()): Promise<{ state: TokenState; email?: string }> {
  const row = await findToken(token, "password_reset");
  const state = tokenState(row, now);
  if (state !== "usable" || !row) return { state };
  const user = await db()("users").where({ id: row.user_id }).first("email", "status");
  if (!user || user.status !== "active") return { state: "superseded" };
  return { state, email: user.email };
}

/** Sets the new password and ends every session of the account; the caller signs the person in afresh. */
export async function completePasswordReset(input: { token: string; password: string; ip: string; now?: Date }): Promise<{ userId: string }> {
  const now = input.now ?? new Date();
  const preview = await findToken(input.token, "password_reset");
  const previewState = tokenState(preview, now);
  if (previewState !== "usable" || !preview) throw linkRefusalError("password_reset", previewState === "usable" ? "unknown" : previewState);
  const person = await db()("users").where({ id: preview.user_id }).first("email", "name");
  assertPasswordAcceptable(input.password, person);
  const passwordHash = await hashPassword(input.password);

  await db().transaction(async (trx) => {
    const row = await findToken(input.token, "password_reset", { trx, lock: true });
    const state = tokenState(row, now);
    if (state !== "usable" || !row) throw linkRefusalError("password_reset", state === "usable" ? "unknown" : state);
    const user = await trx("users").where({ id: row.user_id }).forUpdate().first("id", "email", "status");
    if (!user || user.status !== "active") throw linkRefusalError("password_reset", "superseded");
    await trx("users").where({ id: user.id }).update({ password_hash: passwordHash });
    await markTokenUsed(trx, row.id, now);
    await revokeTokens(trx, user.id, "password_reset", now);
    // The same rows lucia().invalidateUserSessions deletes, but inside this transaction, so the new
    // password and the end of the old sessions happen together.
    const sessionsEnded = await trx("user_sessions").where({ user_id: user.id }).delete();
    await recordAccountEvent(trx, {
      kind: "password_reset_completed",
      actorId: user.id,
      subjectUserId: user.id,
      subjectEmail: user.email,
      ip: input.ip,
      occurredAt: now,
      details: { sessionsEnded },
    });
  });
  return { userId: preview.user_id };
}
