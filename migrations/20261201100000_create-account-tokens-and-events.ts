import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  // Single-use links mailed for invitations and password resets. Only the SHA-256 of each token is
  // kept, so a copy of this table opens no account.
  await knex.schema.createTable("account_tokens", (t) => {
    t.bigIncrements("id").primary();
    t.string("user_id", 40).notNullable().references("users.id").onDelete("CASCADE");
    t.enu("purpose", ["invitation", "password_reset"]).notNullable();
    t.specificType("token_hash", "CHAR(64)").notNullable().unique();
    t.datetime("created_at", { precision: 3 }).notNullable();
    t.datetime("expires_at", { precision: 3 }).notNullable();
    t.datetime("used_at", { precision: 3 }).nullable();
    t.datetime("revoked_at", { precision: 3 }).nullable(); // superseded by a newer link, or the account was deactivated
    t.string("created_by", 40).nullable().references("users.id");
    t.index(["user_id", "purpose", "created_at"]);
  });

  // Who did what to which account, when and from where. Append-only like the ledger.
  await knex.schema.createTable("account_events", (t) => {
    t.bigIncrements("id").primary();
    t.datetime("occurred_at", { precision: 3 }).notNullable();
    t.string("kind", 40).notNullable();
    t.string("actor_id", 40).nullable().references("users.id");
    t.string("subject_user_id", 40).nullable().references("users.id");
    t.string("subject_email", 254).nullable(); // as it was then; also for addresses with no account
    t.string("ip", 64).nullable();
    t.text("details").nullable(); // JSON object of what changed
    t.index(["occurred_at"]);
    t.index(["kind", "occurred_at"]);
    t.index(["subject_user_id", "occurred_at"]);
    t.index(["actor_id", "occurred_at"]);
    t.index(["subject_email", "occurred_at"]);
  });
  await knex.raw(`
    CREATE TRIGGER account_events_no_update BEFORE UPDATE ON account_events FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'account events are append-only: they cannot be changed'`);
  await knex.raw(`
    CREATE TRIGGER account_events_no_delete BEFORE DELETE ON account_events FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'account events are append-only: they cannot be deleted'`);

  // The People filters and the admin-count lock read by these.
  await knex.schema.alterTable("users", (t) => {
    t.index(["role", "status"]);
    t.index(["status"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("users", (t) => {
    t.dropIndex(["role", "status"]);
    t.dropIndex(["status"]);
  });
  await knex.schema.dropTableIfExists("account_events");
  await knex.schema.dropTableIfExists("account_tokens");
}
