// Receiving: what the stores clerk books in with a release certificate. Shared by the receiving form
// (checks before the upload starts) and POST /api/receipts (the checks that count).
import { z } from "zod";
import { parseFlightTime } from "@/domain/flight-time";

/** Largest certificate file accepted; a scan of a few pages fits well below it. */
export const MAX_CERTIFICATE_BYTES = 10 * 1024 * 1024;
/** What the whole multipart request may carry: the file plus the text fields. */
export const MAX_UPLOAD_REQUEST_BYTES = MAX_CERTIFICATE_BYTES + 256 * 1024;

export const CERTIFICATE_CONTENT_TYPES = ["application/pdf", "image/jpeg", "image/png"] as const;
export type CertificateContentType = (typeof CERTIFICATE_CONTENT_TYPES)[number];

export const FORM_TYPES = ["faa_8130_3", "easa_form_1", "national", "certificate_of_conformity"] as const;
export type FormType = (typeof FORM_TYPES)[number];
export const FORM_TYPE_LABELS: Record<FormType, string> = {
  faa_8130_3: "FAA Form 8130-3",
  easa_form_1: "EASA Form 1",
  national: "Equivalent national release certificate",
  certificate_of_conformity: "Certificate of conformity (new parts, where accepted)",
};

/** Block 11 status/work: one word for the majority of the work (Reg. (EU) 1321/2014 Annex I App. II). */
export const STATUS_WORDS = ["new", "overhauled", "repaired", "inspected_tested", "modified"] as const;
export type StatusWord = (typeof STATUS_WORDS)[number];
export const STATUS_WORD_LABELS: Record<StatusWord, string> = {
  new: "New",
  overhauled: "Overhauled",
  repaired: "Repaired",
  inspected_tested: "Inspected/tested",
  modified: "Modified",
};

const absent = (value: unknown) => value === undefined || value === null || (typeof value === "string" && value.trim() === "");

/** Required text; a missing or blank value is refused with "<label> is required." */
export const requiredText = (label: string, max: number) =>
  z.preprocess(
    (value) => (absent(value) ? undefined : value),
    z
      .string({ error: (issue) => (issue.input === undefined ? `${label} is required.` : `${label} must be text.`) })
      .trim()
      .max(max, { error: `${label} is at most ${max} characters.` }),
  );

export const optionalText = (label: string, max: number) =>
  z.preprocess(
    (value) => (absent(value) ? undefined : value),
    z.string({ error: `${label} must be text.` }).trim().max(max, { error: `${label} is at most ${max} characters.` }).optional(),
  );

export const requiredEnum = <T extends readonly [string, ...string[]]>(label: string, values: T) =>
  z.preprocess(
    (value) => (absent(value) ? undefined : value),
    z.enum(values, { error: (issue) => (issue.input === undefined ? `${label} is required.` : `${label} must be one of: ${values.join(", ")}.`) }),
  );

const flightTime = (label: string) =>
  z.union([z.string(), z.number()], { error: `${label}: give "H:MM" or decimal hours.` }).transform((value, ctx) => {
    try {
      return parseFlightTime(value);
    } catch (error) {
      ctx.addIssue({ code: "custom", message: `${label}: ${error instanceof Error ? error.message : "not a flight time"}` });
      return z.NEVER;
    }
  });

/** Flight time from a form ("H:MM" or decimal hours) or JSON (a number), as integer minutes. */
export const requiredFlightTime = (label: string) =>
  z.preprocess((value) => (absent(value) ? undefined : value), z.unknown().refine((v) => v !== undefined, { error: `${label} is required.` }).pipe(flightTime(label)));
export const optionalFlightTime = (label: string) =>
  z.preprocess((value) => (absent(value) ? undefined : value), flightTime(label).optional());

const cycles = (label: string) =>
  z
    .union([z.number(), z.string()], { error: `${label} must be a whole number.` })
    .transform((value, ctx) => {
      const text = String(value).trim().replace(/[,\s]/g, "");
      if (!/^\d{1,10}$/.test(text) || Number(text) > 2_000_000_000) {
        ctx.addIssue({ code: "custom", message: `${label} must be a whole number of cycles, 0 or more.` });
        return z.NEVER;
      }
      return Number(text);
    });
export const requiredCycles = (label: string) =>
  z.preprocess((value) => (absent(value) ? undefined : value), z.unknown().refine((v) => v !== undefined, { error: `${label} is required.` }).pipe(cycles(label)));
export const optionalCycles = (label: string) => z.preprocess((value) => (absent(value) ? undefined : value), cycles(label).optional());

/** A yes/no answer from a form ("true"/"false", "yes"/"no") or JSON (a boolean). */
export const requiredYesNo = (question: string) =>
  z.preprocess(
    (value) => {
      if (absent(value)) return undefined;
      if (typeof value === "boolean") return value;
      const text = String(value).trim().toLowerCase();
      return text === "true" || text === "yes" ? true : text === "false" || text === "no" ? false : value;
    },
    z.boolean({ error: `Answer yes or no: ${question}` }),
  );

const BIN = /^[A-Za-z0-9][A-Za-z0-9 ./-]*$/;
export const binField = requiredText("Bin", 32).pipe(z.string().regex(BIN, { error: "Bin holds letters, digits, spaces, dots, slashes and hyphens." }));
export const optionalBinField = optionalText("Bin", 32).pipe(
  z.string().regex(BIN, { error: "Bin holds letters, digits, spaces, dots, slashes and hyphens." }).optional(),
);

/** An ISO calendar date, YYYY-MM-DD. */
export const requiredDate = (label: string) =>
  z.preprocess(
    (value) => (absent(value) ? undefined : value),
    z.iso.date({ error: (issue) => (issue.input === undefined ? `${label} is required.` : `${label} must be a date, YYYY-MM-DD.`) }),
  );

/** The release certificate's own data (blocks 3, 4, 11, 12, 13/14 date): shared by receiving and return from repair. */
export const certificateFields = {
  formType: requiredEnum("Form type", FORM_TYPES),
  statusWork: requiredEnum("Status/work (block 11)", STATUS_WORDS),
  trackingNumber: requiredText("Tracking number (block 3)", 64).pipe(
    z.string().regex(/^[A-Za-z0-9][A-Za-z0-9 ./-]*$/, { error: "Tracking number holds letters, digits, spaces, dots, slashes and hyphens." }),
  ),
  issuerName: requiredText("Issuing organisation", 160),
  issuerApproval: requiredText("Approval reference", 64),
  issuedOn: requiredDate("Certificate date"),
  remarks: optionalText("Remarks (block 12)", 2000),
  certificateMatches: requiredYesNo("do the P/N and S/N on the certificate match the unit?"),
  discrepancyNote: optionalText("Discrepancy", 400),
};

const SERIAL = /^[\x21-\x7E](?:[\x20-\x7E]*[\x21-\x7E])?$/;

export const ReceiptFieldsSchema = z
  .object({
    partNumber: requiredText("Part number", 40),
    serialNumber: requiredText("Serial number", 40).pipe(z.string().regex(SERIAL, { error: "Serial number holds printable characters only." })),
    cage: optionalText("CAGE code", 5).pipe(z.string().regex(/^[A-Za-z0-9]{5}$/, { error: "A CAGE code is 5 letters or digits." }).optional()),
    quantity: z.preprocess((value) => (absent(value) ? 1 : Number(value)), z.number({ error: "Quantity must be a number." })),
    ...certificateFields,
    tsn: requiredFlightTime("TSN"),
    csn: requiredCycles("CSN"),
    tso: optionalFlightTime("TSO"),
    cso: optionalCycles("CSO"),
    bin: binField,
  })
  .superRefine((input, ctx) => {
    if (input.quantity !== 1) ctx.addIssue({ code: "custom", path: ["quantity"], message: "A serialised unit is received one at a time: quantity is 1." });
    if (input.certificateMatches === false && !input.discrepancyNote) {
      ctx.addIssue({ code: "custom", path: ["discrepancyNote"], message: "Say what differs between the certificate and the unit." });
    }
    if (input.formType === "certificate_of_conformity" && input.statusWork !== "new") {
      ctx.addIssue({ code: "custom", path: ["formType"], message: "A certificate of conformity is accepted for new parts only; a used part needs a release certificate." });
    }
    if (input.statusWork === "new" && (input.tsn !== 0 || input.csn !== 0)) {
      ctx.addIssue({ code: "custom", path: ["tsn"], message: "A new part has no time in service: TSN 0:00 and CSN 0." });
    }
    if (input.tso !== undefined && input.tso > input.tsn) ctx.addIssue({ code: "custom", path: ["tso"], message: "TSO cannot be more than TSN." });
    if (input.cso !== undefined && input.cso > input.csn) ctx.addIssue({ code: "custom", path: ["cso"], message: "CSO cannot be more than CSN." });
  });
export type ReceiptFields = z.output<typeof ReceiptFieldsSchema>;

/** The order the form shows its fields in, so a 422 can be listed the way the clerk reads the form. */
export const RECEIPT_FIELD_ORDER = [
  "partNumber",
  "cage",
  "serialNumber",
  "quantity",
  "formType",
  "statusWork",
  "trackingNumber",
  "issuerName",
  "issuerApproval",
  "issuedOn",
  "remarks",
  "tsn",
  "csn",
  "tso",
  "cso",
  "bin",
  "certificateMatches",
  "discrepancyNote",
  "certificate",
] as const;

export const PartNumberRequestSchema = z.object({
  partNumber: requiredText("Part number", 40),
  cage: optionalText("CAGE code", 5),
  note: optionalText("Note", 500),
});
export type PartNumberRequest = z.output<typeof PartNumberRequestSchema>;
