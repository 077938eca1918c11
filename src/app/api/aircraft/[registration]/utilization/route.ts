import { NextResponse } from "next/server";
import { registrationParam } from "@/lib/schemas/common";
import { UtilizationSchema } from "@/lib/schemas/aircraft";
import { listUtilization, recordUtilization } from "@/server/aircraft";
import { ROLES } from "@/lib/roles";
import { readJson, route } from "@/server/http";

export const UTILIZATION_WRITERS = ["technician", "inspector", "admin"] as const;

// GET /api/aircraft/{registration}/utilization - the latest snapshots, newest first
export const GET = route<{ registration: string }>(ROLES, async ({ params }) => {
  return { snapshots: await listUtilization(registrationParam.parse(params.registration)) };
});

// POST /api/aircraft/{registration}/utilization - record aircraft totals as of an instant
export const POST = route<{ registration: string }>(UTILIZATION_WRITERS, async ({ req, params, user }) => {
  const registration = registrationParam.parse(params.registration);
  const input = await readJson(req, UtilizationSchema);
  const snapshot = await recordUtilization({ registration, asOf: input.asOf, minutes: input.hours, cycles: input.cycles, actorId: user.id });
  return NextResponse.json({ snapshot }, { status: 201 });
});
