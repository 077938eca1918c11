// Two administrators acting on each other at the same moment must not leave the operator with no
// active administrator. Over HTTP the seeded admin always remains, so this suite runs the real
// account module against a database of its own holding exactly two admins.
import knexFactory, { type Knex } from "knex";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { knexConfig } from "../../knexfile";
import { rootSql } from "../../scripts/lib/mariadb";
import { testEnv } from "../support/api";

const DATABASE = "threadline_admin_race";
let knex: Knex;
let updateAccount: typeof import("../../src/server/account-changes").updateAccount;
let AppError: typeof import("../../src/server/errors").AppError;

beforeAll(async () => {
  const env = testEnv();
  await rootSql(
    env.DB_ADMIN_SOCKET,
    `DROP DATABASE IF EXISTS ${DATABASE}; CREATE DATABASE ${DATABASE} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
     GRANT ALL PRIVILEGES ON ${DATABASE}.* TO '${env.DB_USER}'@'127.0.0.1';`,
  );
  knex = knexFactory(knexConfig({ ...process.env, ...env, DB_NAME: DATABASE }));
  await knex.migrate.latest();
  await knex("stations").insert({ id: 1, code: "QNF", name: "North Field line station", time_zone: "Europe/Lisbon" });
  await knex("users").insert(
    ["usr-race-a", "usr-race-b"].map((id, i) => ({
      id,
      email: `race-${i}@demo.threadline.test`,
      name: `Race Admin ${i}`,
      role: "admin",
      status: "active",
      station_id: 1,
      password_hash: "unused",
    })),
  );
  // The server modules read their connection from the environment once, on first use.
  Object.assign(process.env, { ...env, DB_NAME: DATABASE });
  ({ updateAccount } = await import("../../src/server/account-changes"));
  ({ AppError } = await import("../../src/server/errors"));
});

afterAll(async () => {
  const { db, pool } = await import("../../src/server/db");
  await db().destroy();
  await pool().end();
  await knex?.destroy();
  await rootSql(testEnv().DB_ADMIN_SOCKET, `DROP DATABASE IF EXISTS ${DATABASE}`);
  process.env.DB_NAME = testEnv().DB_NAME;
});

const activeAdmins = async () =>
  (await knex("users").where({ role: "admin", status: "active" }).select("id")).map((row) => row.id as string);

const actor = (id: string) => ({ id, name: id });

describe("two admins deactivating or demoting each other at once", () => {
  it.each([
    ["deactivate", { status: "deactivated" as const }, { status: "active" as const }],
    ["demote", { role: "stores" as const }, { role: "admin" as const }],
  ])("leaves exactly one active admin when both %s the other", async (_name, change, undo) => {
    for (let round = 0; round < 5; round++) {
      const results = await Promise.allSettled([
        updateAccount({ actor: actor("usr-race-a"), userId: "usr-race-b", change, ip: "test" }),
        updateAccount({ actor: actor("usr-race-b"), userId: "usr-race-a", change, ip: "test" }),
      ]);
      const fulfilled = results.filter((result) => result.status === "fulfilled");
      const rejected = results.filter((result): result is PromiseRejectedResult => result.status === "rejected");
      expect(fulfilled).toHaveLength(1);
      expect(rejected).toHaveLength(1);
      expect(rejected[0].reason).toBeInstanceOf(AppError);
      expect([403, 409]).toContain(rejected[0].reason.status);

      const remaining = await activeAdmins();
      expect(remaining).toHaveLength(1);
      const [survivor] = remaining;
      const other = survivor === "usr-race-a" ? "usr-race-b" : "usr-race-a";
      // Only the survivor can put things back; the other is no longer an active admin.
      await expect(updateAccount({ actor: actor(other), userId: survivor, change, ip: "test" })).rejects.toMatchObject({ status: 403 });
      await expect(updateAccount({ actor: actor(survivor), userId: survivor, change, ip: "test" })).rejects.toMatchObject({ code: "own_account" });
      await updateAccount({ actor: actor(survivor), userId: other, change: undo, ip: "test" });
      expect(await activeAdmins()).toHaveLength(2);
    }
  });

  it("writes one audit event per change that was made", async () => {
    const [{ count }] = await knex("account_events").whereIn("kind", ["deactivated", "role_changed"]).count({ count: "*" });
    // Per round: the change that won and the survivor's undo (5 deactivations; 5 demotions + 5 promotions).
    expect(Number(count)).toBe(15);
  });
});
