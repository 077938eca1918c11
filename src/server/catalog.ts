import "server-only";
import { formatFlightTime } from "@/domain/flight-time";
import type { AlternateView, PartNumberListQuery, PartNumberView, PartRef } from "@/lib/schemas/catalog";
import { db, type Trx } from "./db";
import { AppError, notFound } from "./errors";

export const PartNumbers = "part_numbers";
export const PartInterchange = "part_interchange";

export interface PartNumberRow {
  id: number;
  part_number: string;
  cage: string;
  description: string;
  ata_chapter: string;
  serialised: number | boolean;
  life_limit_minutes: number | string | null;
  life_limit_cycles: number | null;
  life_limit_days: number | null;
  overhaul_interval_minutes: number | string | null;
  overhaul_interval_cycles: number | null;
}
export interface InterchangeRow {
  part_number_id: number;
  alternate_part_number_id: number;
  two_way: number | boolean;
}

const SORT_COLUMNS = { partNumber: "part_number", cage: "cage", description: "description", ataChapter: "ata_chapter" } as const;

const minutesOrNull = (value: number | string | null) => (value === null ? null : formatFlightTime(Number(value)));

export function isDuplicateKey(error: unknown): boolean {
  return typeof error === "object" && error !== null && (error as { code?: string }).code === "ER_DUP_ENTRY";
}

/** "%text%" for LIKE, with the wildcards in the text escaped by "!". */
export function containsPattern(text: string): string {
  return `%${text.replace(/[!%_]/g, "!$&")}%`;
}

/** Who may replace whom, for each of `ids`, from the interchange rows that touch them. */
async function loadInterchange(ids: number[], trx: Trx): Promise<Map<number, { alternates: AlternateView[]; replaces: AlternateView[] }>> {
  const result = new Map(ids.map((id) => [id, { alternates: [] as AlternateView[], replaces: [] as AlternateView[] }]));
  if (ids.length === 0) return result;
  const links: InterchangeRow[] = await trx(PartInterchange)
    .whereIn("part_number_id", ids)
    .orWhereIn("alternate_part_number_id", ids)
    .select("part_number_id", "alternate_part_number_id", "two_way");
  const otherIds = [...new Set(links.flatMap((link) => [link.part_number_id, link.alternate_part_number_id]))];
  const others = new Map<number, PartNumberRow>(
    otherIds.length
      ? (await trx(PartNumbers).whereIn("id", otherIds).select("id", "part_number", "cage", "description")).map((row: PartNumberRow) => [row.id, row])
      : [],
  );
  const view = (id: number, twoWay: boolean): AlternateView => {
    const row = others.get(id)!;
    return { id, partNumber: row.part_number, cage: row.cage, description: row.description, direction: twoWay ? "two-way" : "one-way" };
  };
  for (const link of links) {
    const twoWay = Boolean(link.two_way);
    // A row (A, B) says B may replace A; two-way says A may replace B as well.
    const from = result.get(link.part_number_id);
    if (from) {
      from.alternates.push(view(link.alternate_part_number_id, twoWay));
      if (twoWay) from.replaces.push(view(link.alternate_part_number_id, twoWay));
    }
    const to = result.get(link.alternate_part_number_id);
    if (to) {
      to.replaces.push(view(link.part_number_id, twoWay));
      if (twoWay) to.alternates.push(view(link.part_number_id, twoWay));
    }
  }
  const byPartNumber = (a: AlternateView, b: AlternateView) => a.partNumber.localeCompare(b.partNumber) || a.cage.localeCompare(b.cage);
  for (const entry of result.values()) {
    entry.alternates.sort(byPartNumber);
    entry.replaces.sort(byPartNumber);
  }
  return result;
}

function toView(row: PartNumberRow, links: { alternates: AlternateView[]; replaces: AlternateView[] }): PartNumberView {
  return {
    id: row.id,
    partNumber: row.part_number,
    cage: row.cage,
    description: row.description,
    ataChapter: row.ata_chapter,
    serialised: Boolean(row.serialised),
    lifeLimitHours: minutesOrNull(row.life_limit_minutes),
    lifeLimitCycles: row.life_limit_cycles,
    lifeLimitDays: row.life_limit_days,
    overhaulHours: minutesOrNull(row.overhaul_interval_minutes),
    overhaulCycles: row.overhaul_interval_cycles,
    alternates: links.alternates,
    replaces: links.replaces,
  };
}

export async function listPartNumbers(
  query: PartNumberListQuery,
  trx: Trx = db(),
): Promise<{ partNumbers: PartNumberView[]; total: number }> {
  const base = trx(PartNumbers).modify((qb) => {
    if (query.q) {
      const pattern = containsPattern(query.q);
      qb.where((w) =>
        w
          .whereRaw("part_number like ? escape '!'", [pattern])
          .orWhereRaw("description like ? escape '!'", [pattern])
          .orWhere("cage", query.q!.toUpperCase()),
      );
    }
    if (query.ata) qb.where((w) => w.where("ata_chapter", query.ata!).orWhere("ata_chapter", "like", `${query.ata}-%`));
  });
  const [{ count }] = await base.clone().count({ count: "*" });
  const rows: PartNumberRow[] = await base
    .clone()
    .select("*")
    .orderBy(SORT_COLUMNS[query.sort ?? "ataChapter"], query.dir ?? "asc")
    .orderBy("part_number")
    .orderBy("cage")
    .limit(query.limit ?? 100)
    .offset(query.offset ?? 0);
  const links = await loadInterchange(
    rows.map((row) => row.id),
    trx,
  );
  return { partNumbers: rows.map((row) => toView(row, links.get(row.id)!)), total: Number(count) };
}

/** ATA chapters (first two digits) in the catalog, with how many part numbers each has. */
export async function countPartNumbersByChapter(trx: Trx = db()): Promise<Array<{ chapter: string; count: number }>> {
  const rows = (await trx(PartNumbers)
    .select(trx.raw("left(ata_chapter, 2) as chapter"))
    .count({ count: "*" })
    .groupByRaw("left(ata_chapter, 2)")
    .orderBy("chapter")) as unknown as Array<{ chapter: string; count: number | string }>;
  return rows.map((row) => ({ chapter: row.chapter, count: Number(row.count) }));
}

export async function findPartNumber(id: number, trx: Trx = db()): Promise<PartNumberView | null> {
  const row: PartNumberRow | undefined = await trx(PartNumbers).where({ id }).first();
  if (!row) return null;
  return toView(row, (await loadInterchange([id], trx)).get(id)!);
}

export async function getPartNumberOrThrow(id: number, trx: Trx = db()): Promise<PartNumberView> {
  const found = await findPartNumber(id, trx);
  if (!found) throw notFound(`Part number ${id}`);
  return found;
}

/** How many serialised units of a part number are on record, for the edit page and the serialised rule. */
export async function countUnits(partNumberId: number, trx: Trx = db()): Promise<number> {
  const [{ count }] = await trx("parts").where({ part_number_id: partNumberId }).count({ count: "*" });
  return Number(count);
}

/**
 * Catalog entries for references by part number (and CAGE where given). `field` names the input list,
 * so an unknown or ambiguous entry is a 422 on `field.N.partNumber`.
 */
export async function resolvePartRefs(refs: PartRef[], field: string, trx: Trx = db()): Promise<PartNumberRow[]> {
  if (refs.length === 0) return [];
  const rows: PartNumberRow[] = await trx(PartNumbers)
    .whereIn("part_number", [...new Set(refs.map((ref) => ref.partNumber))])
    .select("id", "part_number", "cage", "description");
  const fields: Record<string, string> = {};
  const resolved = refs.map((ref, index) => {
    const matches = rows.filter((row) => row.part_number === ref.partNumber && (!ref.cage || row.cage === ref.cage));
    const key = `${field}.${index}.partNumber`;
    if (matches.length === 0) {
      fields[key] = `${ref.partNumber}${ref.cage ? ` (CAGE ${ref.cage})` : ""} is not in the catalog.`;
    } else if (matches.length > 1) {
      fields[key] = `${ref.partNumber} is in the catalog under CAGE ${matches.map((m) => m.cage).join(" and ")}; name the CAGE as well.`;
    }
    return matches[0];
  });
  if (Object.keys(fields).length) throw new AppError("invalid", Object.values(fields).join(" "), "invalid", fields);
  return resolved;
}

/** How many positions, across every aircraft type, list this part number as eligible. */
export async function countEligiblePositions(partNumberId: number, trx: Trx = db()): Promise<number> {
  const [{ count }] = await trx("position_eligibility").where({ part_number_id: partNumberId }).count({ count: "*" });
  return Number(count);
}
