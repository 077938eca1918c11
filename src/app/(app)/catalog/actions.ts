"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FormState as CatalogFormState } from "@/components/catalog/form-field";
import { CreatePartNumberSchema, PartRefSchema, UpdatePartNumberSchema } from "@/lib/schemas/catalog";
import { createPartNumber, removeAlternateLink, setAlternateLink, updatePartNumber } from "@/server/catalog-write";
import { AppError } from "@/server/errors";
import { zodFields } from "@/server/http";
import { requireUserFor } from "@/server/page-guard";


const TEXT_FIELDS = [
  "partNumber",
  "cage",
  "description",
  "ataChapter",
  "lifeLimitHours",
  "lifeLimitCycles",
  "lifeLimitDays",
  "overhaulHours",
  "overhaulCycles",
] as const;

function typedValues(formData: FormData): Record<string, string> {
  const values = Object.fromEntries(TEXT_FIELDS.map((name) => [name, String(formData.get(name) ?? "")]));
  return { ...values, serialised: formData.get("serialised") === "on" ? "on" : "" };
}

/** Form text -> the schema's input: blank limits clear, whole numbers may carry thousands separators. */
function partNumberInput(formData: FormData) {
  const text = (name: string) => String(formData.get(name) ?? "").trim();
  const whole = (name: string) => {
    const value = text(name).replace(/[,\s]/g, "");
    if (value === "") return null;
    return /^\d+$/.test(value) ? Number(value) : value;
  };
  return {
    partNumber: text("partNumber"),
    cage: text("cage"),
    description: text("description"),
    ataChapter: text("ataChapter"),
    serialised: formData.get("serialised") === "on",
    lifeLimitHours: text("lifeLimitHours") || null,
    lifeLimitCycles: whole("lifeLimitCycles"),
    lifeLimitDays: whole("lifeLimitDays"),
    overhaulHours: text("overhaulHours") || null,
    overhaulCycles: whole("overhaulCycles"),
  };
}

function refused(error: unknown, values?: Record<string, string>): CatalogFormState {
  if (error instanceof AppError) return { message: error.message, errors: error.fields, values };
  throw error;
}

export async function createPartNumberAction(_previous: CatalogFormState, formData: FormData): Promise<CatalogFormState> {
  await requireUserFor("catalog");
  const values = typedValues(formData);
  const parsed = CreatePartNumberSchema.safeParse(partNumberInput(formData));
  if (!parsed.success) return { message: "Check the fields marked below; nothing was saved.", errors: zodFields(parsed.error), values };
  let id: number;
  try {
    id = (await createPartNumber({ input: parsed.data })).id;
  } catch (error) {
    return refused(error, values);
  }
  revalidatePath("/catalog");
  redirect(`/catalog/${id}?created=1`);
}

export async function updatePartNumberAction(id: number, _previous: CatalogFormState, formData: FormData): Promise<CatalogFormState> {
  await requireUserFor("catalog");
  const values = typedValues(formData);
  const parsed = UpdatePartNumberSchema.safeParse(partNumberInput(formData));
  if (!parsed.success) return { message: "Check the fields marked below; nothing was saved.", errors: zodFields(parsed.error), values };
  try {
    await updatePartNumber({ id, input: parsed.data });
  } catch (error) {
    return refused(error, values);
  }
  revalidatePath("/catalog");
  revalidatePath(`/catalog/${id}`);
  return { message: "Saved.", ok: true };
}

const RELATIONS = ["replaces-this", "this-replaces", "two-way"] as const;

export async function setAlternateAction(id: number, _previous: CatalogFormState, formData: FormData): Promise<CatalogFormState> {
  await requireUserFor("catalog");
  const ref = PartRefSchema.safeParse({
    partNumber: String(formData.get("alternatePartNumber") ?? ""),
    cage: String(formData.get("alternateCage") ?? "") || undefined,
  });
  const relation = RELATIONS.find((r) => r === formData.get("relation"));
  const errors: Record<string, string> = {};
  if (!ref.success) errors.alternate = "Pick the alternate part number from the search results.";
  if (!relation) errors.relation = "Choose how the two part numbers may replace each other.";
  if (!ref.success || !relation) return { message: "Check the fields marked below; nothing was saved.", errors };
  try {
    await setAlternateLink({
      partNumberId: id,
      alternate: ref.data,
      direction: relation === "two-way" ? "two-way" : "one-way",
      reverse: relation === "this-replaces",
    });
  } catch (error) {
    return refused(error);
  }
  revalidatePath(`/catalog/${id}`);
  return { message: `Alternate ${ref.data.partNumber} saved.`, ok: true };
}

export async function removeAlternateAction(id: number, otherId: number): Promise<void> {
  await requireUserFor("catalog");
  try {
    await removeAlternateLink({ partNumberId: id, otherId });
  } catch (error) {
    // Already gone (another tab, a double click): the page shows the current links either way.
    if (!(error instanceof AppError && error.kind === "not_found")) throw error;
  }
  revalidatePath(`/catalog/${id}`);
}
