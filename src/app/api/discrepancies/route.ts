import { NextResponse } from "next/server";
import { DiscrepancySchema } from "@/lib/schemas/discrepancies";
import { reportDiscrepancy } from "@/server/discrepancies";
import { readJson, route } from "@/server/http";

// POST /api/discrepancies - report that a position holds a different unit than the record says
export const POST = route(["technician", "inspector"], async ({ req, user }) => {
  const input = await readJson(req, DiscrepancySchema);
  return NextResponse.json(await reportDiscrepancy({ ...input, actor: user }), { status: 201 });
});
