import type { Knex } from "knex";

// One row per part-number group and closed month whose unscheduled removal rate crossed its alert
// level. The unique key is what makes the alert mail go out once, even with several app processes.
// The removals report and the CSV export find each swap's installed entry through swaps.removed_seq,
// so that column gets an index here too.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("reliability_alerts", (t) => {
    t.bigIncrements("id").primary();
    t.integer("part_number_id").unsigned().notNullable().references("part_numbers.id").onDelete("CASCADE");
    t.string("month", 7).notNullable(); // "YYYY-MM", UTC calendar month
    t.decimal("rate_per_1000", 12, 4).notNullable();
    t.decimal("alert_level", 12, 4).notNullable();
    t.decimal("k", 6, 3).notNullable();
    t.integer("unscheduled_removals").unsigned().notNullable();
    t.bigInteger("unit_minutes").unsigned().notNullable();
    t.integer("recipients").unsigned().notNullable();
    t.datetime("created_at", { precision: 3 }).notNullable();
    t.unique(["part_number_id", "month"]);
  });
  await knex.schema.alterTable("swaps", (t) => {
    t.index(["removed_seq"], "swaps_removed_seq_index");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("swaps", (t) => {
    t.dropIndex(["removed_seq"], "swaps_removed_seq_index");
  });
  await knex.schema.dropTableIfExists("reliability_alerts");
}
