import type { Knex } from "knex";

// The continuity findings count of each unit's thread, cached, so the position map and the fleet
// list do not replay every fitted unit's whole thread on every load (500 positions took ~150 ms at
// fleet scale, almost all of it re-reading and re-checking threads that had not changed).
//
// A cached count is valid while two things are unchanged since it was computed:
// - the unit's thread: its newest ledger seq (the ledger is append-only, so a new entry is the only
//   way a thread changes);
// - everything else the check reads (part numbers and their limits, alternates, positions and their
//   eligibility, the aircraft's type, certificates): `catalog_revision`, which triggers on those
//   tables bump on every change, whoever makes it - the app, an import or a hand-run statement.
// The trace and the part page always check the thread afresh; only counts are cached.
const REVISED_BY: Array<{ table: string; events: string[]; when?: string }> = [
  { table: "part_numbers", events: ["INSERT", "UPDATE", "DELETE"] },
  { table: "part_interchange", events: ["INSERT", "UPDATE", "DELETE"] },
  { table: "positions", events: ["INSERT", "UPDATE", "DELETE"] },
  { table: "position_eligibility", events: ["INSERT", "UPDATE", "DELETE"] },
  // Aircraft rows change for other reasons; only a new type or registration changes a finding.
  { table: "aircraft", events: ["UPDATE"], when: "NOT (OLD.aircraft_type_id <=> NEW.aircraft_type_id) OR NOT (OLD.registration <=> NEW.registration)" },
  // A new document changes nothing until an entry cites it (and that entry changes the thread).
  { table: "documents", events: ["UPDATE", "DELETE"] },
];

const triggerName = (table: string, event: string) => `${table}_revises_catalog_${event.toLowerCase()}`;

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("catalog_revision", (t) => {
    t.tinyint("id").unsigned().primary();
    t.bigInteger("revision").unsigned().notNullable().defaultTo(0);
  });
  await knex("catalog_revision").insert({ id: 1, revision: 0 });

  // No foreign key to parts: a cache row must never make a swap wait on it, and parts are never deleted.
  await knex.schema.createTable("thread_findings", (t) => {
    t.integer("part_id").unsigned().primary();
    t.bigInteger("through_seq").unsigned().notNullable();
    t.bigInteger("catalog_revision").unsigned().notNullable();
    t.integer("finding_count").unsigned().notNullable();
    t.datetime("computed_at", { precision: 3 }).notNullable();
  });

  for (const { table, events, when } of REVISED_BY) {
    for (const event of events) {
      const bump = "UPDATE catalog_revision SET revision = revision + 1 WHERE id = 1";
      await knex.raw(`CREATE TRIGGER ${triggerName(table, event)} AFTER ${event} ON ${table} FOR EACH ROW ${when ? `IF ${when} THEN ${bump}; END IF` : bump}`);
    }
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const { table, events } of REVISED_BY) {
    for (const event of events) await knex.raw(`DROP TRIGGER IF EXISTS ${triggerName(table, event)}`);
  }
  await knex.schema.dropTableIfExists("thread_findings");
  await knex.schema.dropTableIfExists("catalog_revision");
}
