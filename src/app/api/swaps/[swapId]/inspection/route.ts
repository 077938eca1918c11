import { z } from "zod";
import { route } from "@/server/http";
import { countersignSwap } from "@/server/swaps";

// POST /api/swaps/{id}/inspection - an inspector countersigns a swap that needs an independent inspection
export const POST = route<{ swapId: string }>(["inspector"], async ({ params, user }) => {
  const swapId = z.uuid({ error: "A swap id is a UUID." }).parse(params.swapId);
  return countersignSwap({ swapId, inspector: user });
});
