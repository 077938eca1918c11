import type { Knex } from "knex";

const LEDGER_KINDS = [
  "received",
  "issued",
  "installed",
  "removed",
  "returned",
  "sent_for_repair",
  "repaired",
  "quarantined",
  "released",
  "scrapped",
  "corrected",
];
const PART_STATUSES = ["serviceable", "installed", "unserviceable", "in_repair", "quarantined", "scrapped"];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("documents", (t) => {
    t.increments("id").primary();
    t.enu("kind", ["release_certificate", "unserviceable_tag", "shop_report", "photo"]).notNullable();
    t.string("form_type", 40).nullable(); // faa_8130_3, easa_form_1, national, certificate_of_conformity
    t.string("tracking_number", 64).nullable(); // block 3 of the release certificate
    t.string("status_work", 32).nullable(); // block 11: new, overhauled, repaired, inspected_tested, modified
    t.string("issuer_name", 160).nullable();
    t.string("issuer_approval", 64).nullable();
    t.date("issued_on").nullable();
    t.string("object_key", 255).notNullable().unique();
    t.string("sha256", 64).notNullable();
    t.bigInteger("size_bytes").unsigned().notNullable();
    t.string("content_type", 64).notNullable(); // sniffed from the bytes, never taken from the name
    t.string("original_name", 255).nullable();
    t.string("uploaded_by", 40).notNullable().references("users.id");
    t.datetime("uploaded_at", { precision: 3 }).notNullable();
    t.unique(["issuer_approval", "tracking_number"]);
  });

  await knex.schema.createTable("parts", (t) => {
    t.increments("id").primary();
    t.integer("part_number_id").unsigned().notNullable().references("part_numbers.id");
    t.string("serial_number", 40).notNullable();
    t.enu("status", PART_STATUSES).notNullable();
    t.string("bin", 32).nullable(); // stores location while not fitted
    t.date("manufactured_on").nullable();
    // The unit's own totals as of its last ledger entry; while fitted, current values follow from `fitted`.
    t.bigInteger("tsn_minutes").unsigned().notNullable().defaultTo(0);
    t.integer("csn").unsigned().notNullable().defaultTo(0);
    t.bigInteger("tso_minutes").unsigned().nullable();
    t.integer("cso").unsigned().nullable();
    t.datetime("updated_at", { precision: 3 }).notNullable();
    t.unique(["part_number_id", "serial_number"]);
    t.index(["serial_number"]);
    t.index(["status", "part_number_id"]);
  });

  // One row holding the chain's head; appending locks it so the chain stays linear.
  await knex.schema.createTable("ledger_head", (t) => {
    t.tinyint("id").unsigned().primary();
    t.bigInteger("last_seq").unsigned().notNullable();
    t.string("last_hash", 64).notNullable();
  });
  await knex("ledger_head").insert({ id: 1, last_seq: 0, last_hash: "0".repeat(64) });

  await knex.schema.createTable("ledger_entries", (t) => {
    t.bigIncrements("seq").primary();
    t.enu("kind", LEDGER_KINDS).notNullable();
    t.integer("part_id").unsigned().notNullable().references("parts.id");
    t.integer("aircraft_id").unsigned().nullable().references("aircraft.id");
    t.integer("position_id").unsigned().nullable().references("positions.id");
    t.datetime("occurred_at", { precision: 3 }).notNullable();
    t.datetime("recorded_at", { precision: 3 }).notNullable();
    t.string("recorded_by", 40).notNullable().references("users.id");
    t.bigInteger("aircraft_minutes").unsigned().nullable();
    t.integer("aircraft_cycles").unsigned().nullable();
    t.bigInteger("tsn_minutes").unsigned().nullable();
    t.integer("csn").unsigned().nullable();
    t.bigInteger("tso_minutes").unsigned().nullable();
    t.integer("cso").unsigned().nullable();
    t.enu("removal_type", ["scheduled", "unscheduled"]).nullable();
    t.string("reason", 500).nullable();
    t.string("work_order", 64).nullable();
    t.string("task_reference", 128).nullable();
    t.string("test_result", 255).nullable();
    t.integer("document_id").unsigned().nullable().references("documents.id");
    t.bigInteger("corrects_seq").unsigned().nullable();
    t.text("details").nullable(); // canonical JSON of a flat string map
    t.string("prev_hash", 64).notNullable();
    t.string("hash", 64).notNullable();
    t.index(["part_id", "seq"]);
    t.index(["aircraft_id", "occurred_at"]);
    t.index(["kind", "occurred_at"]);
  });

  // Append-only: the database itself refuses to change or remove an entry.
  await knex.raw(`
    CREATE TRIGGER ledger_entries_no_update BEFORE UPDATE ON ledger_entries FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'ledger entries are append-only: record a correction entry instead'`);
  await knex.raw(`
    CREATE TRIGGER ledger_entries_no_delete BEFORE DELETE ON ledger_entries FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'ledger entries are append-only: they cannot be deleted'`);

  // What is fitted where now: a projection of the ledger, rebuilt from it in the tests.
  await knex.schema.createTable("fitted", (t) => {
    t.integer("aircraft_id").unsigned().notNullable().references("aircraft.id");
    t.integer("position_id").unsigned().notNullable().references("positions.id");
    t.integer("part_id").unsigned().notNullable().unique().references("parts.id");
    t.bigInteger("installed_seq").unsigned().notNullable();
    t.datetime("installed_at", { precision: 3 }).notNullable();
    t.bigInteger("aircraft_minutes_at_install").unsigned().notNullable();
    t.integer("aircraft_cycles_at_install").unsigned().notNullable();
    t.bigInteger("tsn_minutes_at_install").unsigned().notNullable();
    t.integer("csn_at_install").unsigned().notNullable();
    t.bigInteger("tso_minutes_at_install").unsigned().nullable();
    t.integer("cso_at_install").unsigned().nullable();
    t.primary(["aircraft_id", "position_id"]);
  });

  await knex.schema.createTable("swaps", (t) => {
    t.string("id", 36).primary();
    t.string("idempotency_key", 128).notNullable().unique();
    t.string("request_hash", 64).notNullable(); // the same key with a different body is refused
    t.integer("aircraft_id").unsigned().notNullable().references("aircraft.id");
    t.integer("position_id").unsigned().notNullable().references("positions.id");
    t.bigInteger("removed_seq").unsigned().nullable();
    t.bigInteger("installed_seq").unsigned().nullable();
    t.string("performed_by", 40).notNullable().references("users.id");
    t.string("inspected_by", 40).nullable().references("users.id");
    t.datetime("performed_at", { precision: 3 }).notNullable();
    t.datetime("inspected_at", { precision: 3 }).nullable();
    t.text("response").notNullable(); // the 201 body, returned again on a retry
    t.datetime("created_at", { precision: 3 }).notNullable();
    t.index(["aircraft_id", "performed_at"]);
  });

  // Mail is written in the same transaction as the change that causes it, and sent afterwards.
  await knex.schema.createTable("mail_outbox", (t) => {
    t.bigIncrements("id").primary();
    t.string("to_address", 254).notNullable();
    t.string("subject", 255).notNullable();
    t.text("text_body").notNullable();
    t.datetime("created_at", { precision: 3 }).notNullable();
    t.datetime("next_attempt_at", { precision: 3 }).notNullable();
    t.datetime("sent_at", { precision: 3 }).nullable();
    t.integer("attempts").unsigned().notNullable().defaultTo(0);
    t.string("last_error", 500).nullable();
    t.index(["sent_at", "next_attempt_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ["mail_outbox", "swaps", "fitted", "ledger_entries", "ledger_head", "parts", "documents"]) {
    await knex.schema.dropTableIfExists(table);
  }
}
