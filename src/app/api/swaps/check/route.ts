import { SwapCheckSchema } from "@/lib/schemas/swaps";
import { readJson, route } from "@/server/http";
import { checkSwap } from "@/server/swaps";
import { SWAP_SIGNERS } from "../route";

// POST /api/swaps/check - the pre-install checks for a planned swap; writes nothing
export const POST = route(SWAP_SIGNERS, async ({ req }) => {
  return checkSwap(await readJson(req, SwapCheckSchema));
});
