// The reliability area's one schema file: the removals filters (page, JSON route and CSV export share
// them), the rates and Weibull queries, and the shapes the routes answer with.
import { z } from "zod";

/** The export's header row, fixed by the API contract. */
export const REMOVALS_CSV_HEADER = [
  "registration",
  "aircraft_type",
  "position_code",
  "ata_chapter",
  "part_number",
  "cage",
  "serial_number",
  "removed_at",
  "removal_type",
  "reason",
  "work_order",
  "aircraft_hours",
  "aircraft_cycles",
  "hours_on_wing",
  "cycles_on_wing",
  "part_tsn",
  "part_csn",
  "installed_part_number",
  "installed_serial_number",
  "recorded_by",
] as const;

/** What the shop found on a returned unit, as recorded on its `repaired` ledger entry (details.shopFinding). */
export const SHOP_FINDINGS = ["confirmed_failure", "no_fault_found", "damage", "modification"] as const;
export type ShopFinding = (typeof SHOP_FINDINGS)[number];
export const SHOP_FINDING_LABELS: Record<ShopFinding, string> = {
  confirmed_failure: "Confirmed failure",
  no_fault_found: "No fault found",
  damage: "Damage",
  modification: "Modification",
};

export const REMOVAL_TYPES = ["scheduled", "unscheduled"] as const;
export type RemovalType = (typeof REMOVAL_TYPES)[number];

const DATE_ONLY = /^(\d{4})-(\d{2})-(\d{2})$/;
// A full instant: date, time, and a zone (Z or an offset), so it is never read in the server's zone.
const INSTANT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})$/;

/**
 * A period edge: "YYYY-MM-DD" is a whole UTC day; an ISO 8601 instant with a zone is taken as it is.
 * `from` is where the period starts; `to` is inclusive (its whole day, or up to and including the
 * instant), turned here into the exclusive end every query uses.
 */
function periodEdge(edge: "from" | "to") {
  return z
    .string()
    .trim()
    .optional()
    .transform((value, ctx): Date | undefined => {
      if (value === undefined || value === "") return undefined;
      const problem = `${edge}: give a date as YYYY-MM-DD or an ISO 8601 instant with its zone, like 2026-09-01 or 2026-09-01T00:00:00Z (got "${value.slice(0, 40)}").`;
      const day = DATE_ONLY.exec(value);
      if (day) {
        const [year, month, date] = [Number(day[1]), Number(day[2]), Number(day[3])];
        const start = new Date(Date.UTC(year, month - 1, date));
        if (start.getUTCFullYear() !== year || start.getUTCMonth() !== month - 1 || start.getUTCDate() !== date || year < 1900 || year > 2999) {
          ctx.addIssue({ code: "custom", message: problem });
          return z.NEVER;
        }
        return edge === "from" ? start : new Date(start.getTime() + 86_400_000);
      }
      const instant = INSTANT.test(value) ? new Date(value) : null;
      if (!instant || Number.isNaN(instant.getTime()) || instant.getUTCFullYear() < 1900 || instant.getUTCFullYear() > 2999) {
        ctx.addIssue({ code: "custom", message: problem });
        return z.NEVER;
      }
      return edge === "from" ? instant : new Date(instant.getTime() + 1);
    });
}

const blankToUndefined = (value: unknown) => (typeof value === "string" && value.trim() === "" ? undefined : value);
const optionalText = (label: string, max: number, pattern?: RegExp, hint?: string) =>
  z.preprocess(
    blankToUndefined,
    z
      .string()
      .trim()
      .toUpperCase()
      .max(max, { error: `${label}: at most ${max} characters.` })
      .regex(pattern ?? /^[\s\S]*$/, { error: hint ?? `${label} is not valid.` })
      .optional(),
  );

const ATA_FILTER = /^\d{2}(-\d{2}(-\d{2})?)?$/;

/** The filters of the removals report and its CSV export. */
export const RemovalFiltersSchema = z
  .object({
    from: periodEdge("from"),
    to: periodEdge("to"),
    partNumber: optionalText("partNumber", 40, /^[A-Z0-9][A-Z0-9./-]*$/, "partNumber: use letters, digits, '-', '/' and '.' only."),
    ataChapter: optionalText("ataChapter", 8, ATA_FILTER, "ataChapter: a chapter (32) or chapter-section (32-42)."),
    registration: optionalText("registration", 16, /^[A-Z0-9-]+$/, "registration: letters, digits and '-' only, like Q-FRAA."),
    aircraftType: optionalText("aircraftType", 16, /^[A-Z0-9-]+$/, "aircraftType: an aircraft type code."),
    station: optionalText("station", 8, /^[A-Z0-9]+$/, "station: a station code, like QSH."),
    removalType: z.preprocess(blankToUndefined, z.enum(REMOVAL_TYPES, { error: "removalType is scheduled or unscheduled." }).optional()),
  })
  .superRefine((value, ctx) => {
    if (value.from && value.to && value.to.getTime() <= value.from.getTime()) {
      ctx.addIssue({ code: "custom", path: ["to"], message: "to: the end of the period must not be before its start." });
    }
  });
export type RemovalFilters = z.infer<typeof RemovalFiltersSchema>;

export const REMOVAL_SORTS = ["removedAt", "registration", "partNumber", "serialNumber", "ataChapter", "removalType", "hoursOnWing", "cyclesOnWing"] as const;
export type RemovalSort = (typeof REMOVAL_SORTS)[number];

export const RemovalListQuerySchema = z.object({
  page: z.preprocess(blankToUndefined, z.coerce.number({ error: "page is a whole number." }).int({ error: "page is a whole number." }).min(1, { error: "page starts at 1." }).max(100_000).default(1)),
  pageSize: z.preprocess(blankToUndefined, z.coerce.number({ error: "pageSize is a whole number." }).int().min(1).max(200, { error: "pageSize is at most 200." }).default(50)),
  sort: z.preprocess(blankToUndefined, z.enum(REMOVAL_SORTS, { error: `sort is one of ${REMOVAL_SORTS.join(", ")}.` }).default("removedAt")),
  dir: z.preprocess(blankToUndefined, z.enum(["asc", "desc"], { error: "dir is asc or desc." }).default("desc")),
});
export type RemovalListQuery = z.infer<typeof RemovalListQuerySchema>;

/** One removal as the report shows it. Flight time is "H:MM"; instants ISO 8601 UTC. */
export interface RemovalRow {
  seq: number;
  partId: number;
  registration: string;
  aircraftType: string;
  station: string;
  positionCode: string;
  positionLabel: string;
  ataChapter: string;
  partNumber: string;
  cage: string;
  serialNumber: string;
  removedAt: string;
  removalType: RemovalType | null;
  reason: string | null;
  workOrder: string | null;
  aircraftHours: string | null;
  aircraftCycles: number | null;
  hoursOnWing: string | null;
  cyclesOnWing: number | null;
  partTsn: string | null;
  partCsn: number | null;
  installedPartNumber: string | null;
  installedSerialNumber: string | null;
  recordedBy: string;
  shopFinding: ShopFinding | null;
}

export interface RemovalListAnswer {
  removals: RemovalRow[];
  total: number;
  unscheduled: number;
  page: number;
  pageSize: number;
  sort: RemovalSort;
  dir: "asc" | "desc";
}

/** The filters as the browser keeps them: plain strings, as they appear in the address. */
export interface RemovalFilterValues {
  from?: string;
  to?: string;
  partNumber?: string;
  ataChapter?: string;
  registration?: string;
  aircraftType?: string;
  station?: string;
  removalType?: string;
}

const kField = z.preprocess(
  blankToUndefined,
  z.coerce.number({ error: "k is a number of standard deviations, like 2." }).min(0.5, { error: "k must be at least 0.5." }).max(6, { error: "k must be at most 6." }).default(2),
);
const confidenceField = z.preprocess(
  blankToUndefined,
  z.coerce.number({ error: "confidence is a fraction, like 0.9." }).gt(0.5, { error: "confidence must be above 0.5." }).lt(1, { error: "confidence must be below 1." }).default(0.9),
);

/** Subject of a rates query: a part number (with its alternates) or an ATA chapter. */
export const ReliabilityQuerySchema = z
  .object({
    partNumber: optionalText("partNumber", 40, /^[A-Z0-9][A-Z0-9./-]*$/, "partNumber: use letters, digits, '-', '/' and '.' only."),
    ataChapter: optionalText("ataChapter", 8, ATA_FILTER, "ataChapter: a chapter (32) or chapter-section (32-42)."),
    from: periodEdge("from"),
    to: periodEdge("to"),
    k: kField,
    confidence: confidenceField,
  })
  .superRefine((value, ctx) => {
    if (!value.partNumber && !value.ataChapter) {
      ctx.addIssue({ code: "custom", path: ["partNumber"], message: "partNumber: name a part number, or give an ataChapter instead." });
    }
    if (value.partNumber && value.ataChapter) {
      ctx.addIssue({ code: "custom", path: ["ataChapter"], message: "ataChapter: give a part number or an ATA chapter, not both." });
    }
    if (value.from && value.to && value.to.getTime() <= value.from.getTime()) {
      ctx.addIssue({ code: "custom", path: ["to"], message: "to: the end of the period must not be before its start." });
    }
  });
export type ReliabilityQuery = z.infer<typeof ReliabilityQuerySchema>;

const yesNo = (name: string) =>
  z.preprocess(blankToUndefined, z.enum(["true", "false"], { error: `${name} is true or false.` }).optional().transform((v) => v === "true"));

export const WeibullQuerySchema = z
  .object({
    partNumber: optionalText("partNumber", 40, /^[A-Z0-9][A-Z0-9./-]*$/, "partNumber: use letters, digits, '-', '/' and '.' only."),
    from: periodEdge("from"),
    to: periodEdge("to"),
    /** Count only shop-confirmed failures as failures (other unscheduled removals become suspensions). */
    confirmedOnly: yesNo("confirmedOnly"),
    /** Count scheduled removals as suspensions (otherwise they are left out). */
    scheduledAsSuspensions: yesNo("scheduledAsSuspensions"),
  })
  .superRefine((value, ctx) => {
    if (!value.partNumber) ctx.addIssue({ code: "custom", path: ["partNumber"], message: "partNumber: name the part number to analyse." });
    if (value.from && value.to && value.to.getTime() <= value.from.getTime()) {
      ctx.addIssue({ code: "custom", path: ["to"], message: "to: the end of the period must not be before its start." });
    }
  });
export type WeibullQuery = z.infer<typeof WeibullQuerySchema>;

export interface ReliabilityMonth {
  month: string;
  /** The month is over (alerts are raised only for closed months). */
  closed: boolean;
  unitHours: string;
  unitMinutes: number;
  removals: number;
  unscheduledRemovals: number;
  confirmedFailures: number;
  noFaultFound: number;
  /** Unscheduled removals per 1,000 unit hours (the watched rate); null with no unit hours. */
  rate: number | null;
  /** All removals per 1,000 unit hours. */
  removalRate: number | null;
  alertLevel: number | null;
  priorMonths: number;
  aboveAlert: boolean | null;
}

export interface ReliabilityAnswer {
  subject: { kind: "partNumber" | "ataChapter"; label: string };
  partNumber: string | null;
  /** The P/N and the alternates counted with it. */
  group: Array<{ partNumber: string; cage: string; description: string }>;
  ataChapter: string | null;
  from: string;
  to: string;
  k: number;
  unitHours: string;
  unitMinutes: number;
  removals: number;
  unscheduledRemovals: number;
  confirmedFailures: number;
  noFaultFound: number;
  /** Unscheduled removals with no shop finding on file yet. */
  awaitingFinding: number;
  mtbur: string | null;
  mtburHours: number | null;
  mtbf: string | null;
  mtbfHours: number | null;
  mtbfInterval: { confidence: number; lowerHours: number; upperHours: number | null } | null;
  noFaultFoundRate: number | null;
  /** Unscheduled removals per 1,000 unit hours over the period. */
  ratePer1000Hours: number | null;
  /** All removals per 1,000 unit hours over the period. */
  removalRatePer1000Hours: number | null;
  /** The alert level that applies to the last month of the period (from the 12 months before it). */
  alertLevel: number | null;
  monthsAboveAlert: string[];
  method: string;
  months: ReliabilityMonth[];
}

export interface WeibullAnswer {
  partNumber: string;
  group: string[];
  failures: number;
  suspensions: number;
  confirmedOnly: boolean;
  scheduledAsSuspensions: boolean;
  fit: { beta: number; eta: number; r2: number } | null;
  /** Why there is no fit (too few failures), when there is none. */
  message: string | null;
  points: Array<{ hours: number; medianRank: number; x: number; y: number }>;
  suspensionHours: number[];
  line: { start: { hours: number; y: number }; end: { hours: number; y: number } } | null;
}
