import { AREA_ROLES } from "@/lib/roles";
import { route } from "@/server/http";
import { verifyLedger } from "@/server/ledger-verify";

export const dynamic = "force-dynamic";

// GET /api/ledger/verify - recompute the hash chain over every entry and say where it first breaks
export const GET = route(AREA_ROLES.ledger, async () => {
  return { ...(await verifyLedger()) };
});
