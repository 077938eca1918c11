import { AREA_ROLES } from "@/lib/roles";
import { TraceSearchSchema } from "@/lib/schemas/trace";
import { readQuery, route } from "@/server/http";
import { findSerials } from "@/server/trace";

// GET /api/trace?serial=&partNumber=&cage= - every unit with that serial (several are listed, never guessed)
export const GET = route(AREA_ROLES.trace, async ({ req }) => {
  const search = readQuery(req, TraceSearchSchema);
  return { matches: await findSerials(search) };
});
