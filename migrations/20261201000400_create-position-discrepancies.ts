import type { Knex } from "knex";

// A technician found a different unit (or none) at a position than the record says. The record is
// not silently corrected: the discrepancy is kept here and inspectors are told.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("position_discrepancies", (t) => {
    t.bigIncrements("id").primary();
    t.integer("aircraft_id").unsigned().notNullable().references("aircraft.id");
    t.integer("position_id").unsigned().notNullable().references("positions.id");
    t.integer("recorded_part_id").unsigned().nullable().references("parts.id");
    t.string("found_part_number", 40).nullable();
    t.string("found_serial_number", 40).nullable();
    t.string("note", 500).nullable();
    t.string("reported_by", 40).notNullable().references("users.id");
    t.datetime("reported_at", { precision: 3 }).notNullable();
    t.datetime("resolved_at", { precision: 3 }).nullable();
    t.index(["aircraft_id", "reported_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("position_discrepancies");
}
