import { NextResponse } from "next/server";
import { ROLES } from "@/lib/roles";
import { CreateAircraftTypeSchema } from "@/lib/schemas/layouts";
import { readJson, route } from "@/server/http";
import { createAircraftType, listAircraftTypes } from "@/server/layouts";

// GET /api/layouts - the aircraft types, with how many positions each layout has
export const GET = route(ROLES, async () => ({ types: await listAircraftTypes() }));

// POST /api/layouts - add an aircraft type with an empty layout (409 when the code exists)
export const POST = route(["admin"], async ({ req }) => {
  const type = await createAircraftType({ input: await readJson(req, CreateAircraftTypeSchema) });
  return NextResponse.json({ type }, { status: 201 });
});
