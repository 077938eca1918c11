import type { Knex } from "knex";
import { hash } from "@node-rs/argon2";
import { DEMO_NOW, DEMO_PASSWORD, DEMO_USERS, STATIONS, demoEmail } from "./lib/demo";

export async function seed(knex: Knex): Promise<void> {
  await knex("stations").insert(STATIONS.map((station) => ({ ...station })));
  const passwordHash = await hash(DEMO_PASSWORD);
  await knex("users").insert(
    DEMO_USERS.map((user) => ({
      id: user.id,
      email: demoEmail(user.role),
      name: user.name,
      role: user.role,
      licence_number: user.licence,
      licence_expires_on: "2028-06-30",
      station_id: user.station_id,
      status: "active",
      password_hash: passwordHash,
      created_at: DEMO_NOW,
    })),
  );
}
