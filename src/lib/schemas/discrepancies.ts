import { z } from "zod";
import { registrationParam } from "./common";

const unit = z.object({ partNumber: z.string().trim().min(1).max(40), serialNumber: z.string().trim().min(1).max(40) }).passthrough();

export const DiscrepancySchema = z.object({
  registration: registrationParam,
  positionCode: z.string({ error: "Give the position code." }).trim().min(1).max(32),
  found: unit.nullable().optional(),
  note: z.string().trim().max(500).optional(),
});
