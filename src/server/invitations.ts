import "server-only";
import { randomUUID } from "node:crypto";
import type { User } from "lucia";
import { CERTIFYING_ROLES } from "@/domain/licence";
import { ROLE_LABELS } from "@/lib/roles";
import type { InviteUserInput, UserView } from "@/lib/schemas/people";
import { recordAccountEvent } from "./account-events";
import { linkRefusalError } from "./account-links";
import { findToken, issueToken, linkFor, markTokenUsed, tokenState, type TokenState } from "./account-tokens";
import { db, type Trx } from "./db";
import { isDuplicateKey } from "./db-errors";
import { serverEnv } from "./env";
import { AppError, invalidField, notFound } from "./errors";
import { kickOutbox, queueMail } from "./mail";
import { hashPassword } from "./passwords";
import { assertPasswordAcceptable } from "./password-policy";
import { getUserView, stationIdFor } from "./users";

// Invitations: an administrator names a person and their role; Threadline mails a single-use link
// (48 hours) with which the person sets a password and is signed in.

/** Technicians and inspectors sign swaps, so their licence and its expiry are needed from the start. */
export function assertLicenceFieldsFor(role: string, licenceNumber: string | null, licenceExpiresOn: string | null): void {
  if (!(CERTIFYING_ROLES as readonly string[]).includes(role)) return;
  if (!licenceNumber) throw invalidField("licenceNumber", `A ${role} signs swaps: enter their licence or authorisation number.`);
  if (!licenceExpiresOn) throw invalidField("licenceExpiresOn", `A ${role} signs swaps: enter the date their licence or authorisation expires.`);
}

function invitationMail(input: { to: string; name: string; role: string; inviter: string; link: string; expiresAt: Date }) {
  return {
    to: input.to,
    subject: "Your Threadline invitation",
    text: [
      `Hello ${input.name},`,
      "",
      `${input.inviter} has invited you to Threadline as ${input.role}.`,
      "Open this link to choose your password; you are then signed in:",
      "",
      input.link,
      "",
      `The link works once and expires at ${input.expiresAt.toISOString().slice(0, 16).replace("T", " ")} UTC.`,
      "If you did not expect this invitation, ignore this mail; nothing happens until the link is used.",
    ].join("\n"),
  };
}

async function mailInvitation(trx: Trx, user: { id: string; email: string; name: string; role: string }, actor: User, now: Date) {
  const { token, expiresAt } = await issueToken(trx, { userId: user.id, purpose: "invitation", createdBy: actor.id, now });
  await queueMail(
    trx,
    invitationMail({
      to: user.email,
      name: user.name,
      role: ROLE_LABELS[user.role as keyof typeof ROLE_LABELS] ?? user.role,
      inviter: actor.name,
      link: linkFor(serverEnv().APP_URL, "/invitation", token),
      expiresAt,
    }),
  );
  return expiresAt;
}

export async function inviteUser(input: { actor: User; invite: InviteUserInput; ip: string; now?: Date }): Promise<UserView> {
  const now = input.now ?? new Date();
  const { invite, actor } = input;
  const licenceNumber = invite.licenceNumber ?? null;
  const licenceExpiresOn = invite.licenceExpiresOn ?? null;
  assertLicenceFieldsFor(invite.role, licenceNumber, licenceExpiresOn);
  const id = `usr-${randomUUID()}`;
  try {
    await db().transaction(async (trx) => {
      const stationId = await stationIdFor(invite.stationCode ?? null, trx);
      const existing = await trx("users").where({ email: invite.email }).first("id");
      if (existing) throw emailTaken(invite.email);
      await trx("users").insert({
        id,
        email: invite.email,
        name: invite.name,
        role: invite.role,
        licence_number: licenceNumber,
        licence_expires_on: licenceExpiresOn,
        station_id: stationId,
        status: "invited",
        password_hash: null,
        created_at: now,
      });
      const expiresAt = await mailInvitation(trx, { id, email: invite.email, name: invite.name, role: invite.role }, actor, now);
      await recordAccountEvent(trx, {
        kind: "invitation_sent",
        actorId: actor.id,
        subjectUserId: id,
        subjectEmail: invite.email,
        ip: input.ip,
        occurredAt: now,
        details: {
          name: invite.name,
          role: invite.role,
          licenceNumber,
          licenceExpiresOn,
          stationCode: invite.stationCode ?? null,
          expiresAt: expiresAt.toISOString(),
        },
      });
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw emailTaken(invite.email);
    throw error;
  }
  kickOutbox();
  return getUserView(id, now);
}

function emailTaken(email: string) {
  return new AppError("conflict", `email: ${email} already has an account. Find it on the People page instead.`, "email_taken", {
    email: "This address already has an account.",
  });
}

/** A new link replaces the old one, which stops working at once. */
export async function resendInvitation(input: { actor: User; userId: string; ip: string; now?: Date }): Promise<UserView> {
  const now = input.now ?? new Date();
  await db().transaction(async (trx) => {
    const user = await trx("users").where({ id: input.userId }).forUpdate().first();
    if (!user) throw notFound("That person");
    if (user.status !== "invited") {
      throw new AppError(
        "conflict",
        user.status === "active"
          ? `${user.name} has already accepted the invitation and signs in with their own password.`
          : `${user.name}'s account is deactivated: reactivate it first, then send the invitation again.`,
        "not_invited",
      );
    }
    const expiresAt = await mailInvitation(trx, user, input.actor, now);
    await recordAccountEvent(trx, {
      kind: "invitation_resent",
      actorId: input.actor.id,
      subjectUserId: user.id,
      subjectEmail: user.email,
      ip: input.ip,
      occurredAt: now,
      details: { expiresAt: expiresAt.toISOString() },
    });
  });
  kickOutbox();
  return getUserView(input.userId, now);
}

export interface InvitationForPage {
  state: TokenState;
  user?: { name: string; email: string; role: string };
}

/** For the invitation page: whether the link can be used, and whose it is. Does not use it up. */
export async function invitationForPage(token: string, now = new Date()): Promise<InvitationForPage> {
  const row = await findToken(token, "invitation");
  const state = tokenState(row, now);
  if (state !== "usable" || !row) return { state };
  const user = await db()("users").where({ id: row.user_id }).first("name", "email", "role", "status");
  if (!user || user.status !== "invited") return { state: "used" };
  return { state, user: { name: user.name, email: user.email, role: user.role } };
}

/** Sets the invited person's password and activates the account; the caller then signs them in. */
export async function acceptInvitation(input: { token: string; password: string; ip: string; now?: Date }): Promise<{ userId: string }> {
  const now = input.now ?? new Date();
  const preview = await findToken(input.token, "invitation");
  const previewState = tokenState(preview, now);
  if (previewState !== "usable" || !preview) throw linkRefusalError("invitation", previewState === "usable" ? "unknown" : previewState);
  const person = await db()("users").where({ id: preview.user_id }).first("email", "name");
  assertPasswordAcceptable(input.password, person);
  // Hashing takes about 90 ms: done before the transaction so no row stays locked meanwhile.
  const passwordHash = await hashPassword(input.password);

  await db().transaction(async (trx) => {
    const row = await findToken(input.token, "invitation", { trx, lock: true });
    const state = tokenState(row, now);
    if (state !== "usable" || !row) throw linkRefusalError("invitation", state === "usable" ? "unknown" : state);
    const user = await trx("users").where({ id: row.user_id }).forUpdate().first();
    if (!user || user.status !== "invited") throw linkRefusalError("invitation", "used");
    await trx("users").where({ id: user.id }).update({ password_hash: passwordHash, status: "active" });
    await markTokenUsed(trx, row.id, now);
    await recordAccountEvent(trx, {
      kind: "invitation_accepted",
      actorId: user.id,
      subjectUserId: user.id,
      subjectEmail: user.email,
      ip: input.ip,
      occurredAt: now,
    });
  });
  return { userId: preview.user_id };
}
