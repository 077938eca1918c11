import { ROLES } from "@/lib/roles";
import { LayoutQuerySchema } from "@/lib/schemas/layouts";
import { readQuery, route } from "@/server/http";
import { getLayout } from "@/server/layouts";

// GET /api/layouts/{typeCode} - the positions of one aircraft type, optionally filtered by zone or ATA chapter
export const GET = route<{ typeCode: string }>(ROLES, async ({ req, params }) => {
  return { ...(await getLayout(params.typeCode, readQuery(req, LayoutQuerySchema))) };
});
