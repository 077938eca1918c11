import "server-only";
import type { User } from "lucia";
import { accountChangeProblem, type AccountState } from "@/domain/admin-rules";
import type { UpdateUserInput, UserView } from "@/lib/schemas/people";
import { recordAccountEvent } from "./account-events";
import { revokeTokens } from "./account-tokens";
import { db } from "./db";
import { isLockConflict } from "./db-errors";
import { AppError, notFound } from "./errors";
import { assertLicenceFieldsFor } from "./invitations";
import { getUserView, isoDate, stationIdFor } from "./users";

// Role changes, deactivation and reactivation, and edits of a person's details by an administrator.
// The checks that keep an active administrator run on rows locked in this transaction, so two
// administrators acting at the same moment cannot leave the operator with none.

type Actor = Pick<User, "id" | "name">;

export async function updateAccount(input: { actor: Actor; userId: string; change: UpdateUserInput; ip: string; now?: Date }): Promise<UserView> {
  const now = input.now ?? new Date();
  const { actor, change } = input;
  try {
    await db().transaction(async (trx) => {
      const stationId = change.stationCode === undefined ? undefined : await stationIdFor(change.stationCode, trx);
      // One locking read, in primary-key order, of every active admin plus the two accounts involved.
      const locked: AccountState[] = await trx("users")
        .where((w) => w.where({ role: "admin", status: "active" }).orWhereIn("id", [input.userId, actor.id]))
        .orderBy("id")
        .forUpdate()
        .select("id", "role", "status");
      const actorNow = locked.find((row) => row.id === actor.id);
      if (!actorNow || actorNow.role !== "admin" || actorNow.status !== "active") {
        throw new AppError("forbidden", "Your account is no longer an active administrator, so this change was not made.", "forbidden");
      }
      const target = await trx("users").where({ id: input.userId }).first();
      if (!target) throw notFound("That person");

      const problem = accountChangeProblem({
        actorId: actor.id,
        target: { id: target.id, role: target.role, status: target.status },
        change: { role: change.role, status: change.status },
        activeAdminIds: locked.filter((row) => row.role === "admin" && row.status === "active").map((row) => row.id),
      });
      if (problem) throw new AppError("conflict", problem.message, problem.code);

      const role = change.role ?? target.role;
      const licenceNumber = change.licenceNumber === undefined ? target.licence_number : change.licenceNumber;
      const licenceExpiresOn = change.licenceExpiresOn === undefined ? isoDate(target.licence_expires_on) : change.licenceExpiresOn;
      if (change.role !== undefined || change.licenceNumber !== undefined || change.licenceExpiresOn !== undefined) {
        assertLicenceFieldsFor(role, licenceNumber, licenceExpiresOn);
      }

      const update: Record<string, unknown> = {};
      const detailChanges: Record<string, { from: unknown; to: unknown }> = {};
      const note = (field: string, column: string, from: unknown, to: unknown) => {
        if (to === undefined || from === to) return;
        update[column] = to;
        detailChanges[field] = { from, to };
      };
      note("name", "name", target.name, change.name);
      note("licenceNumber", "licence_number", target.licence_number, change.licenceNumber);
      note("licenceExpiresOn", "licence_expires_on", isoDate(target.licence_expires_on), change.licenceExpiresOn);
      if (stationId !== undefined && stationId !== target.station_id) {
        const codes = await trx("stations").whereIn("id", [target.station_id, stationId].filter((id) => id !== null)).select("id", "code");
        const codeOf = (id: number | null) => codes.find((row) => row.id === id)?.code ?? null;
        update.station_id = stationId;
        detailChanges.stationCode = { from: codeOf(target.station_id), to: codeOf(stationId) };
      }
      const roleChanged = change.role !== undefined && change.role !== target.role;
      if (roleChanged) update.role = change.role;
      const deactivating = change.status === "deactivated" && target.status !== "deactivated";
      const reactivating = change.status === "active" && target.status === "deactivated";
      // Someone who never set a password goes back to waiting for an invitation, not straight to active.
      const reactivatedStatus = target.password_hash ? "active" : "invited";
      if (deactivating) update.status = "deactivated";
      if (reactivating) update.status = reactivatedStatus;
      if (Object.keys(update).length === 0) return;

      await trx("users").where({ id: target.id }).update(update);
      const base = { actorId: actor.id, subjectUserId: target.id, subjectEmail: target.email, ip: input.ip, occurredAt: now };
      if (roleChanged) await recordAccountEvent(trx, { ...base, kind: "role_changed", details: { from: target.role, to: change.role } });
      if (Object.keys(detailChanges).length) await recordAccountEvent(trx, { ...base, kind: "details_changed", details: detailChanges });
      if (deactivating) {
        // validateRequest would end these on their next request anyway; deleting them now ends them at once.
        const sessionsEnded = await trx("user_sessions").where({ user_id: target.id }).delete();
        await revokeTokens(trx, target.id, "all", now);
        await recordAccountEvent(trx, { ...base, kind: "deactivated", details: { sessionsEnded } });
      }
      if (reactivating) await recordAccountEvent(trx, { ...base, kind: "reactivated", details: { status: reactivatedStatus } });
    });
  } catch (error) {
    if (isLockConflict(error)) {
      throw new AppError("conflict", "Another change to these accounts was being saved at the same moment. Reload the page and try again.", "busy");
    }
    throw error;
  }
  return getUserView(input.userId, now);
}
