import { NextResponse } from "next/server";
import { AREA_ROLES } from "@/lib/roles";
import { ReceiptFieldsSchema } from "@/lib/schemas/receiving";
import { checkCertificateFile } from "@/server/documents";
import { fileField, readMultipart, textFields } from "@/server/multipart";
import { AppError } from "@/server/errors";
import { route, zodFields } from "@/server/http";
import { receivePart } from "@/server/receiving";

// POST /api/receipts - book a serialised unit in with its release certificate (multipart: fields and `certificate`)
export const POST = route(AREA_ROLES.receiving, async ({ req, user }) => {
  const form = await readMultipart(req);
  const parsed = ReceiptFieldsSchema.safeParse(textFields(form));
  const file = fileField(form, "certificate");
  // Every missing or wrong field at once, the certificate file included, so the clerk fixes them in one go.
  const fields = parsed.success ? {} : zodFields(parsed.error);
  if (!file) fields.certificate = "Attach the release certificate (PDF, JPEG or PNG).";
  if (!parsed.success || !file) {
    const message = Object.entries(fields).map(([field, problem]) => `${field}: ${problem}`).join("; ");
    throw new AppError("invalid", message, "invalid", fields);
  }
  const certificate = await checkCertificateFile(file);
  const result = await receivePart({ actor: user, fields: parsed.data, file: certificate });
  return NextResponse.json({ part: result.part, document: result.document, entries: result.entries }, { status: 201 });
});
