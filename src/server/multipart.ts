import "server-only";
import { MAX_UPLOAD_REQUEST_BYTES } from "@/lib/schemas/receiving";
import { tooLarge } from "./documents";
import { AppError } from "./errors";

/**
 * Reads a multipart body with a hard cap, so an oversized upload is refused without holding it all
 * in memory, and whatever the Content-Length claims.
 */
export async function readMultipart(req: Request, limit = MAX_UPLOAD_REQUEST_BYTES): Promise<FormData> {
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("malformed", "Send the receipt as multipart/form-data with the certificate file in the field 'certificate'.", "malformed");
  }
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > limit) throw tooLarge();
  if (!req.body) throw new AppError("malformed", "The request has no body.", "malformed");
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(value);
  }
  try {
    return await new Response(Buffer.concat(chunks), { headers: { "content-type": type } }).formData();
  } catch {
    throw new AppError("malformed", "The multipart body could not be read; send it again.", "malformed");
  }
}

/** Text fields of a multipart body as a plain object (the file fields left out). */
export function textFields(form: FormData): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const [name, value] of form.entries()) if (typeof value === "string") fields[name] = value;
  return fields;
}

/** The uploaded file in `field`, or null when none was sent (an empty file input counts as none). */
export function fileField(form: FormData, field: string): File | null {
  const value = form.get(field);
  if (value === null || typeof value === "string") return null;
  if (value.size === 0 && value.name === "") return null;
  return value;
}
