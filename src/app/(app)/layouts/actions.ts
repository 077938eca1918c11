"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FormState } from "@/components/catalog/form-field";
import { cautionLines, CreateAircraftTypeSchema, CreatePositionSchema, UpdatePositionSchema } from "@/lib/schemas/layouts";
import { AppError } from "@/server/errors";
import { zodFields } from "@/server/http";
import { createAircraftType, createPosition, updatePosition } from "@/server/layouts";
import { requireUserFor } from "@/server/page-guard";

const TEXT_FIELDS = ["code", "label", "parentCode", "ataChapter", "x", "y", "zone", "cautions", "eligible"] as const;

function typedValues(formData: FormData): Record<string, string> {
  const values = Object.fromEntries(TEXT_FIELDS.map((name) => [name, String(formData.get(name) ?? "")]));
  return { ...values, requiresIndependentInspection: formData.get("requiresIndependentInspection") === "on" ? "on" : "" };
}

/** Form text -> the schema's input. A coordinate that is not a number is passed on for the schema to name. */
function positionInput(formData: FormData) {
  const text = (name: string) => String(formData.get(name) ?? "").trim();
  const coordinate = (name: string) => {
    const value = text(name);
    return value !== "" && Number.isFinite(Number(value)) ? Number(value) : value || undefined;
  };
  let eligible: unknown = [];
  try {
    eligible = JSON.parse(text("eligible") || "[]");
  } catch {
    eligible = "not a list";
  }
  return {
    code: text("code"),
    label: text("label"),
    parentCode: text("parentCode") || null,
    ataChapter: text("ataChapter"),
    x: coordinate("x"),
    y: coordinate("y"),
    zone: text("zone") || null,
    cautions: cautionLines(text("cautions")),
    requiresIndependentInspection: formData.get("requiresIndependentInspection") === "on",
    eligible,
  };
}

const CHECK_FIELDS = "Check the fields marked below; nothing was saved.";

function refused(error: unknown, values?: Record<string, string>): FormState {
  if (error instanceof AppError) return { message: error.message, errors: error.fields, values };
  throw error;
}

export async function createAircraftTypeAction(_previous: FormState, formData: FormData): Promise<FormState> {
  await requireUserFor("layouts");
  const values = { code: String(formData.get("code") ?? ""), name: String(formData.get("name") ?? "") };
  const parsed = CreateAircraftTypeSchema.safeParse(values);
  if (!parsed.success) return { message: CHECK_FIELDS, errors: zodFields(parsed.error), values };
  try {
    await createAircraftType({ input: parsed.data });
  } catch (error) {
    return refused(error, values);
  }
  revalidatePath("/layouts");
  redirect(`/layouts/${encodeURIComponent(parsed.data.code)}`);
}

export async function createPositionAction(typeCode: string, _previous: FormState, formData: FormData): Promise<FormState> {
  await requireUserFor("layouts");
  const values = typedValues(formData);
  const parsed = CreatePositionSchema.safeParse(positionInput(formData));
  if (!parsed.success) return { message: CHECK_FIELDS, errors: zodFields(parsed.error), values };
  try {
    await createPosition({ typeCode, input: parsed.data });
  } catch (error) {
    return refused(error, values);
  }
  revalidatePath(`/layouts/${typeCode}`);
  redirect(`/layouts/${encodeURIComponent(typeCode)}/${encodeURIComponent(parsed.data.code)}?created=1`);
}

export async function updatePositionAction(typeCode: string, code: string, _previous: FormState, formData: FormData): Promise<FormState> {
  await requireUserFor("layouts");
  const values = typedValues(formData);
  const parsed = UpdatePositionSchema.safeParse({ ...positionInput(formData), code });
  if (!parsed.success) return { message: CHECK_FIELDS, errors: zodFields(parsed.error), values };
  try {
    await updatePosition({ typeCode, code, input: parsed.data });
  } catch (error) {
    return refused(error, values);
  }
  revalidatePath(`/layouts/${typeCode}`);
  revalidatePath(`/layouts/${typeCode}/${code}`);
  return { message: `Position ${code} saved.`, ok: true };
}
