import { z } from "zod";
import { encodePositionLabel } from "@/domain/labels";
import { ROLES } from "@/lib/roles";
import { registrationParam } from "@/lib/schemas/common";
import { getAircraftOrThrow } from "@/server/aircraft";
import { notFound } from "@/server/errors";
import { route, readQuery } from "@/server/http";
import { LABEL_SYMBOLS, renderLabelPng } from "@/server/label-symbols";
import { findPosition } from "@/server/layouts";

const positionCodeParam = z
  .string()
  .trim()
  .toUpperCase()
  .min(1, { error: "Give the position code." })
  .max(32, { error: "A position code has at most 32 characters." })
  .regex(/^[A-Z0-9][A-Z0-9-]*$/, { error: "A position code uses letters, digits and '-' only, like B2-EBA1." });
const Params = z.object({ registration: registrationParam, code: positionCodeParam });
const LabelPngQuery = z.object({
  symbol: z.enum(LABEL_SYMBOLS, { error: `symbol must be one of: ${LABEL_SYMBOLS.join(", ")}.` }).default("datamatrix"),
  scale: z.coerce.number({ error: "scale is a whole number of pixels per module, 1 to 12." }).int().min(1).max(12).default(4),
});

// GET /api/aircraft/{registration}/positions/{code}/label.png?symbol=datamatrix|code128&scale= - the position label symbol as PNG (Threadline's own TLPOS1 text)
export const GET = route<{ registration: string; code: string }>(ROLES, async ({ req, params }) => {
  const { registration, code } = Params.parse(params);
  const { symbol, scale } = readQuery(req, LabelPngQuery);
  const aircraft = await getAircraftOrThrow(registration);
  const position = await findPosition(aircraft.type, code);
  if (!position) throw notFound(`Position ${code} of ${aircraft.registration}`);
  const png = await renderLabelPng(symbol, encodePositionLabel({ registration: aircraft.registration, positionCode: position.code }), scale);
  const fileName = `position-label-${aircraft.registration}-${position.code}-${symbol}`.replace(/[^A-Za-z0-9-]+/g, "-");
  return new Response(new Uint8Array(png), {
    headers: {
      "Content-Type": "image/png",
      "Content-Length": String(png.byteLength),
      "Cache-Control": "private, max-age=300",
      "Content-Disposition": `inline; filename="${fileName}.png"`,
    },
  });
});
