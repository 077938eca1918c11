import { ROLES } from "@/lib/roles";
import { countOpenFindingsByAircraft, listFleet } from "@/server/aircraft";
import { route } from "@/server/http";

// GET /api/aircraft - the fleet with each aircraft's latest hours and cycles
export const GET = route(ROLES, async () => {
  const [fleet, findings] = await Promise.all([listFleet(), countOpenFindingsByAircraft()]);
  return {
    aircraft: fleet.map((a) => ({
      registration: a.registration,
      type: a.type,
      typeName: a.typeName,
      msn: a.msn,
      station: a.station,
      hours: a.hours,
      cycles: a.cycles,
      asOf: a.asOf,
      openFindings: findings.get(a.id) ?? 0,
    })),
  };
});
