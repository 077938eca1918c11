import { z } from "zod";
import { cyclesField, flightTimeField, instantField } from "./common";

export const UtilizationSchema = z.object({
  asOf: instantField,
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
