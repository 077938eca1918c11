import { z } from "zod";
import { AREA_ROLES } from "@/lib/roles";
import { route } from "@/server/http";
import { getPartTrace } from "@/server/trace";

const partIdParam = z.coerce.number({ error: "A part id is a whole number." }).int({ error: "A part id is a whole number." }).positive({ error: "A part id is a whole number." });

// GET /api/parts/{id}/trace - the unit's whole thread in seq order with its continuity findings
export const GET = route<{ partId: string }>(AREA_ROLES.trace, async ({ params }) => {
  const parsed = partIdParam.safeParse(params.partId);
  if (!parsed.success) throw new z.ZodError(parsed.error.issues.map((issue) => ({ ...issue, path: ["partId"] })));
  const trace = await getPartTrace(parsed.data);
  return { part: trace.part, entries: trace.entries, findings: trace.findings };
});
