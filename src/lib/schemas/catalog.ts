// The catalog's one schema file: shared by the forms, the server actions, the route handlers and the
// CSV import (in the browser and on the server), so every door checks a part number the same way.
import { z } from "zod";
import { DomainInputError } from "@/domain/errors";
import { parseFlightTime } from "@/domain/flight-time";

/** iSpec 2200 chapter-section, with an optional subject: 32-42 or 32-42-01. */
export const ATA_CHAPTER = /^\d{2}-\d{2}(-\d{2})?$/;
/** A filter may name a whole chapter (32) or a chapter-section (32-42). */
export const ATA_FILTER = /^\d{2}(-\d{2}(-\d{2})?)?$/;
// Letters, digits and the separators part markings use; ":", "@" and ";" stay free for the alternates syntax.
const PART_NUMBER = /^[A-Z0-9][A-Z0-9./-]*$/;
// A CAGE code is five letters or digits (the 17V data identifier carries it as an5: MH10.8.2 SIDI list).
const CAGE = /^[A-Z0-9]{5}$/;

export const MAX_HOURS = 10_000_000;
export const MAX_CYCLES = 10_000_000;
export const MAX_DAYS = 36_600;

export const partNumberField = z
  .string({ error: "Enter the part number." })
  .trim()
  .toUpperCase()
  .min(1, { error: "Enter the part number." })
  .max(40, { error: "A part number has at most 40 characters." })
  .regex(PART_NUMBER, { error: "Use letters, digits, '-', '/' and '.' only, starting with a letter or digit." });

export const cageField = z
  .string({ error: "Enter the CAGE or manufacturer code." })
  .trim()
  .toUpperCase()
  .regex(CAGE, { error: "A CAGE or manufacturer code is exactly 5 letters or digits, like Q4B22." });

export const ataChapterField = z
  .string({ error: "Enter the ATA chapter-section, like 32-42." })
  .trim()
  .regex(ATA_CHAPTER, { error: "Write the ATA chapter as chapter-section, like 32-42 (or 32-42-01)." });

/** Flight time in: "H:MM" or decimal hours; out: whole minutes. Blank or null clears it; absent leaves it. */
const flightTimeField = (label: string) =>
  z
    .union([z.string(), z.number(), z.null()], { error: `${label}: enter H:MM or decimal hours.` })
    .optional()
    .transform((value, ctx): number | null | undefined => {
      if (value === undefined) return undefined;
      if (value === null || (typeof value === "string" && value.trim() === "")) return null;
      try {
        const minutes = parseFlightTime(value);
        if (minutes === 0) throw new DomainInputError("must be more than 0:00; leave it empty when there is no limit.");
        if (minutes > MAX_HOURS * 60) throw new DomainInputError(`must be at most ${MAX_HOURS.toLocaleString("en")} hours.`);
        return minutes;
      } catch (error) {
        const detail = error instanceof DomainInputError ? error.message : String(error);
        ctx.issues.push({ code: "custom", input: value, message: `${label} ${detail.replace(/^Flight time /, "")}` });
        return z.NEVER;
      }
    });

const wholeNumberField = (label: string, max: number) =>
  z
    .number({ error: `${label}: enter a whole number.` })
    .int({ error: `${label}: enter a whole number.` })
    .min(1, { error: `${label}: must be at least 1; leave it empty when there is no limit.` })
    .max(max, { error: `${label}: must be at most ${max.toLocaleString("en")}.` })
    .nullable()
    .optional();

export const DIRECTIONS = ["one-way", "two-way"] as const;
export type AlternateDirection = (typeof DIRECTIONS)[number];

/** A reference to a catalog entry; the CAGE is needed only when the part number exists under several. */
export const PartRefSchema = z.object({ partNumber: partNumberField, cage: cageField.optional() });
export type PartRef = z.infer<typeof PartRefSchema>;

/**
 * An alternate of part number A: `one-way` means this alternate may replace A, not the reverse;
 * `two-way` means either may replace the other.
 */
export const AlternateInputSchema = PartRefSchema.extend({
  direction: z.enum(DIRECTIONS, { error: 'Direction is "one-way" or "two-way".' }),
});
export type AlternateInput = z.infer<typeof AlternateInputSchema>;

const PartNumberFields = z.object({
  partNumber: partNumberField,
  cage: cageField,
  description: z
    .string({ error: "Enter a description." })
    .trim()
    .min(1, { error: "Enter a description." })
    .max(200, { error: "A description has at most 200 characters." }),
  ataChapter: ataChapterField,
  serialised: z.boolean({ error: "Serialised is yes or no." }).optional(),
  lifeLimitHours: flightTimeField("Life limit hours"),
  lifeLimitCycles: wholeNumberField("Life limit cycles", MAX_CYCLES),
  lifeLimitDays: wholeNumberField("Life limit days", MAX_DAYS),
  overhaulHours: flightTimeField("Overhaul interval hours"),
  overhaulCycles: wholeNumberField("Overhaul interval cycles", MAX_CYCLES),
  alternates: z.array(AlternateInputSchema, { error: "Alternates are a list." }).max(50, { error: "At most 50 alternates." }).optional(),
});

type LimitFields = { serialised?: boolean } & Partial<
  Record<"lifeLimitHours" | "lifeLimitCycles" | "lifeLimitDays" | "overhaulHours" | "overhaulCycles", number | null>
>;

/**
 * Each unit's life and time since overhaul can only be followed by its serial number, so a part number
 * with a life limit or an overhaul interval must be serialised (14 CFR 43.10 asks for the S/N on the
 * tag of a removed life-limited part: from memory, trade-facts.md section 3).
 */
export function limitsNeedSerialProblem(values: LimitFields): string | null {
  const hasLimit = [values.lifeLimitHours, values.lifeLimitCycles, values.lifeLimitDays, values.overhaulHours, values.overhaulCycles].some(
    (value) => value !== null && value !== undefined,
  );
  return hasLimit && values.serialised === false
    ? "A part number with a life limit or overhaul interval must be serialised, so each unit's times can be followed."
    : null;
}

export const CreatePartNumberSchema = PartNumberFields.superRefine((values, ctx) => {
  const problem = limitsNeedSerialProblem(values);
  if (problem) ctx.addIssue({ code: "custom", path: ["serialised"], message: problem });
});
export type CreatePartNumberInput = z.infer<typeof CreatePartNumberSchema>;

/** A PATCH: every field optional; null clears a limit. The serialised rule is checked on the merged record. */
export const UpdatePartNumberSchema = PartNumberFields.partial();
export type UpdatePartNumberInput = z.infer<typeof UpdatePartNumberSchema>;

export const PartNumberListQuerySchema = z.object({
  q: z.string().trim().max(100, { error: "Search for at most 100 characters." }).optional(),
  ata: z
    .string()
    .trim()
    .regex(ATA_FILTER, { error: "Filter by a chapter (32) or chapter-section (32-42)." })
    .optional()
    .or(z.literal("").transform(() => undefined)),
  sort: z.enum(["partNumber", "cage", "description", "ataChapter"], { error: "Sort by partNumber, cage, description or ataChapter." }).optional(),
  dir: z.enum(["asc", "desc"], { error: "dir is asc or desc." }).optional(),
  limit: z.coerce.number({ error: "limit is a whole number." }).int().min(1).max(500, { error: "limit is at most 500." }).optional(),
  offset: z.coerce.number({ error: "offset is a whole number." }).int().min(0).optional(),
});
export type PartNumberListQuery = z.infer<typeof PartNumberListQuerySchema>;

/** Alternate links as read back: the other part number and how the two may replace each other. */
export interface AlternateView {
  id: number;
  partNumber: string;
  cage: string;
  description: string;
  direction: AlternateDirection;
}

export interface PartNumberView {
  id: number;
  partNumber: string;
  cage: string;
  description: string;
  ataChapter: string;
  serialised: boolean;
  lifeLimitHours: string | null;
  lifeLimitCycles: number | null;
  lifeLimitDays: number | null;
  overhaulHours: string | null;
  overhaulCycles: number | null;
  /** Part numbers that may be fitted in place of this one. */
  alternates: AlternateView[];
  /** Part numbers this one may be fitted in place of. */
  replaces: AlternateView[];
}
