import { NextResponse } from "next/server";
import { CreatePositionSchema } from "@/lib/schemas/layouts";
import { readJson, route } from "@/server/http";
import { createPosition } from "@/server/layouts";

// POST /api/layouts/{typeCode}/positions - add a position to a type's layout (409 when the code exists)
export const POST = route<{ typeCode: string }>(["admin"], async ({ req, params }) => {
  const input = await readJson(req, CreatePositionSchema);
  const position = await createPosition({ typeCode: params.typeCode, input });
  return NextResponse.json({ position }, { status: 201 });
});
