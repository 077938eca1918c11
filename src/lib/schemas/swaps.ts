import { z } from "zod";
import { cyclesField, flightTimeField, instantField, registrationParam } from "./common";

const unitRef = z.object({
  partNumber: z.string({ error: "Give the part number." }).trim().min(1, { error: "Give the part number." }).max(40),
  serialNumber: z.string({ error: "Give the serial number." }).trim().min(1, { error: "Give the serial number." }).max(40),
  cage: z.string().trim().max(5).optional().nullable(),
});
export type UnitRef = z.infer<typeof unitRef>;

const text = (name: string, max: number) => z.string({ error: `Give the ${name}.` }).trim().min(1, { error: `Give the ${name}.` }).max(max, { error: `The ${name} is at most ${max} characters.` });

/** What the pre-install check needs: where, the snapshot, and the two units. */
export const SwapCheckSchema = z
  .object({
    registration: registrationParam,
    positionCode: z.string({ error: "Give the position code." }).trim().min(1, { error: "Give the position code." }).max(32),
    aircraftHours: flightTimeField,
    aircraftCycles: cyclesField,
    removed: unitRef.nullable(),
    installed: unitRef.nullable(),
  })
  .refine((value) => value.removed || value.installed, { path: ["installed"], message: "A swap removes a unit, installs one, or both." });
export type SwapCheckInput = z.output<typeof SwapCheckSchema>;

/** The body of POST /api/swaps (and of the pre-install check, which takes the same shape). */
export const SwapSchema = z
  .object({
    registration: registrationParam,
    positionCode: z.string({ error: "Give the position code." }).trim().min(1, { error: "Give the position code." }).max(32),
    aircraftHours: flightTimeField,
    aircraftCycles: cyclesField,
    performedAt: instantField,
    removed: unitRef.nullable(),
    installed: unitRef.nullable(),
    removalType: z.enum(["scheduled", "unscheduled"], { error: "Removal type is scheduled or unscheduled." }).nullable().optional(),
    reason: z.string().trim().max(500).nullable().optional(),
    workOrder: text("work order", 64),
    taskReference: text("maintenance manual task reference", 128),
    testResult: z.string().trim().max(255).nullable().optional(),
  })
  .superRefine((value, ctx) => {
    if (!value.removed && !value.installed) {
      ctx.addIssue({ code: "custom", path: ["installed"], message: "A swap removes a unit, installs one, or both." });
    }
    if (value.removed && !value.removalType) {
      ctx.addIssue({ code: "custom", path: ["removalType"], message: "Say whether the removal is scheduled or unscheduled." });
    }
    if (value.removed && !value.reason) {
      ctx.addIssue({ code: "custom", path: ["reason"], message: "Give the reason for the removal." });
    }
    if (value.installed && !value.testResult) {
      ctx.addIssue({ code: "custom", path: ["testResult"], message: "Give the operational test result of the installed unit." });
    }
  });
export type SwapInput = z.output<typeof SwapSchema>;

export const IdempotencyKeySchema = z
  .string({ error: "Send an Idempotency-Key header (a unique value per swap, reused on retries)." })
  .trim()
  .min(8, { error: "The Idempotency-Key header must be 8 to 128 characters." })
  .max(128, { error: "The Idempotency-Key header must be 8 to 128 characters." });
