import { NextResponse } from "next/server";
import { z } from "zod";
import { MOVEMENT_ROLES, MovementSchema } from "@/lib/schemas/stock";
import { checkCertificateFile } from "@/server/documents";
import { fileField, readMultipart, textFields } from "@/server/multipart";
import { readJson, route } from "@/server/http";
import { assertMayRecord, recordMovement } from "@/server/stock-movements";

const partIdParam = z.coerce.number({ error: "A part id is a whole number." }).int().positive();
const MOVERS = [...new Set(Object.values(MOVEMENT_ROLES).flat())];

// POST /api/parts/{id}/movements - one stock movement {kind, ...}; "repaired" comes as multipart with the `certificate` file
export const POST = route<{ partId: string }>(MOVERS, async ({ req, params, user }) => {
  const partId = partIdParam.parse(params.partId);
  const multipart = (req.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data");
  if (!multipart) {
    const movement = await readJson(req, MovementSchema);
    const result = await recordMovement({ actor: user, partId, movement });
    return NextResponse.json(result, { status: 201 });
  }
  const form = await readMultipart(req);
  const movement = MovementSchema.parse(textFields(form));
  assertMayRecord(user, movement.kind);
  const file = fileField(form, "certificate");
  const certificate = file ? await checkCertificateFile(file) : null;
  const result = await recordMovement({ actor: user, partId, movement, certificate });
  return NextResponse.json(result, { status: 201 });
});
