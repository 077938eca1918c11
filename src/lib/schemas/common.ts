import { z } from "zod";
import { parseFlightTime } from "@/domain/flight-time";

/** Flight time as the API takes it: "H:MM" or decimal hours; becomes integer minutes. */
export const flightTimeField = z.union([z.string(), z.number()], { error: 'Give flight time as "H:MM" or decimal hours.' }).transform((value, ctx) => {
  try {
    return parseFlightTime(value);
  } catch (error) {
    ctx.addIssue({ code: "custom", message: error instanceof Error ? error.message : "not a flight time" });
    return z.NEVER;
  }
});

export const cyclesField = z
  .number({ error: "Cycles must be a whole number." })
  .int({ error: "Cycles must be a whole number." })
  .min(0, { error: "Cycles cannot be negative." })
  .max(2_000_000_000, { error: "Cycles are out of range." });

/** An ISO 8601 instant with a zone (Z or an offset). */
export const instantField = z.iso.datetime({ offset: true, error: "Give an ISO 8601 instant with a time zone, e.g. 2026-11-30T08:15:00Z." }).transform((value) => new Date(value));

export const registrationParam = z
  .string()
  .trim()
  .min(2)
  .max(16)
  .regex(/^[A-Za-z0-9-]+$/, { error: "A registration holds letters, digits and hyphens only." })
  .transform((value) => value.toUpperCase());
