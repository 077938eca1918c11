// Positions of an aircraft type: shared by the position form, its server actions and the layout routes.
import { z } from "zod";
import { ATA_FILTER, ataChapterField, PartRefSchema, partNumberField } from "./catalog";

/** Map units: x from the nose (0) to the tail (1000), y across the span (0..600, 300 is the centreline). */
export const MAP_WIDTH = 1000;
export const MAP_HEIGHT = 600;

const POSITION_CODE = /^[A-Z0-9][A-Z0-9-]*$/;

const positionCodeField = (what: string) =>
  z
    .string({ error: `Enter the ${what}.` })
    .trim()
    .toUpperCase()
    .min(1, { error: `Enter the ${what}.` })
    .max(32, { error: `A ${what} has at most 32 characters.` })
    .regex(POSITION_CODE, { error: `A ${what} uses letters, digits and '-' only, like B1-EBA2.` });

const coordinate = (axis: "x" | "y", max: number, meaning: string) =>
  z
    .number({ error: `Enter ${axis} as a number from 0 to ${max} (${meaning}).` })
    .min(0, { error: `${axis} must be from 0 to ${max} (${meaning}).` })
    .max(max, { error: `${axis} must be from 0 to ${max} (${meaning}).` })
    .transform((value) => Math.round(value * 100) / 100);

/** A part number by itself, or with its CAGE when the part number exists under several. */
export const EligibleRefSchema = z
  .union([partNumberField, PartRefSchema], { error: "Name an eligible part number, or {partNumber, cage}." })
  .transform((ref) => (typeof ref === "string" ? { partNumber: ref } : ref));

const PositionFields = z.object({
  code: positionCodeField("position code"),
  label: z
    .string({ error: "Enter a label." })
    .trim()
    .min(1, { error: "Enter a label, like Brake 1 electric actuator 2." })
    .max(160, { error: "A label has at most 160 characters." }),
  parentCode: positionCodeField("parent position code").nullable().optional(),
  ataChapter: ataChapterField,
  x: coordinate("x", MAP_WIDTH, "0 at the nose, 1000 at the tail"),
  y: coordinate("y", MAP_HEIGHT, "0 and 600 at the wing tips, 300 on the centreline"),
  zone: z.string({ error: "A zone is text." }).trim().max(16, { error: "A zone has at most 16 characters." }).nullable().optional(),
  cautions: z
    .array(
      z.string({ error: "Each caution is text." }).trim().min(1, { error: "A caution line is empty." }).max(300, { error: "A caution has at most 300 characters." }),
      { error: "Cautions are a list of lines." },
    )
    .max(20, { error: "At most 20 cautions." })
    .optional(),
  requiresIndependentInspection: z.boolean({ error: "Independent inspection is yes or no." }).optional(),
  eligible: z.array(EligibleRefSchema, { error: "Eligible part numbers are a list." }).max(100, { error: "At most 100 eligible part numbers." }).optional(),
});

export const CreateAircraftTypeSchema = z.object({
  code: z
    .string({ error: "Enter the type code." })
    .trim()
    .toUpperCase()
    .min(1, { error: "Enter the type code, like QL-72." })
    .max(16, { error: "A type code has at most 16 characters." })
    .regex(POSITION_CODE, { error: "A type code uses letters, digits and '-' only, like QL-72." }),
  name: z.string({ error: "Enter the type's name." }).trim().min(1, { error: "Enter the type's name." }).max(120, { error: "A name has at most 120 characters." }),
});
export type CreateAircraftTypeInput = z.infer<typeof CreateAircraftTypeSchema>;

export const CreatePositionSchema = PositionFields;
export type CreatePositionInput = z.infer<typeof CreatePositionSchema>;

/** A PATCH: every field optional. The code may be repeated but not changed (the server checks it). */
export const UpdatePositionSchema = PositionFields.partial();
export type UpdatePositionInput = z.infer<typeof UpdatePositionSchema>;

export const LayoutQuerySchema = z.object({
  zone: z.string().trim().max(16).optional(),
  ata: z.string().trim().regex(ATA_FILTER, { error: "Filter by a chapter (32) or chapter-section (32-42)." }).optional().or(z.literal("").transform(() => undefined)),
});
export type LayoutQuery = z.infer<typeof LayoutQuerySchema>;

export interface EligibleView {
  id: number;
  partNumber: string;
  cage: string;
  description: string;
}

export interface PositionView {
  code: string;
  label: string;
  parentCode: string | null;
  ataChapter: string;
  x: number;
  y: number;
  zone: string | null;
  cautions: string[];
  requiresIndependentInspection: boolean;
  eligible: EligibleView[];
}

export interface AircraftTypeView {
  code: string;
  name: string;
  positionCount: number;
}

/** Cautions are typed one per line in the form; blank lines carry nothing. */
export function cautionLines(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter(Boolean);
}
