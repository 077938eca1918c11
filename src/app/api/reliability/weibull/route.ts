import { AREA_ROLES } from "@/lib/roles";
import { WeibullQuerySchema } from "@/lib/schemas/reliability";
import { readQuery, route } from "@/server/http";
import { getWeibull } from "@/server/reliability";

// GET /api/reliability/weibull - Weibull fit of time on wing for a P/N group: failures, suspensions, beta, eta, plot points
export const GET = route(AREA_ROLES.rates, async ({ req }) => {
  const query = readQuery(req, WeibullQuerySchema);
  return { ...(await getWeibull(query)) };
});
