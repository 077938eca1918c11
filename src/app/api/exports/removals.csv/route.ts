import { AREA_ROLES } from "@/lib/roles";
import { RemovalFiltersSchema } from "@/lib/schemas/reliability";
import { streamRemovalsCsv } from "@/server/exports";
import { readQuery, route } from "@/server/http";

// Streamed as it is read: never cached, never buffered whole.
export const dynamic = "force-dynamic";

const day = (date: Date | undefined, fallback: string) => (date ? date.toISOString().slice(0, 10) : fallback);

// GET /api/exports/removals.csv - the removal history as CSV (contract header), streamed from a database cursor
export const GET = route(AREA_ROLES.removals, async ({ req }) => {
  const filters = readQuery(req, RemovalFiltersSchema);
  const body = await streamRemovalsCsv(filters);
  // `to` is exclusive inside; the file name shows the last day it covers.
  const lastDay = filters.to ? new Date(filters.to.getTime() - 1) : undefined;
  const name = `removals-${day(filters.from, "start")}-to-${day(lastDay, "now")}.csv`;
  return new Response(body, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "no-store",
      "x-content-type-options": "nosniff",
    },
  });
});
