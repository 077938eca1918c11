import { ROLES } from "@/lib/roles";
import { PartSearchSchema } from "@/lib/schemas/aircraft";
import { readQuery, route } from "@/server/http";
import { searchParts } from "@/server/parts";

// GET /api/parts?q= - serialised units whose serial or part number starts with q
export const GET = route(ROLES, async ({ req }) => {
  const { q } = readQuery(req, PartSearchSchema);
  const parts = await searchParts(q);
  return { parts: parts.map((p) => ({ id: p.id, partNumber: p.partNumber, serialNumber: p.serialNumber, cage: p.cage, description: p.description, status: p.status, tsn: p.tsn, csn: p.csn, location: p.location })) };
});
