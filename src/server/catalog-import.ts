import "server-only";
import type { CreatePartNumberInput } from "@/lib/schemas/catalog";
import { CSV_COLUMNS, validateCsvRecord, type CsvRowError } from "@/lib/schemas/catalog-csv";
import { isDuplicateKey, PartInterchange, PartNumbers, type PartNumberRow } from "./catalog";
import { partNumberColumns } from "./catalog-write";
import { db } from "./db";

interface Candidate {
  row: number;
  input: CreatePartNumberInput;
  key: string;
}
interface Target {
  key: string;
  id?: number; // set for catalog entries; rows of this import get theirs on insert
  row?: number;
}
interface Link {
  from: string;
  to: string;
  twoWay: boolean;
  row: number;
}

const keyOf = (partNumber: string, cage: string) => `${partNumber}\u0000${cage}`;
const shown = (key: string) => key.replace("\u0000", " (CAGE ") + ")";
const COLUMN_ORDER = new Map<string, number>(CSV_COLUMNS.map((column, index) => [column, index]));

export interface ImportResult {
  accepted: number;
  rejected: CsvRowError[];
}

/**
 * Imports catalog rows (keyed by CSV column). Every row is all or nothing: a row is written with its
 * alternates or not at all. Alternates may name catalog entries or other good rows of the same request;
 * rejecting one row can reject those that depend on it, so the plan is settled before anything is written,
 * and the good rows go in one transaction. A row someone else inserted meanwhile makes us plan once more.
 */
export async function importPartNumbers(records: Array<Record<string, unknown>>): Promise<ImportResult> {
  const rejected: CsvRowError[] = [];
  const candidates: Candidate[] = [];
  // Part numbers of refused rows, so a row that names one as its alternate can say where it went.
  const refusedRowOf = new Map<string, number>();
  records.forEach((record, index) => {
    const row = typeof record.row === "number" && Number.isSafeInteger(record.row) && record.row > 0 ? record.row : index + 1;
    const result = validateCsvRecord(record);
    if (result.ok) {
      candidates.push({ row, input: result.value, key: keyOf(result.value.partNumber, result.value.cage) });
    } else {
      rejected.push(...result.errors.map((error) => ({ row, ...error })));
      if (typeof record.part_number === "string") refusedRowOf.set(record.part_number.trim().toUpperCase(), row);
    }
  });

  for (let attempt = 1; ; attempt++) {
    try {
      const planned = await planAndWrite(candidates, new Map(refusedRowOf));
      return { accepted: planned.accepted, rejected: sortErrors([...rejected, ...planned.rejected]) };
    } catch (error) {
      if (!isDuplicateKey(error) || attempt === 2) throw error;
    }
  }
}

async function planAndWrite(all: Candidate[], rejectedRowOf: Map<string, number>): Promise<ImportResult> {
  const names = new Set(all.flatMap((c) => [c.input.partNumber, ...(c.input.alternates ?? []).map((a) => a.partNumber)]));
  const catalog = await catalogEntries([...names]);
  const rejected: CsvRowError[] = [];
  const pending = new Map<string, Candidate>();
  const reject = (candidate: Candidate, field: string, message: string) => {
    rejected.push({ row: candidate.row, field, message });
    rejectedRowOf.set(candidate.input.partNumber, candidate.row);
    if (pending.get(candidate.key) === candidate) pending.delete(candidate.key);
  };

  for (const candidate of all) {
    const earlier = pending.get(candidate.key);
    if (catalog.has(candidate.key)) reject(candidate, "part_number", `${shown(candidate.key)} is already in the catalog; change it on its page instead.`);
    else if (earlier) reject(candidate, "part_number", `${shown(candidate.key)} is already at row ${earlier.row} of this import.`);
    else pending.set(candidate.key, candidate);
  }

  // Settle which rows can go in: rejecting a row may take away an alternate another row relied on.
  let links: Link[] = [];
  for (let settled = false; !settled; ) {
    settled = true;
    links = [];
    const linkOfPair = new Map<string, Link>();
    for (const candidate of [...pending.values()]) {
      const wanted = resolveAlternates(candidate, catalog, pending, rejectedRowOf);
      const clash = typeof wanted === "string" ? wanted : pairClash(wanted, linkOfPair);
      if (clash) {
        reject(candidate, "alternates", clash);
        settled = false;
        continue;
      }
      for (const link of wanted as Link[]) {
        const pair = pairKey(link);
        if (!linkOfPair.has(pair)) {
          linkOfPair.set(pair, link);
          links.push(link);
        }
      }
    }
  }

  const accepted = [...pending.values()];
  if (accepted.length) await writeRows(accepted, links, catalog);
  return { accepted: accepted.length, rejected };
}

const pairKey = (link: Link) => [link.from, link.to].sort().join("\u0001");

/** Two rows may both call a pair two-way; any other pair given on two rows is ambiguous. */
function pairClash(wanted: Link[], linkOfPair: Map<string, Link>): string | null {
  for (const link of wanted) {
    const other = linkOfPair.get(pairKey(link));
    if (other && !(other.twoWay && link.twoWay)) {
      return `The link between ${shown(link.from)} and ${shown(link.to)} is also given at row ${other.row}; give each link on one row only.`;
    }
  }
  return null;
}

/** The links a row asks for, or why it cannot have them. */
function resolveAlternates(
  candidate: Candidate,
  catalog: Map<string, Target>,
  pending: Map<string, Candidate>,
  rejectedRowOf: Map<string, number>,
): Link[] | string {
  const links: Link[] = [];
  for (const [index, alternate] of (candidate.input.alternates ?? []).entries()) {
    const label = `Alternate ${index + 1} (${alternate.partNumber})`;
    const known = [...catalog.keys(), ...pending.keys()].filter(
      (key) => key.startsWith(alternate.partNumber + "\u0000") && (!alternate.cage || key === keyOf(alternate.partNumber, alternate.cage)),
    );
    if (known.length === 0) {
      const row = rejectedRowOf.get(alternate.partNumber);
      return `${label} is not in the catalog${row ? `, and its own row ${row} of this import was rejected` : ""}; add it first, or leave it out of this row.`;
    }
    if (known.length > 1) {
      const cages = known.map((key) => key.split("\u0000")[1]);
      return `${label} is in the catalog under CAGE ${cages.join(" and ")}; write it as ${alternate.partNumber}@CAGE.`;
    }
    if (known[0] === candidate.key) return `${label} is this row's own part number; a part number cannot be its own alternate.`;
    if (links.some((link) => link.to === known[0])) return `${label} is listed twice in this row.`;
    links.push({ from: candidate.key, to: known[0], twoWay: alternate.direction === "two-way", row: candidate.row });
  }
  return links;
}

async function catalogEntries(partNumbers: string[]): Promise<Map<string, Target>> {
  const found = new Map<string, Target>();
  for (let start = 0; start < partNumbers.length; start += 1000) {
    const rows: PartNumberRow[] = await db()(PartNumbers)
      .whereIn("part_number", partNumbers.slice(start, start + 1000))
      .select("id", "part_number", "cage");
    for (const row of rows) found.set(keyOf(row.part_number, row.cage), { key: keyOf(row.part_number, row.cage), id: row.id });
  }
  return found;
}

async function writeRows(accepted: Candidate[], links: Link[], catalog: Map<string, Target>): Promise<void> {
  await db().transaction(async (trx) => {
    await trx(PartNumbers).insert(accepted.map(({ input }) => ({ serialised: true, ...partNumberColumns(input) })));
    if (links.length === 0) return;
    // Ids are read back rather than counted from the first insert id: Galera hands out interleaved ids.
    const ids = new Map([...catalog].map(([key, target]) => [key, target.id!]));
    const inserted: PartNumberRow[] = await trx(PartNumbers)
      .whereIn("part_number", [...new Set(accepted.map((c) => c.input.partNumber))])
      .select("id", "part_number", "cage");
    for (const row of inserted) ids.set(keyOf(row.part_number, row.cage), row.id);
    await trx(PartInterchange).insert(
      links.map((link) => ({ part_number_id: ids.get(link.from)!, alternate_part_number_id: ids.get(link.to)!, two_way: link.twoWay })),
    );
  });
}

function sortErrors(errors: CsvRowError[]): CsvRowError[] {
  return errors.sort((a, b) => a.row - b.row || (COLUMN_ORDER.get(a.field) ?? 99) - (COLUMN_ORDER.get(b.field) ?? 99));
}
