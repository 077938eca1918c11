import { ROLES } from "@/lib/roles";
import { listFleet } from "@/server/aircraft";
import { route } from "@/server/http";

// GET /api/aircraft - the fleet with each aircraft's latest hours and cycles
export const GET = route(ROLES, async () => {
  const fleet = await listFleet();
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
    })),
  };
});
