import "server-only";
import type { Knex } from "knex";
import type {
  AircraftTypeView,
  CreateAircraftTypeInput,
  CreatePositionInput,
  EligibleView,
  LayoutQuery,
  PositionView,
  UpdatePositionInput,
} from "@/lib/schemas/layouts";
import { isDuplicateKey, PartNumbers, resolvePartRefs } from "./catalog";
import { db, type Trx } from "./db";
import { AppError, invalidField, notFound } from "./errors";

export const AircraftTypes = "aircraft_types";
export const Positions = "positions";
export const PositionEligibility = "position_eligibility";

interface AircraftTypeRow {
  id: number;
  code: string;
  name: string;
}
interface PositionRow {
  id: number;
  aircraft_type_id: number;
  code: string;
  label: string;
  parent_code: string | null;
  ata_chapter: string;
  map_x: string | number;
  map_y: string | number;
  zone: string | null;
  cautions: string | null;
  requires_independent_inspection: number | boolean;
  sort_order: number;
}

export interface Layout {
  type: AircraftTypeView;
  positions: PositionView[];
  /** Positions of the whole type, before the filters. */
  total: number;
  zones: Array<{ zone: string; count: number }>;
  chapters: Array<{ chapter: string; count: number }>;
}

export async function listAircraftTypes(trx: Trx = db()): Promise<AircraftTypeView[]> {
  const rows = (await trx(`${AircraftTypes} as t`)
    .leftJoin(`${Positions} as p`, "p.aircraft_type_id", "t.id")
    .groupBy("t.id", "t.code", "t.name")
    .orderBy("t.code")
    .select("t.code", "t.name")
    .count({ count: "p.id" })) as unknown as Array<{ code: string; name: string; count: number | string }>;
  return rows.map((row) => ({ code: row.code, name: row.name, positionCount: Number(row.count) }));
}

/** A new aircraft type starts with an empty layout. */
export async function createAircraftType({ input }: { input: CreateAircraftTypeInput }): Promise<AircraftTypeView> {
  try {
    await db()(AircraftTypes).insert({ code: input.code, name: input.name });
  } catch (error) {
    if (isDuplicateKey(error)) {
      throw new AppError("conflict", `There is already an aircraft type ${input.code}.`, "duplicate_type", {
        code: `There is already an aircraft type ${input.code}.`,
      });
    }
    throw error;
  }
  return { code: input.code, name: input.name, positionCount: 0 };
}

async function getTypeOrThrow(typeCode: string, trx: Trx): Promise<AircraftTypeRow> {
  const type: AircraftTypeRow | undefined = await trx(AircraftTypes).where({ code: typeCode }).first();
  if (!type) throw notFound(`Aircraft type ${typeCode}`);
  return type;
}

async function eligibleByPosition(positionIds: number[], trx: Trx): Promise<Map<number, EligibleView[]>> {
  const result = new Map<number, EligibleView[]>(positionIds.map((id) => [id, []]));
  if (positionIds.length === 0) return result;
  const rows: Array<EligibleView & { positionId: number }> = await trx(`${PositionEligibility} as e`)
    .join(`${PartNumbers} as pn`, "pn.id", "e.part_number_id")
    .whereIn("e.position_id", positionIds)
    .orderBy("pn.part_number")
    .select("e.position_id as positionId", "pn.id", "pn.part_number as partNumber", "pn.cage", "pn.description");
  for (const { positionId, ...eligible } of rows) result.get(positionId)?.push(eligible);
  return result;
}

function toView(row: PositionRow, eligible: EligibleView[]): PositionView {
  return {
    code: row.code,
    label: row.label,
    parentCode: row.parent_code,
    ataChapter: row.ata_chapter,
    x: Number(row.map_x),
    y: Number(row.map_y),
    zone: row.zone,
    cautions: row.cautions ? row.cautions.split("\n").filter(Boolean) : [],
    requiresIndependentInspection: Boolean(row.requires_independent_inspection),
    eligible,
  };
}

export async function getLayout(typeCode: string, query: LayoutQuery = {}, trx: Trx = db()): Promise<Layout> {
  const layout = await findLayout(typeCode, query, trx);
  if (!layout) throw notFound(`Aircraft type ${typeCode}`);
  return layout;
}

export async function findLayout(typeCode: string, query: LayoutQuery = {}, trx: Trx = db()): Promise<Layout | null> {
  const type: AircraftTypeRow | undefined = await trx(AircraftTypes).where({ code: typeCode }).first();
  if (!type) return null;
  const rows: PositionRow[] = await trx(Positions).where({ aircraft_type_id: type.id }).orderBy("sort_order").orderBy("code");
  const count = <K extends string>(keys: K[]) =>
    [...keys.reduce((map, key) => map.set(key, (map.get(key) ?? 0) + 1), new Map<K, number>())].sort(([a], [b]) => a.localeCompare(b));
  const shown = rows.filter(
    (row) =>
      (!query.zone || row.zone === query.zone) &&
      (!query.ata || row.ata_chapter === query.ata || row.ata_chapter.startsWith(query.ata + "-")),
  );
  const eligible = await eligibleByPosition(
    shown.map((row) => row.id),
    trx,
  );
  return {
    type: { code: type.code, name: type.name, positionCount: rows.length },
    positions: shown.map((row) => toView(row, eligible.get(row.id)!)),
    total: rows.length,
    zones: count(rows.map((row) => row.zone ?? "")).map(([zone, n]) => ({ zone, count: n })),
    chapters: count(rows.map((row) => row.ata_chapter.slice(0, 2))).map(([chapter, n]) => ({ chapter, count: n })),
  };
}

export async function findPosition(typeCode: string, code: string, trx: Trx = db()): Promise<PositionView | null> {
  const type = await getTypeOrThrow(typeCode, trx);
  const row: PositionRow | undefined = await trx(Positions).where({ aircraft_type_id: type.id, code }).first();
  if (!row) return null;
  return toView(row, (await eligibleByPosition([row.id], trx)).get(row.id)!);
}

async function getPositionRowOrThrow(type: AircraftTypeRow, code: string, trx: Trx): Promise<PositionRow> {
  const row: PositionRow | undefined = await trx(Positions).where({ aircraft_type_id: type.id, code }).forUpdate().first();
  if (!row) throw notFound(`Position ${code} on ${type.code}`);
  return row;
}

/** The parent must be another position of the same type, and not one that sits (however deep) under this one. */
async function checkParent(type: AircraftTypeRow, code: string, parentCode: string, trx: Trx): Promise<void> {
  if (parentCode === code) throw invalidField("parentCode", "A position cannot be its own parent.");
  const rows: Array<{ code: string; parent_code: string | null }> = await trx(Positions)
    .where({ aircraft_type_id: type.id })
    .select("code", "parent_code");
  const parentOf = new Map(rows.map((row) => [row.code, row.parent_code]));
  if (!parentOf.has(parentCode)) throw invalidField("parentCode", `There is no position ${parentCode} on ${type.code}.`);
  const seen = new Set<string>();
  for (let at: string | null | undefined = parentCode; at; at = parentOf.get(at)) {
    if (at === code) throw invalidField("parentCode", `${parentCode} sits under ${code}, so it cannot also be its parent.`);
    if (seen.has(at)) break;
    seen.add(at);
  }
}

async function writeEligibility(positionId: number, input: { eligible?: Array<{ partNumber: string; cage?: string }> }, trx: Knex.Transaction) {
  if (!input.eligible) return;
  const partNumbers = await resolvePartRefs(input.eligible, "eligible", trx);
  const ids = [...new Set(partNumbers.map((row) => row.id))];
  await refuseIneligibleFitted(positionId, ids, trx);
  await trx(PositionEligibility).where({ position_id: positionId }).del();
  if (ids.length) await trx(PositionEligibility).insert(ids.map((id) => ({ position_id: positionId, part_number_id: id })));
}

/** Taking a part number off the list while a unit of it is fitted there would leave the record contradicting itself. */
async function refuseIneligibleFitted(positionId: number, eligibleIds: number[], trx: Knex.Transaction) {
  const fitted: Array<{ registration: string; partNumber: string; serialNumber: string }> = await trx("fitted as f")
    .join("parts as p", "p.id", "f.part_id")
    .join(`${PartNumbers} as pn`, "pn.id", "p.part_number_id")
    .join("aircraft as a", "a.id", "f.aircraft_id")
    .where("f.position_id", positionId)
    .modify((qb) => (eligibleIds.length ? qb.whereNotIn("p.part_number_id", eligibleIds) : qb))
    .select("a.registration", "pn.part_number as partNumber", "p.serial_number as serialNumber");
  if (fitted.length === 0) return;
  const list = fitted.map((f) => `${f.partNumber} S/N ${f.serialNumber} on ${f.registration}`).join(", ");
  throw new AppError("conflict", `Still fitted at this position: ${list}. Keep its part number eligible, or swap the unit first.`, "fitted_not_eligible", {
    eligible: `Still fitted here: ${list}. Keep its part number eligible, or swap the unit first.`,
  });
}

const duplicatePosition = (type: AircraftTypeRow, code: string) =>
  new AppError("conflict", `${type.code} already has a position ${code}.`, "duplicate_position", {
    code: `${type.code} already has a position ${code}; choose another code or edit that one.`,
  });

function positionColumns(input: UpdatePositionInput) {
  const columns: Partial<Omit<PositionRow, "id" | "aircraft_type_id" | "sort_order">> = {};
  if (input.label !== undefined) columns.label = input.label;
  if (input.parentCode !== undefined) columns.parent_code = input.parentCode;
  if (input.ataChapter !== undefined) columns.ata_chapter = input.ataChapter;
  if (input.x !== undefined) columns.map_x = input.x;
  if (input.y !== undefined) columns.map_y = input.y;
  if (input.zone !== undefined) columns.zone = input.zone || null;
  if (input.cautions !== undefined) columns.cautions = input.cautions.length ? input.cautions.join("\n") : null;
  if (input.requiresIndependentInspection !== undefined) columns.requires_independent_inspection = input.requiresIndependentInspection;
  return columns;
}

export async function createPosition({ typeCode, input }: { typeCode: string; input: CreatePositionInput }): Promise<PositionView> {
  const type = await getTypeOrThrow(typeCode, db());
  try {
    return await db().transaction(async (trx) => {
      if (input.parentCode) await checkParent(type, input.code, input.parentCode, trx);
      const [{ last }] = (await trx(Positions).where({ aircraft_type_id: type.id }).max({ last: "sort_order" })) as Array<{ last: number | null }>;
      const [id] = await trx(Positions).insert({
        aircraft_type_id: type.id,
        code: input.code,
        requires_independent_inspection: false,
        sort_order: (last ?? -1) + 1,
        ...positionColumns(input),
      });
      await writeEligibility(id, input, trx);
      return (await findPosition(type.code, input.code, trx))!;
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicatePosition(type, input.code);
    throw error;
  }
}

export async function updatePosition({
  typeCode,
  code,
  input,
}: {
  typeCode: string;
  code: string;
  input: UpdatePositionInput;
}): Promise<PositionView> {
  return db().transaction(async (trx) => {
    const type = await getTypeOrThrow(typeCode, trx);
    const row = await getPositionRowOrThrow(type, code, trx);
    if (input.code !== undefined && input.code !== row.code) {
      throw invalidField("code", "A position's code cannot be changed: the ledger and task cards refer to it. Create a new position instead.");
    }
    if (input.parentCode) await checkParent(type, row.code, input.parentCode, trx);
    const columns = positionColumns(input);
    if (Object.keys(columns).length) await trx(Positions).where({ id: row.id }).update(columns);
    await writeEligibility(row.id, input, trx);
    return (await findPosition(type.code, row.code, trx))!;
  });
}
