// The catalog CSV: its columns, the template, and how one record becomes a part number. The browser uses
// it to check a file before sending it; the import route uses it again, because the browser is not trusted.
import { z } from "zod";
import { CreatePartNumberSchema, type CreatePartNumberInput } from "./catalog";

export const CSV_COLUMNS = [
  "part_number",
  "cage",
  "description",
  "ata_chapter",
  "serialised",
  "life_limit_hours",
  "life_limit_cycles",
  "life_limit_days",
  "overhaul_hours",
  "overhaul_cycles",
  "alternates",
] as const;
export type CsvColumn = (typeof CSV_COLUMNS)[number];
export const REQUIRED_CSV_COLUMNS: readonly CsvColumn[] = ["part_number", "cage", "description", "ata_chapter"];

/** Rows per import request; the route refuses more. */
export const IMPORT_MAX_ROWS = 500;

/** The body of POST /api/part-numbers/import: records keyed by CSV column; `row` optionally numbers each. */
export const ImportRequestSchema = z.object({
  rows: z
    .array(z.record(z.string(), z.unknown(), { error: "Each row is an object keyed by CSV column." }), { error: "Send rows as a list." })
    .min(1, { error: "Send at least one row." })
    .max(IMPORT_MAX_ROWS, { error: `Send at most ${IMPORT_MAX_ROWS} rows per request; split the file into chunks.` }),
});

const FIELD_COLUMN: Record<string, CsvColumn> = {
  partNumber: "part_number",
  cage: "cage",
  description: "description",
  ataChapter: "ata_chapter",
  serialised: "serialised",
  lifeLimitHours: "life_limit_hours",
  lifeLimitCycles: "life_limit_cycles",
  lifeLimitDays: "life_limit_days",
  overhaulHours: "overhaul_hours",
  overhaulCycles: "overhaul_cycles",
  alternates: "alternates",
};

export const CSV_TEMPLATE = CSV_COLUMNS.join(",") + "\r\n";
export const CSV_EXAMPLE =
  CSV_TEMPLATE +
  [
    "EXAMPLE-2911-10,QX001,Example hydraulic pump (delete this row),29-11,yes,30000:00,,,12000,,EXAMPLE-2911-11:two-way",
    "EXAMPLE-2911-11,QX001,Example hydraulic pump with revised seals (delete this row),29-11,yes,30000:00,20000,,12000.5,,",
    "EXAMPLE-2510-01,QX002,Example cabin placard (delete this row),25-10,no,,,,,,",
  ].join("\r\n") +
  "\r\n";

export interface CsvFieldError {
  field: string;
  message: string;
}
export interface CsvRowError extends CsvFieldError {
  row: number;
}

/** Header problems stop a file before any row is read: a missing or misspelt column would lose data. */
export function checkCsvHeader(header: string[]): { columns: CsvColumn[]; problems: string[] } {
  const names = header.map((name, index) => (index === 0 ? name.replace(/^\uFEFF/, "") : name).trim().toLowerCase());
  const problems: string[] = [];
  const known = new Set<string>(CSV_COLUMNS);
  for (const name of names) {
    if (name === "") problems.push("A column has no name in the header row.");
    else if (!known.has(name)) problems.push(`Unknown column "${name}". The columns are: ${CSV_COLUMNS.join(", ")}.`);
  }
  const seen = new Set<string>();
  for (const name of names) {
    if (seen.has(name) && name !== "") problems.push(`Column "${name}" appears twice.`);
    seen.add(name);
  }
  for (const required of REQUIRED_CSV_COLUMNS) {
    if (!seen.has(required)) problems.push(`The header has no "${required}" column; it is required.`);
  }
  return { columns: names as CsvColumn[], problems };
}

const ALTERNATE_ITEM = /^([^\s:@;]+)(?:@([^\s:@;]+))?\s*:\s*(one-way|two-way)$/i;

/** `QF-3242-51:two-way;QF-3242-52@Q4B22:one-way` -> alternates; the CAGE is needed only for an ambiguous P/N. */
export function parseAlternatesCell(text: string): { alternates: Array<Record<string, string>> } | { error: string } {
  const alternates: Array<Record<string, string>> = [];
  for (const item of text.split(";").map((part) => part.trim()).filter(Boolean)) {
    const match = ALTERNATE_ITEM.exec(item);
    if (!match) {
      return { error: `"${item}" should read P/N:one-way or P/N:two-way (P/N@CAGE:two-way when the P/N has several CAGE codes).` };
    }
    alternates.push({
      partNumber: match[1],
      ...(match[2] ? { cage: match[2] } : {}),
      direction: match[3].toLowerCase(),
    });
  }
  return { alternates };
}

const YES = new Set(["yes", "y", "true", "1"]);
const NO = new Set(["no", "n", "false", "0"]);

function cell(record: Record<string, unknown>, column: CsvColumn): string {
  const value = record[column];
  if (value === null || value === undefined) return "";
  return String(value).trim();
}

/** Whole numbers may carry thousands separators ("20,000"); anything else is left for the schema to refuse. */
function wholeNumberCell(text: string): number | string | null {
  if (text === "") return null;
  const plain = /^\d{1,3}(,\d{3})+$/.test(text) ? text.replace(/,/g, "") : text;
  return /^\d+$/.test(plain) ? Number(plain) : text;
}

/**
 * One CSV record (keyed by column name; `row` may carry its row number) -> a checked part number, or the
 * problems, each naming its column. Keys that are not columns are refused rather than silently dropped.
 */
export function validateCsvRecord(
  record: Record<string, unknown>,
): { ok: true; value: CreatePartNumberInput } | { ok: false; errors: CsvFieldError[] } {
  const errors: CsvFieldError[] = [];
  const known = new Set<string>([...CSV_COLUMNS, "row"]);
  for (const key of Object.keys(record)) {
    if (!known.has(key)) errors.push({ field: key, message: `Unknown column "${key}".` });
  }

  const serialisedText = cell(record, "serialised").toLowerCase();
  let serialised: boolean | undefined;
  if (YES.has(serialisedText)) serialised = true;
  else if (NO.has(serialisedText)) serialised = false;
  else if (serialisedText !== "") errors.push({ field: "serialised", message: `Serialised is yes or no (blank means yes); got "${serialisedText}".` });

  let alternates: Array<Record<string, string>> | undefined;
  const alternatesText = cell(record, "alternates");
  if (alternatesText !== "") {
    const parsed = parseAlternatesCell(alternatesText);
    if ("error" in parsed) errors.push({ field: "alternates", message: parsed.error });
    else alternates = parsed.alternates;
  }

  const parsed = CreatePartNumberSchema.safeParse({
    partNumber: cell(record, "part_number"),
    cage: cell(record, "cage"),
    description: cell(record, "description"),
    ataChapter: cell(record, "ata_chapter"),
    serialised,
    lifeLimitHours: cell(record, "life_limit_hours") || null,
    lifeLimitCycles: wholeNumberCell(cell(record, "life_limit_cycles")),
    lifeLimitDays: wholeNumberCell(cell(record, "life_limit_days")),
    overhaulHours: cell(record, "overhaul_hours") || null,
    overhaulCycles: wholeNumberCell(cell(record, "overhaul_cycles")),
    alternates,
  });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = FIELD_COLUMN[String(issue.path[0])] ?? "row";
      const message =
        field === "alternates" && typeof issue.path[1] === "number" ? `Alternate ${issue.path[1] + 1}: ${issue.message}` : issue.message;
      if (!errors.some((error) => error.field === field)) errors.push({ field, message });
    }
  }
  if (errors.length || !parsed.success) return { ok: false, errors };
  return { ok: true, value: parsed.data };
}
