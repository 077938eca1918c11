import { z } from "zod";
import { cyclesField, flightTimeField, instantField } from "./common";

// A few minutes of clock difference between a tablet and the server are tolerated.
const CLOCK_SLACK_MS = 5 * 60_000;

export const UtilizationSchema = z.object({
  asOf: instantField.refine((date) => date.getTime() <= Date.now() + CLOCK_SLACK_MS, { error: "A snapshot cannot be dated in the future." }),
  hours: flightTimeField,
  cycles: cyclesField,
});
export type UtilizationInput = z.input<typeof UtilizationSchema>;

export const UtilizationImportSchema = z.object({
  rows: z.array(z.unknown()).min(1, { error: "Send at least one row." }).max(2000, { error: "Send at most 2,000 rows at a time." }),
});

export const PartSearchSchema = z.object({
  q: z.string().trim().min(1, { error: "Type at least one character of a serial or part number." }).max(40),
});
