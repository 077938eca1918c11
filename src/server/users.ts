import "server-only";
import { dateInZone, daysUntil, licenceStatus } from "@/domain/licence";
import type { Role } from "@/lib/roles";
import type { AccountStatus, StationView, UserListQuery, UserView } from "@/lib/schemas/people";
import { db, type Trx } from "./db";
import { invalidField, notFound } from "./errors";

// Reading people for the People pages and API. Changes live in invitations.ts, account-changes.ts
// and password-resets.ts.

export interface UserRow {
  id: string;
  email: string;
  name: string;
  role: Role;
  status: AccountStatus;
  licence_number: string | null;
  licence_expires_on: Date | string | null;
  station_id: number | null;
  password_hash: string | null;
  last_sign_in_at: Date | null;
  created_at: Date;
}

type UserWithStationRow = UserRow & { station_code: string | null; station_name: string | null; station_time_zone: string | null };

const iso = (value: Date | string | null) => (value === null ? null : new Date(value).toISOString());

export function isoDate(value: Date | string | null): string | null {
  if (value === null) return null;
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  return String(value).slice(0, 10);
}

export async function listStations(trx: Trx = db()): Promise<StationView[]> {
  const rows = await trx("stations").orderBy("code").select("code", "name", "time_zone");
  return rows.map((row) => ({ code: row.code, name: row.name, timeZone: row.time_zone }));
}

export async function stationIdFor(code: string | null, trx: Trx = db()): Promise<number | null> {
  if (code === null) return null;
  const row = await trx("stations").where({ code }).first("id");
  if (!row) {
    const known = (await listStations(trx)).map((station) => station.code).join(", ");
    throw invalidField("stationCode", `No station has the code ${code}; use one of ${known}.`);
  }
  return row.id;
}

function toView(
  row: UserWithStationRow,
  invitation: { created_at: Date; expires_at: Date } | undefined,
  now: Date,
): UserView {
  const station = row.station_code ? { code: row.station_code, name: row.station_name!, timeZone: row.station_time_zone! } : null;
  const today = dateInZone(now, station?.timeZone ?? "UTC");
  const expiresOn = isoDate(row.licence_expires_on);
  return {
    id: row.id,
    name: row.name,
    email: row.email,
    role: row.role,
    status: row.status,
    licenceNumber: row.licence_number,
    licenceExpiresOn: expiresOn,
    licenceStatus: licenceStatus(expiresOn, today),
    licenceDaysLeft: expiresOn ? daysUntil(expiresOn, today) : null,
    station,
    lastSignInAt: iso(row.last_sign_in_at),
    createdAt: iso(row.created_at)!,
    invitation:
      row.status === "invited" && invitation
        ? {
            sentAt: iso(invitation.created_at)!,
            expiresAt: iso(invitation.expires_at)!,
            expired: new Date(invitation.expires_at).getTime() <= now.getTime(),
          }
        : null,
  };
}

function usersWithStations(trx: Trx) {
  return trx("users as u")
    .leftJoin("stations as s", "s.id", "u.station_id")
    .select("u.*", "s.code as station_code", "s.name as station_name", "s.time_zone as station_time_zone");
}

async function latestInvitations(userIds: string[], trx: Trx) {
  if (userIds.length === 0) return new Map<string, { created_at: Date; expires_at: Date }>();
  const rows = await trx("account_tokens")
    .whereIn("user_id", userIds)
    .andWhere({ purpose: "invitation" })
    .whereNull("used_at")
    .whereNull("revoked_at")
    .select("user_id", "created_at", "expires_at")
    .orderBy("created_at", "asc");
  return new Map(rows.map((row) => [row.user_id as string, row]));
}

/** Everyone matching the filters, by name. A maintenance organisation has hundreds of people, not millions. */
export async function listUsers(filters: UserListQuery, now = new Date(), trx: Trx = db()): Promise<UserView[]> {
  const rows: UserWithStationRow[] = await usersWithStations(trx)
    .modify((q) => {
      if (filters.role) q.where("u.role", filters.role);
      if (filters.status) q.where("u.status", filters.status);
      if (filters.station) q.where("s.code", filters.station);
      if (filters.q) {
        const like = `%${filters.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
        q.where((w) => w.where("u.name", "like", like).orWhere("u.email", "like", like).orWhere("u.licence_number", "like", like));
      }
    })
    .orderBy("u.name")
    .limit(2000);
  const invitations = await latestInvitations(
    rows.filter((row) => row.status === "invited").map((row) => row.id),
    trx,
  );
  const views = rows.map((row) => toView(row, invitations.get(row.id), now));
  return filters.licence ? views.filter((view) => view.licenceStatus === filters.licence) : views;
}

export async function getUserView(id: string, now = new Date(), trx: Trx = db()): Promise<UserView> {
  const row = await usersWithStations(trx).where("u.id", id).first();
  if (!row) throw notFound("That person");
  const invitations = await latestInvitations(row.status === "invited" ? [row.id] : [], trx);
  return toView(row, invitations.get(row.id), now);
}

/** The IANA zone of a user's station, for showing instants and reading "today". */
export async function stationTimeZoneOf(userId: string, trx: Trx = db()): Promise<string> {
  const row = await trx("users as u").leftJoin("stations as s", "s.id", "u.station_id").where("u.id", userId).first("s.time_zone");
  return row?.time_zone ?? "UTC";
}
