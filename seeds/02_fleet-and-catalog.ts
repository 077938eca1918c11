import type { Knex } from "knex";
import { DEMO_INTERCHANGE, DEMO_PART_NUMBERS } from "./lib/catalog-data";
import { DEMO_AIRCRAFT } from "./lib/demo";
import { buildLayout, DEMO_TYPES } from "./lib/layout-data";

/** Part-number ids follow the order of DEMO_PART_NUMBERS (1-based), so tests can rely on them. */
export const partNumberId = (key: string) => DEMO_PART_NUMBERS.findIndex((p) => p.key === key) + 1;

export async function seed(knex: Knex): Promise<void> {
  await knex("aircraft_types").insert(DEMO_TYPES.map((t) => ({ id: t.id, code: t.code, name: t.name })));

  await knex("part_numbers").insert(
    DEMO_PART_NUMBERS.map((p, index) => ({
      id: index + 1,
      part_number: p.partNumber,
      cage: p.cage,
      description: p.description,
      ata_chapter: p.ata,
      serialised: true,
      life_limit_minutes: p.lifeHours ? p.lifeHours * 60 : null,
      life_limit_cycles: p.lifeCycles ?? null,
      life_limit_days: p.lifeDays ?? null,
      overhaul_interval_minutes: p.overhaulHours ? p.overhaulHours * 60 : null,
      overhaul_interval_cycles: p.overhaulCycles ?? null,
    })),
  );
  await knex("part_interchange").insert(
    DEMO_INTERCHANGE.map(([from, to, twoWay]) => ({
      part_number_id: partNumberId(from),
      alternate_part_number_id: partNumberId(to),
      two_way: twoWay,
    })),
  );

  let positionId = 0;
  const positionRows = [];
  const eligibilityRows = [];
  for (const type of DEMO_TYPES) {
    const layout = buildLayout(type);
    for (const [index, position] of layout.entries()) {
      positionId++;
      positionRows.push({
        id: positionId,
        aircraft_type_id: type.id,
        code: position.code,
        label: position.label,
        parent_code: position.parentCode,
        ata_chapter: position.ata,
        map_x: position.x,
        map_y: position.y,
        zone: position.zone,
        cautions: position.cautions.length ? position.cautions.join("\n") : null,
        requires_independent_inspection: position.independentInspection,
        sort_order: index,
      });
      for (const key of position.eligible) eligibilityRows.push({ position_id: positionId, part_number_id: partNumberId(key) });
    }
  }
  await knex.batchInsert("positions", positionRows, 500);
  await knex.batchInsert("position_eligibility", eligibilityRows, 1000);

  await knex("aircraft").insert(
    DEMO_AIRCRAFT.map((a) => ({
      id: a.id,
      registration: a.registration,
      manufacturer_serial_number: a.msn,
      aircraft_type_id: a.typeId,
      station_id: a.stationId,
    })),
  );
}
