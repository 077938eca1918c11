import { AREA_ROLES } from "@/lib/roles";
import { StockQuerySchema } from "@/lib/schemas/stock";
import { readQuery, route } from "@/server/http";
import { listStock } from "@/server/stock";

// GET /api/stock?status=&partNumber=&bin=&q=&page=&pageSize= - units held by stores, one page, with counts per status
export const GET = route(AREA_ROLES.stock, async ({ req }) => {
  return { ...(await listStock(readQuery(req, StockQuerySchema))) };
});
