import { NextResponse } from "next/server";
import { CorrectionSchema, unknownCorrectionFields } from "@/lib/schemas/trace";
import { recordCorrection } from "@/server/corrections";
import { AppError } from "@/server/errors";
import { route } from "@/server/http";

/** Corrections are signed amendments of the record: an inspector's, or an administrator's. */
export const CORRECTION_SIGNERS = ["admin", "inspector"] as const;

// POST /api/ledger/corrections - append a corrected entry that restates an earlier entry and says why
export const POST = route(CORRECTION_SIGNERS, async ({ req, user }) => {
  const text = await req.text();
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new AppError("malformed", "The request body is not valid JSON.", "malformed");
  }
  const unknown = unknownCorrectionFields(raw);
  if (unknown.length) {
    throw new AppError("invalid", `These fields cannot be corrected: ${unknown.join(", ")}.`, "invalid", Object.fromEntries(unknown.map((key) => [key, "not a field a correction can restate"])));
  }
  const correction = CorrectionSchema.parse(raw);
  const result = await recordCorrection({ correction, actor: user });
  return NextResponse.json(result, { status: 201 });
});
