import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { db, type Trx } from "./db";

// Single-use links for invitations and password resets. A token is 32 random bytes; only its
// SHA-256 is stored, so guessing is hopeless and a database copy opens no account.

export type TokenPurpose = "invitation" | "password_reset";

export const TOKEN_LIFETIME_MS: Record<TokenPurpose, number> = {
  invitation: 48 * 60 * 60_000,
  password_reset: 60 * 60_000,
};

export type TokenState = "usable" | "unknown" | "used" | "superseded" | "expired";

export interface TokenRow {
  id: number;
  user_id: string;
  purpose: TokenPurpose;
  created_at: Date;
  expires_at: Date;
  used_at: Date | null;
  revoked_at: Date | null;
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** Tokens are base64url; anything else cannot be one of ours and is not looked up. */
const TOKEN_SHAPE = /^[A-Za-z0-9_-]{43}$/;

/** Issues a new link and retires every unused earlier link of the same purpose for this user. */
export async function issueToken(
  trx: Trx,
  input: { userId: string; purpose: TokenPurpose; createdBy?: string | null; now?: Date },
): Promise<{ token: string; expiresAt: Date }> {
  const now = input.now ?? new Date();
  await revokeTokens(trx, input.userId, input.purpose, now);
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(now.getTime() + TOKEN_LIFETIME_MS[input.purpose]);
  await trx("account_tokens").insert({
    user_id: input.userId,
    purpose: input.purpose,
    token_hash: hashToken(token),
    created_at: now,
    expires_at: expiresAt,
    created_by: input.createdBy ?? null,
  });
  return { token, expiresAt };
}

export async function revokeTokens(trx: Trx, userId: string, purpose: TokenPurpose | "all", now = new Date()): Promise<void> {
  await trx("account_tokens")
    .where({ user_id: userId })
    .modify((q) => {
      if (purpose !== "all") q.where({ purpose });
    })
    .whereNull("used_at")
    .whereNull("revoked_at")
    .update({ revoked_at: now });
}

/** Looks a token up by its hash; with `lock`, the row stays locked until the transaction ends. */
export async function findToken(
  token: string,
  purpose: TokenPurpose,
  options: { trx?: Trx; lock?: boolean } = {},
): Promise<TokenRow | null> {
  if (!TOKEN_SHAPE.test(token)) return null;
  const trx = options.trx ?? db();
  const query = trx("account_tokens").where({ token_hash: hashToken(token), purpose }).first();
  const row = options.lock ? await query.forUpdate() : await query;
  return (row as TokenRow | undefined) ?? null;
}

export function tokenState(row: TokenRow | null, now: Date): TokenState {
  if (!row) return "unknown";
  if (row.used_at) return "used";
  if (row.revoked_at) return "superseded";
  if (new Date(row.expires_at).getTime() <= now.getTime()) return "expired";
  return "usable";
}

export async function markTokenUsed(trx: Trx, id: number, now: Date): Promise<void> {
  await trx("account_tokens").where({ id }).update({ used_at: now });
}

/** The link a person opens from the mail, on the configured public address of the app. */
export function linkFor(appUrl: string, path: string, token: string): string {
  return `${appUrl.replace(/\/+$/, "")}${path}/${token}`;
}
