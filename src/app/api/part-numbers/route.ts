import { NextResponse } from "next/server";
import { ROLES } from "@/lib/roles";
import { CreatePartNumberSchema, PartNumberListQuerySchema } from "@/lib/schemas/catalog";
import { listPartNumbers } from "@/server/catalog";
import { createPartNumber } from "@/server/catalog-write";
import { readJson, readQuery, route } from "@/server/http";

// GET /api/part-numbers - search the catalog by part number or description, filter by ATA chapter
export const GET = route(ROLES, async ({ req }) => {
  const query = readQuery(req, PartNumberListQuerySchema);
  return listPartNumbers(query);
});

// POST /api/part-numbers - add a part number to the catalog (409 when the P/N and CAGE exist)
export const POST = route(["admin"], async ({ req }) => {
  const input = await readJson(req, CreatePartNumberSchema);
  const partNumber = await createPartNumber({ input });
  return NextResponse.json({ partNumber }, { status: 201 });
});
