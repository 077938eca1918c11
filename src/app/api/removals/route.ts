import { AREA_ROLES } from "@/lib/roles";
import { RemovalFiltersSchema, RemovalListQuerySchema } from "@/lib/schemas/reliability";
import { readQuery, route } from "@/server/http";
import { listRemovals } from "@/server/removals";

// GET /api/removals - one page of the removal history with counts, filtered and sorted on the server
export const GET = route(AREA_ROLES.removals, async ({ req }) => {
  const filters = readQuery(req, RemovalFiltersSchema);
  const page = readQuery(req, RemovalListQuerySchema);
  return { ...(await listRemovals(filters, page)) };
});
