import { AREA_ROLES } from "@/lib/roles";
import { ReliabilityQuerySchema } from "@/lib/schemas/reliability";
import { readQuery, route } from "@/server/http";
import { getReliability } from "@/server/reliability";
import { checkClosedMonthAlertsLater } from "@/server/reliability-alerts";

// GET /api/reliability - unit hours, removals, MTBUR, MTBF, NFF and monthly rates with alert levels for a P/N group or ATA chapter
export const GET = route(AREA_ROLES.rates, async ({ req }) => {
  const query = readQuery(req, ReliabilityQuerySchema);
  const now = new Date();
  const answer = await getReliability(query, now);
  // Closed months are checked for alerts here, lazily, after the answer is computed (not awaited).
  checkClosedMonthAlertsLater(now);
  return { ...answer };
});
