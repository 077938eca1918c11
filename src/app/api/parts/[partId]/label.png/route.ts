import { z } from "zod";
import { ROLES } from "@/lib/roles";
import { route, readQuery } from "@/server/http";
import { LABEL_SYMBOLS, labelMessage, renderLabelPng } from "@/server/label-symbols";
import { getPartLabel } from "@/server/stock";

const partIdParam = z.coerce.number({ error: "A part id is a whole number." }).int().positive();
const LabelPngQuery = z.object({
  symbol: z.enum(LABEL_SYMBOLS, { error: `symbol must be one of: ${LABEL_SYMBOLS.join(", ")}.` }).default("datamatrix"),
  scale: z.coerce.number({ error: "scale is a whole number of pixels per module, 1 to 12." }).int().min(1).max(12).default(4),
});

// GET /api/parts/{id}/label.png?symbol=datamatrix|code128&scale= - the unit's label symbol as PNG (ISO/IEC 15434 P/N, S/N, CAGE)
export const GET = route<{ partId: string }>(ROLES, async ({ req, params }) => {
  const part = await getPartLabel(partIdParam.parse(params.partId));
  const { symbol, scale } = readQuery(req, LabelPngQuery);
  const png = await renderLabelPng(symbol, labelMessage(part), scale);
  const fileName = `label-${part.partNumber}-${part.serialNumber}-${symbol}`.replace(/[^A-Za-z0-9-]+/g, "-");
  return new Response(new Uint8Array(png), {
    headers: {
      "Content-Type": "image/png",
      "Content-Length": String(png.byteLength),
      "Cache-Control": "private, max-age=300",
      "Content-Disposition": `inline; filename="${fileName}.png"`,
    },
  });
});
