import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("aircraft_types", (t) => {
    t.increments("id").primary();
    t.string("code", 16).notNullable().unique();
    t.string("name", 120).notNullable();
  });

  await knex.schema.createTable("part_numbers", (t) => {
    t.increments("id").primary();
    t.string("part_number", 40).notNullable();
    t.string("cage", 5).notNullable(); // CAGE or manufacturer code
    t.string("description", 200).notNullable();
    t.string("ata_chapter", 8).notNullable(); // iSpec 2200 chapter-section, e.g. 32-42
    t.boolean("serialised").notNullable().defaultTo(true);
    t.bigInteger("life_limit_minutes").unsigned().nullable();
    t.integer("life_limit_cycles").unsigned().nullable();
    t.integer("life_limit_days").unsigned().nullable();
    t.bigInteger("overhaul_interval_minutes").unsigned().nullable();
    t.integer("overhaul_interval_cycles").unsigned().nullable();
    t.unique(["part_number", "cage"]);
    t.index(["ata_chapter"]);
  });

  await knex.schema.createTable("part_interchange", (t) => {
    t.integer("part_number_id").unsigned().notNullable().references("part_numbers.id").onDelete("CASCADE");
    t.integer("alternate_part_number_id").unsigned().notNullable().references("part_numbers.id").onDelete("CASCADE");
    t.boolean("two_way").notNullable().defaultTo(false);
    t.primary(["part_number_id", "alternate_part_number_id"]);
  });

  await knex.schema.createTable("positions", (t) => {
    t.increments("id").primary();
    t.integer("aircraft_type_id").unsigned().notNullable().references("aircraft_types.id").onDelete("CASCADE");
    t.string("code", 32).notNullable();
    t.string("label", 160).notNullable();
    t.string("parent_code", 32).nullable();
    t.string("ata_chapter", 8).notNullable();
    t.decimal("map_x", 7, 2).notNullable(); // map units: 0..1000 along the fuselage
    t.decimal("map_y", 7, 2).notNullable(); // map units: 0..600 across the span
    t.string("zone", 16).nullable();
    t.text("cautions").nullable(); // one caution per line, shown before work at this position
    t.boolean("requires_independent_inspection").notNullable().defaultTo(false);
    t.integer("sort_order").notNullable().defaultTo(0);
    t.unique(["aircraft_type_id", "code"]);
  });

  await knex.schema.createTable("position_eligibility", (t) => {
    t.integer("position_id").unsigned().notNullable().references("positions.id").onDelete("CASCADE");
    t.integer("part_number_id").unsigned().notNullable().references("part_numbers.id").onDelete("CASCADE");
    t.primary(["position_id", "part_number_id"]);
    t.index(["part_number_id"]);
  });

  await knex.schema.createTable("aircraft", (t) => {
    t.increments("id").primary();
    t.string("registration", 16).notNullable().unique();
    t.string("manufacturer_serial_number", 32).notNullable();
    t.integer("aircraft_type_id").unsigned().notNullable().references("aircraft_types.id");
    t.integer("station_id").unsigned().notNullable().references("stations.id");
  });

  // Aircraft total time and cycles as of an instant; never decreasing (checked on write).
  await knex.schema.createTable("utilization", (t) => {
    t.bigIncrements("id").primary();
    t.integer("aircraft_id").unsigned().notNullable().references("aircraft.id").onDelete("CASCADE");
    t.datetime("as_of", { precision: 3 }).notNullable();
    t.bigInteger("total_minutes").unsigned().notNullable();
    t.integer("total_cycles").unsigned().notNullable();
    t.string("recorded_by", 40).nullable().references("users.id");
    t.datetime("recorded_at", { precision: 3 }).notNullable().defaultTo(knex.raw("CURRENT_TIMESTAMP(3)"));
    t.unique(["aircraft_id", "as_of"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    "utilization",
    "aircraft",
    "position_eligibility",
    "positions",
    "part_interchange",
    "part_numbers",
    "aircraft_types",
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
}
