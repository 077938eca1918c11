import { ROLES } from "@/lib/roles";
import { UpdatePartNumberSchema } from "@/lib/schemas/catalog";
import { getPartNumberOrThrow } from "@/server/catalog";
import { updatePartNumber } from "@/server/catalog-write";
import { notFound } from "@/server/errors";
import { readJson, route } from "@/server/http";

function partNumberId(raw: string): number {
  if (!/^\d{1,9}$/.test(raw)) throw notFound(`Part number ${raw}`);
  return Number(raw);
}

// GET /api/part-numbers/{id} - one part number with its limits and alternates
export const GET = route<{ id: string }>(ROLES, async ({ params }) => {
  return { partNumber: await getPartNumberOrThrow(partNumberId(params.id)) };
});

// PATCH /api/part-numbers/{id} - change a part number; `alternates` replaces the list of what may replace it
export const PATCH = route<{ id: string }>(["admin"], async ({ req, params }) => {
  const id = partNumberId(params.id);
  const input = await readJson(req, UpdatePartNumberSchema);
  return { partNumber: await updatePartNumber({ id, input }) };
});
