import { z } from "zod";
import { ROLES } from "@/lib/roles";
import { readVerifiedDocument } from "@/server/documents";
import { route } from "@/server/http";

const documentIdParam = z.coerce.number({ error: "A document id is a whole number." }).int().positive();

// GET /api/documents/{id} - the stored file, served only if its SHA-256 still matches the one recorded at upload
export const GET = route<{ documentId: string }>(ROLES, async ({ params, req }) => {
  const { document, bytes, fileName } = await readVerifiedDocument(documentIdParam.parse(params.documentId));
  const disposition = req.nextUrl.searchParams.get("inline") === "1" ? "inline" : "attachment";
  return new Response(new Uint8Array(bytes), {
    status: 200,
    headers: {
      "Content-Type": document.contentType,
      "Content-Length": String(bytes.byteLength),
      "Content-Disposition": `${disposition}; filename="${fileName}"`,
      "X-Content-SHA256": document.sha256,
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
});
