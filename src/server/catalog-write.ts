import "server-only";
import type { Knex } from "knex";
import {
  limitsNeedSerialProblem,
  type AlternateDirection,
  type AlternateInput,
  type CreatePartNumberInput,
  type PartNumberView,
  type PartRef,
  type UpdatePartNumberInput,
} from "@/lib/schemas/catalog";
import {
  countUnits,
  getPartNumberOrThrow,
  isDuplicateKey,
  PartInterchange,
  PartNumbers,
  resolvePartRefs,
  type InterchangeRow,
  type PartNumberRow,
} from "./catalog";
import { db } from "./db";
import { AppError, invalidField, notFound } from "./errors";

/** Columns for the fields given; absent fields are left out, so a PATCH touches only what it names. */
export function partNumberColumns(input: UpdatePartNumberInput) {
  const columns: Partial<Omit<PartNumberRow, "id">> = {};
  if (input.partNumber !== undefined) columns.part_number = input.partNumber;
  if (input.cage !== undefined) columns.cage = input.cage;
  if (input.description !== undefined) columns.description = input.description;
  if (input.ataChapter !== undefined) columns.ata_chapter = input.ataChapter;
  if (input.serialised !== undefined) columns.serialised = input.serialised;
  if (input.lifeLimitHours !== undefined) columns.life_limit_minutes = input.lifeLimitHours;
  if (input.lifeLimitCycles !== undefined) columns.life_limit_cycles = input.lifeLimitCycles;
  if (input.lifeLimitDays !== undefined) columns.life_limit_days = input.lifeLimitDays;
  if (input.overhaulHours !== undefined) columns.overhaul_interval_minutes = input.overhaulHours;
  if (input.overhaulCycles !== undefined) columns.overhaul_interval_cycles = input.overhaulCycles;
  return columns;
}

export function duplicatePartNumber(partNumber: string, cage: string): AppError {
  return new AppError("conflict", `${partNumber} (CAGE ${cage}) is already in the catalog.`, "duplicate_part_number", {
    partNumber: `${partNumber} (CAGE ${cage}) is already in the catalog; open it from the list to change it.`,
  });
}

export async function createPartNumber({ input }: { input: CreatePartNumberInput }): Promise<PartNumberView> {
  try {
    return await db().transaction(async (trx) => {
      const [id] = await trx(PartNumbers).insert({ serialised: true, ...partNumberColumns(input) });
      if (input.alternates?.length) await replaceAlternates({ partNumberId: id, alternates: input.alternates, trx });
      return getPartNumberOrThrow(id, trx);
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicatePartNumber(input.partNumber, input.cage);
    throw error;
  }
}

/** A partial update; `alternates`, when given, becomes the whole list of what may replace this part number. */
export async function updatePartNumber({ id, input }: { id: number; input: UpdatePartNumberInput }): Promise<PartNumberView> {
  let identity = { partNumber: input.partNumber ?? "", cage: input.cage ?? "" };
  try {
    return await db().transaction(async (trx) => {
      const current: PartNumberRow | undefined = await trx(PartNumbers).where({ id }).forUpdate().first();
      if (!current) throw notFound(`Part number ${id}`);
      identity = { partNumber: input.partNumber ?? current.part_number, cage: input.cage ?? current.cage };
      const problem = limitsNeedSerialProblem({ ...rowLimits(current), ...definedOnly(input) });
      if (problem) throw invalidField("serialised", problem);
      if (input.serialised === false && Boolean(current.serialised)) {
        const units = await countUnits(id, trx);
        if (units > 0) {
          throw new AppError(
            "conflict",
            `${units} serialised units of ${current.part_number} are on record, so it must stay serialised.`,
            "units_on_record",
            { serialised: `${units} serialised units of this part number are on record; it must stay serialised.` },
          );
        }
      }
      const columns = partNumberColumns(input);
      if (Object.keys(columns).length) await trx(PartNumbers).where({ id }).update(columns);
      if (input.alternates) await replaceAlternates({ partNumberId: id, alternates: input.alternates, trx });
      return getPartNumberOrThrow(id, trx);
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicatePartNumber(identity.partNumber, identity.cage);
    throw error;
  }
}

function rowLimits(row: PartNumberRow) {
  return {
    serialised: Boolean(row.serialised),
    lifeLimitHours: row.life_limit_minutes === null ? null : Number(row.life_limit_minutes),
    lifeLimitCycles: row.life_limit_cycles,
    lifeLimitDays: row.life_limit_days,
    overhaulHours: row.overhaul_interval_minutes === null ? null : Number(row.overhaul_interval_minutes),
    overhaulCycles: row.overhaul_interval_cycles,
  };
}

function definedOnly<T extends object>(value: T): Partial<T> {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as Partial<T>;
}


const pairWhere = (a: number, b: number) => (qb: Knex.QueryBuilder) =>
  qb
    .where({ part_number_id: a, alternate_part_number_id: b })
    .orWhere({ part_number_id: b, alternate_part_number_id: a });

/**
 * Makes `alternates` exactly the part numbers that may replace this one. A pair of part numbers has at
 * most one link. A listed one is linked as given; for one no longer listed, only the reverse direction
 * (this one may replace it) survives, since the list does not speak about that direction.
 */
export async function replaceAlternates({
  partNumberId,
  alternates,
  trx,
}: {
  partNumberId: number;
  alternates: AlternateInput[];
  trx: Knex.Transaction;
}): Promise<void> {
  const targets = await resolvePartRefs(alternates, "alternates", trx);
  const fields: Record<string, string> = {};
  targets.forEach((target, index) => {
    const key = `alternates.${index}.partNumber`;
    if (target.id === partNumberId) fields[key] = "A part number cannot be its own alternate.";
    else if (targets.findIndex((other) => other.id === target.id) < index) fields[key] = `${target.part_number} is listed twice.`;
  });
  if (Object.keys(fields).length) throw new AppError("invalid", Object.values(fields).join(" "), "invalid", fields);

  const listed = new Map<number, AlternateDirection>(targets.map((target, index) => [target.id, alternates[index].direction]));
  const existing: InterchangeRow[] = await trx(PartInterchange)
    .where({ part_number_id: partNumberId })
    .orWhere({ alternate_part_number_id: partNumberId })
    .forUpdate();
  const rows: InterchangeRow[] = [...listed].map(([id, direction]) => ({
    part_number_id: partNumberId,
    alternate_part_number_id: id,
    two_way: direction === "two-way",
  }));
  for (const link of existing) {
    const other = link.part_number_id === partNumberId ? link.alternate_part_number_id : link.part_number_id;
    const thisReplacesOther = link.part_number_id === other || Boolean(link.two_way);
    if (!listed.has(other) && thisReplacesOther) rows.push({ part_number_id: other, alternate_part_number_id: partNumberId, two_way: false });
  }
  await trx(PartInterchange).where({ part_number_id: partNumberId }).orWhere({ alternate_part_number_id: partNumberId }).del();
  if (rows.length) await trx(PartInterchange).insert(rows);
}

/** Sets the one link between two part numbers: `alternate` may replace `partNumberId` (and the reverse when two-way). */
export async function setAlternateLink({
  partNumberId,
  alternate,
  direction,
  reverse = false,
}: {
  partNumberId: number;
  alternate: PartRef;
  direction: AlternateDirection;
  /** One-way the other way round: this part number may replace the alternate. */
  reverse?: boolean;
}): Promise<PartNumberView> {
  return db().transaction(async (trx) => {
    const self: PartNumberRow | undefined = await trx(PartNumbers).where({ id: partNumberId }).forUpdate().first();
    if (!self) throw notFound(`Part number ${partNumberId}`);
    const [other] = await resolvePartRefs([alternate], "alternate", trx);
    if (other.id === partNumberId) throw invalidField("alternate", "A part number cannot be its own alternate.");
    await trx(PartInterchange).where(pairWhere(partNumberId, other.id)).del();
    const [from, to] = reverse && direction === "one-way" ? [other.id, partNumberId] : [partNumberId, other.id];
    await trx(PartInterchange).insert({ part_number_id: from, alternate_part_number_id: to, two_way: direction === "two-way" });
    return getPartNumberOrThrow(partNumberId, trx);
  });
}

/** Removes the link between two part numbers, in whichever direction it was recorded. */
export async function removeAlternateLink({ partNumberId, otherId }: { partNumberId: number; otherId: number }): Promise<void> {
  const removed = await db()(PartInterchange).where(pairWhere(partNumberId, otherId)).del();
  if (removed === 0) throw notFound("That alternate link");
}
