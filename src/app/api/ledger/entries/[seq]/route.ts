import { z } from "zod";
import { AREA_ROLES } from "@/lib/roles";
import { notFound } from "@/server/errors";
import { route } from "@/server/http";
import { getEntryHash } from "@/server/ledger-verify";

const seqParam = z.coerce.number({ error: "A seq is a whole number." }).int({ error: "A seq is a whole number." }).positive({ error: "A seq is a whole number." });

// GET /api/ledger/entries/{seq} - one entry's stored hash, to check a printed trace report against
export const GET = route<{ seq: string }>(AREA_ROLES.ledger, async ({ params }) => {
  const parsed = seqParam.safeParse(params.seq);
  if (!parsed.success) throw new z.ZodError(parsed.error.issues.map((issue) => ({ ...issue, path: ["seq"] })));
  const entry = await getEntryHash(parsed.data);
  if (!entry) throw notFound(`Ledger entry seq ${parsed.data}`);
  return { entry };
});
