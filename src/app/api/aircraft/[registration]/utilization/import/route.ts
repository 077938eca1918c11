import { NextResponse } from "next/server";
import { registrationParam } from "@/lib/schemas/common";
import { UtilizationImportSchema, UtilizationSchema } from "@/lib/schemas/aircraft";
import { getAircraftOrThrow, recordUtilization } from "@/server/aircraft";
import { AppError } from "@/server/errors";
import { readJson, route, zodFields } from "@/server/http";
import { UTILIZATION_WRITERS } from "../route";

// POST /api/aircraft/{registration}/utilization/import - many snapshots (a CSV import); each row stands alone
export const POST = route<{ registration: string }>(UTILIZATION_WRITERS, async ({ req, params, user }) => {
  const registration = registrationParam.parse(params.registration);
  await getAircraftOrThrow(registration);
  const { rows } = await readJson(req, UtilizationImportSchema);
  const parsed = rows.map((row, index) => ({ index, result: UtilizationSchema.safeParse(row) }));
  // Oldest first, so a file in any order is judged the way the totals accrued.
  const valid = parsed
    .filter((p) => p.result.success)
    .map((p) => ({ index: p.index, data: p.result.data! }))
    .sort((a, b) => a.data.asOf.getTime() - b.data.asOf.getTime());
  const rejected: Array<{ row: number; field: string; message: string }> = [];
  for (const p of parsed) {
    if (!p.result.success) {
      for (const [field, message] of Object.entries(zodFields(p.result.error))) rejected.push({ row: p.index + 1, field, message });
    }
  }
  let accepted = 0;
  for (const { index, data } of valid) {
    try {
      await recordUtilization({ registration, asOf: data.asOf, minutes: data.hours, cycles: data.cycles, actorId: user.id });
      accepted++;
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      rejected.push({ row: index + 1, field: Object.keys(error.fields ?? { asOf: "" })[0], message: error.message });
    }
  }
  rejected.sort((a, b) => a.row - b.row);
  // Nothing recorded at all is a refused request, with the same per-row report.
  if (accepted === 0) {
    const first = rejected.slice(0, 3).map((r) => `row ${r.row} ${r.field}: ${r.message}`).join("; ");
    return NextResponse.json(
      { accepted, rejected, error: { code: "invalid", message: `No row was recorded. ${first}${rejected.length > 3 ? "; …" : ""}` } },
      { status: 422 },
    );
  }
  return { accepted, rejected };
});
