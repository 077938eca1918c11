import { ImportRequestSchema } from "@/lib/schemas/catalog-csv";
import { importPartNumbers } from "@/server/catalog-import";
import { readJson, route } from "@/server/http";

// POST /api/part-numbers/import - add up to 500 catalog rows; good rows are kept, bad rows reported by row and field
export const POST = route(["admin"], async ({ req }) => {
  const { rows } = await readJson(req, ImportRequestSchema);
  return { ...(await importPartNumbers(rows)) };
});
