// Shared by the scripts that record demo data through the app's server code.
import type { User } from "lucia";
import type { Trx } from "@/server/db";
import { DEMO_USERS } from "../lib/demo";

/** Why the mail queued while seeding stays in the outbox unsent (see withdrawQueuedMail). */
export const WITHDRAWN_MAIL_REASON = "Not sent: queued while the demo data was seeded; its past is simulated and nobody is to be told about it now.";

/** A demo person as the server's signing code sees a signed-in user (the shape lucia gives the route handlers). */
export async function demoActor(trx: Trx, role: (typeof DEMO_USERS)[number]["role"]): Promise<User> {
  const id = DEMO_USERS.find((u) => u.role === role)!.id;
  const row = await trx("users").where({ id }).first("id", "email", "name", "role", "licence_number", "licence_expires_on", "status");
  if (!row) throw new Error(`the demo ${role} (${id}) is not in the users table; seed 01 writes the demo users`);
  const expires = row.licence_expires_on;
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    licenceNumber: row.licence_number,
    licenceExpiresOn: expires === null ? null : expires instanceof Date ? expires.toISOString().slice(0, 10) : String(expires).slice(0, 10),
    status: row.status,
  };
}
