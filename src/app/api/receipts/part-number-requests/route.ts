import { NextResponse } from "next/server";
import { AREA_ROLES } from "@/lib/roles";
import { PartNumberRequestSchema } from "@/lib/schemas/receiving";
import { readJson, route } from "@/server/http";
import { requestCatalogPartNumber } from "@/server/receiving";

// POST /api/receipts/part-number-requests - ask the administrators by mail to add an unknown part number
export const POST = route(AREA_ROLES.receiving, async ({ req, user }) => {
  const request = await readJson(req, PartNumberRequestSchema);
  const result = await requestCatalogPartNumber({ actor: user, request });
  return NextResponse.json(result, { status: 202 });
});
