import { z } from "zod";
import { ROLES } from "@/lib/roles";
import { route } from "@/server/http";
import { getPartDetail } from "@/server/parts";

export const partIdParam = z.coerce.number({ error: "A part id is a whole number." }).int().positive();

// GET /api/parts/{id} - one serialised unit: status, location, times, remaining life, documents, thread
export const GET = route<{ partId: string }>(ROLES, async ({ params }) => {
  return { part: await getPartDetail(partIdParam.parse(params.partId)) };
});
