import { ROLES } from "@/lib/roles";
import { registrationParam } from "@/lib/schemas/common";
import { aircraftHeader, getPositionMap } from "@/server/aircraft";
import { route } from "@/server/http";

// GET /api/aircraft/{registration} - one aircraft with every position and what is fitted there
export const GET = route<{ registration: string }>(ROLES, async ({ params }) => {
  const { aircraft, positions } = await getPositionMap(registrationParam.parse(params.registration));
  return {
    aircraft: aircraftHeader(aircraft),
    positions,
  };
});
