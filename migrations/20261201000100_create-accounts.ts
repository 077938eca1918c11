import type { Knex } from "knex";

export const ROLES = ["technician", "inspector", "stores", "reliability", "auditor", "admin"] as const;

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("stations", (t) => {
    t.increments("id").primary();
    t.string("code", 8).notNullable().unique();
    t.string("name", 120).notNullable();
    t.string("time_zone", 64).notNullable(); // IANA zone; instants are stored in UTC and shown in this zone
  });

  await knex.schema.createTable("users", (t) => {
    t.string("id", 40).primary();
    t.string("email", 254).notNullable().unique();
    t.string("name", 120).notNullable();
    t.enu("role", [...ROLES]).notNullable();
    t.string("licence_number", 64).nullable();
    t.date("licence_expires_on").nullable();
    t.integer("station_id").unsigned().nullable().references("stations.id");
    t.enu("status", ["invited", "active", "deactivated"]).notNullable().defaultTo("active");
    t.string("password_hash", 255).nullable();
    t.datetime("last_sign_in_at", { precision: 3 }).nullable();
    t.datetime("created_at", { precision: 3 }).notNullable().defaultTo(knex.raw("CURRENT_TIMESTAMP(3)"));
  });

  // Lucia's MySQL adapter reads and writes this table by these column names.
  await knex.schema.createTable("user_sessions", (t) => {
    t.string("id", 64).primary();
    t.string("user_id", 40).notNullable().references("users.id").onDelete("CASCADE");
    t.datetime("expires_at").notNullable();
    t.index(["user_id"]);
  });

  // Kept in the database (not in memory) so several app processes share one limit.
  await knex.schema.createTable("sign_in_attempts", (t) => {
    t.bigIncrements("id").primary();
    t.string("email", 254).notNullable();
    t.string("ip", 64).notNullable();
    t.boolean("succeeded").notNullable();
    t.datetime("attempted_at", { precision: 3 }).notNullable();
    t.index(["email", "attempted_at"]);
    t.index(["ip", "attempted_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("sign_in_attempts");
  await knex.schema.dropTableIfExists("user_sessions");
  await knex.schema.dropTableIfExists("users");
  await knex.schema.dropTableIfExists("stations");
}
