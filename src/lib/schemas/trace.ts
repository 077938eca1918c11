import { z } from "zod";
import { cyclesField, flightTimeField, instantField, registrationParam } from "./common";

const code = (name: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, { error: `The ${name} is at most ${max} characters.` })
    .optional()
    .transform((value) => (value ? value.toUpperCase() : null));

/** GET /api/trace and the trace page's search form: an exact serial, narrowed by P/N and CAGE when given. */
export const TraceSearchSchema = z.object({
  serial: z
    .string({ error: "Give the serial number to trace." })
    .trim()
    .min(1, { error: "Give the serial number to trace." })
    .max(40, { error: "A serial number is at most 40 characters." })
    .transform((value) => value.toUpperCase()),
  partNumber: code("part number", 40),
  cage: code("CAGE code", 5),
});
export type TraceSearch = z.output<typeof TraceSearchSchema>;

const nullableText = (name: string, max: number) =>
  z
    .string({ error: `The ${name} is text or null.` })
    .trim()
    .min(1, { error: `Give the ${name}, or null for none.` })
    .max(max, { error: `The ${name} is at most ${max} characters.` })
    .nullable()
    .optional();

const nullableFlightTime = flightTimeField.nullable().optional();
const nullableCycles = cyclesField.nullable().optional();

/**
 * POST /api/ledger/corrections: the entry to correct, why, and the values that change. Values left
 * out are restated from the entry as it stands (after any earlier corrections). Check unknown
 * fields with unknownCorrectionFields first, so a misspelt field is refused, never silently ignored.
 */
export const CorrectionSchema = z.object({
    correctsSeq: z.number({ error: "Give the seq of the entry to correct." }).int({ error: "A seq is a whole number." }).positive({ error: "A seq is a whole number." }),
    reason: z
      .string({ error: "Say why the entry is corrected." })
      .trim()
      .min(5, { error: "Say why the entry is corrected (at least a few words)." })
      .max(500, { error: "The reason is at most 500 characters." }),
    occurredAt: instantField.optional(),
    registration: registrationParam.nullable().optional(),
    positionCode: z.string().trim().min(1, { error: "Give the position code, or null for none." }).max(32).nullable().optional(),
    aircraftHours: nullableFlightTime,
    aircraftCycles: nullableCycles,
    tsn: nullableFlightTime,
    csn: nullableCycles,
    tso: nullableFlightTime,
    cso: nullableCycles,
    removalType: z.enum(["scheduled", "unscheduled"], { error: "Removal type is scheduled, unscheduled or null." }).nullable().optional(),
    entryReason: nullableText("entry's own reason (e.g. the removal reason)", 400),
    workOrder: nullableText("work order", 64),
    taskReference: nullableText("task reference", 128),
    testResult: nullableText("test result", 255),
    documentId: z.number().int({ error: "A document id is a whole number." }).positive({ error: "A document id is a whole number." }).nullable().optional(),
});

export function unknownCorrectionFields(body: unknown): string[] {
  if (!body || typeof body !== "object" || Array.isArray(body)) return [];
  return Object.keys(body).filter((key) => !(key in CorrectionSchema.shape));
}
export type CorrectionInput = z.output<typeof CorrectionSchema>;
