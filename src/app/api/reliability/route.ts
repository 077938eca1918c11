import { AREA_ROLES } from "@/lib/roles";
import { ReliabilityQuerySchema } from "@/lib/schemas/reliability";
import { readQuery, route } from "@/server/http";
import { getReliability } from "@/server/reliability";
import { checkClosedMonthAlerts, checkClosedMonthAlertsLater } from "@/server/reliability-alerts";

// GET /api/reliability - unit hours, removals, MTBUR, MTBF, NFF and monthly rates with alert levels for a P/N group or ATA chapter
export const GET = route(AREA_ROLES.rates, async ({ req }) => {
  const query = readQuery(req, ReliabilityQuerySchema);
  const now = new Date();
  const answer = await getReliability(query, now);
  // Alerts are checked lazily here: the asked-for group before answering (so the alert row and its
  // mail are committed when the answer arrives), every other part number afterwards (throttled).
  if (answer.partNumber) await checkClosedMonthAlerts(now, { partNumbers: [answer.partNumber] });
  checkClosedMonthAlertsLater(now);
  return { ...answer };
});
