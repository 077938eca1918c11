import type { Knex } from "knex";

// A document belongs to the unit it certifies; the part page lists a unit's documents by this link.
// Block 12 remarks are kept with the certificate they were written on.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("documents", (t) => {
    t.integer("part_id").unsigned().nullable().references("parts.id");
    t.text("remarks").nullable();
    t.index(["part_id", "uploaded_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("documents", (t) => {
    t.dropForeign(["part_id"]);
    t.dropIndex(["part_id", "uploaded_at"]);
    t.dropColumn("part_id");
    t.dropColumn("remarks");
  });
}
