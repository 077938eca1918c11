import { ROLES } from "@/lib/roles";
import { UpdatePositionSchema } from "@/lib/schemas/layouts";
import { notFound } from "@/server/errors";
import { readJson, route } from "@/server/http";
import { findPosition, updatePosition } from "@/server/layouts";

type Params = { typeCode: string; code: string };

// GET /api/layouts/{typeCode}/positions/{code} - one position with its cautions and eligible part numbers
export const GET = route<Params>(ROLES, async ({ params }) => {
  const position = await findPosition(params.typeCode, params.code);
  if (!position) throw notFound(`Position ${params.code} on ${params.typeCode}`);
  return { position };
});

// PATCH /api/layouts/{typeCode}/positions/{code} - change a position; `eligible` replaces its eligible part numbers
export const PATCH = route<Params>(["admin"], async ({ req, params }) => {
  const input = await readJson(req, UpdatePositionSchema);
  return { position: await updatePosition({ typeCode: params.typeCode, code: params.code, input }) };
});
