// Shared by the receiving and stock suites: a real (minimal, valid) PDF made at test time, a receipt
// posted through the real multipart API, and direct access to the S3 fake for checks and tampering.
import { randomBytes } from "node:crypto";
import { ListObjectsV2Command, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { http, testEnv } from "../support/api";

/** A one-page PDF 1.4 with a text line, its cross-reference offsets computed so readers accept it. */
export function minimalPdf(text: string): Buffer {
  const safe = text.replace(/[()\\]/g, (c) => `\\${c}`);
  const stream = `BT /F1 14 Tf 56 760 Td (${safe}) Tj ET`;
  const objects = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Resources << /Font << /F1 4 0 R >> >> /Contents 5 0 R >>",
    "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>",
    `<< /Length ${Buffer.byteLength(stream)} >>\nstream\n${stream}\nendstream`,
  ];
  let body = "%PDF-1.4\n%\xE2\xE3\xCF\xD3\n";
  const offsets: number[] = [];
  objects.forEach((object, i) => {
    offsets.push(Buffer.byteLength(body, "latin1"));
    body += `${i + 1} 0 obj\n${object}\nendobj\n`;
  });
  const xrefAt = Buffer.byteLength(body, "latin1");
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const offset of offsets) body += `${String(offset).padStart(10, "0")} 00000 n \n`;
  body += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xrefAt}\n%%EOF\n`;
  return Buffer.from(body, "latin1");
}

/** The first bytes of a Linux executable (ELF) and of a Windows one (MZ), padded out. */
export const elfExecutable = () => Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(4096, 0x90)]);
export const mzExecutable = () => Buffer.concat([Buffer.from("MZ\x90\x00\x03\x00\x00\x00", "latin1"), Buffer.alloc(4096, 0x00)]);

// Each suite file evaluates this module afresh, so a random run tag keeps serials apart across files.
const runTag = randomBytes(3).toString("hex").toUpperCase();
let counter = 0;
/** A serial and tracking number no other test in this run uses. */
export function uniqueSuffix(prefix: string): string {
  counter += 1;
  return `${prefix}${runTag}${String(counter).padStart(3, "0")}`;
}

/** Fields of a complete, valid receipt of an electric brake actuator (invented catalog data). */
export function receiptFields(overrides: Record<string, string | undefined> = {}): Record<string, string> {
  const serial = uniqueSuffix("RCV");
  const fields: Record<string, string | undefined> = {
    partNumber: "QF-3242-50",
    cage: "Q4B22",
    serialNumber: serial,
    quantity: "1",
    formType: "easa_form_1",
    statusWork: "repaired",
    trackingNumber: `TRK-${serial}`,
    issuerName: "Quillfeather Component Shop",
    issuerApproval: "QA.145.0012",
    issuedOn: new Date(Date.now() - 10 * 86_400_000).toISOString().slice(0, 10),
    remarks: "Repaired per CMM 32-42-50, bench tested.",
    tsn: "4210:30",
    csn: "2875",
    tso: "",
    cso: "",
    bin: "S1-B4",
    certificateMatches: "true",
    ...overrides,
  };
  return Object.fromEntries(Object.entries(fields).filter((entry): entry is [string, string] => entry[1] !== undefined));
}

export interface Upload {
  bytes: Buffer;
  name: string;
  type: string;
}

export const pdfUpload = (text = "Authorised release certificate (test)"): Upload => ({ bytes: minimalPdf(text), name: "certificate.pdf", type: "application/pdf" });

/** POST /api/receipts as multipart, as the browser form sends it. */
export function postReceipt(cookie: string, fields: Record<string, string>, file: Upload | null = pdfUpload()) {
  const request = http().post("/api/receipts").set("cookie", cookie);
  for (const [name, value] of Object.entries(fields)) request.field(name, value);
  if (file) request.attach("certificate", file.bytes, { filename: file.name, contentType: file.type });
  return request;
}

/** A multipart movement (the return from repair carries its certificate). */
export function postMultipartMovement(cookie: string, partId: number, fields: Record<string, string>, file: Upload | null = pdfUpload()) {
  const request = http().post(`/api/parts/${partId}/movements`).set("cookie", cookie);
  for (const [name, value] of Object.entries(fields)) request.field(name, value);
  if (file) request.attach("certificate", file.bytes, { filename: file.name, contentType: file.type });
  return request;
}

let s3Client: S3Client | null = null;
export function testS3(): S3Client {
  const env = testEnv();
  s3Client ??= new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    forcePathStyle: true,
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return s3Client;
}

export async function certificateObjectKeys(): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const page = await testS3().send(new ListObjectsV2Command({ Bucket: testEnv().S3_BUCKET, Prefix: "certificates/", ContinuationToken: token }));
    keys.push(...(page.Contents ?? []).map((o) => o.Key!));
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys;
}

/** Replaces a stored object behind the app's back, as a tamperer with storage access would. */
export async function overwriteObject(key: string, bytes: Buffer, contentType = "application/pdf"): Promise<void> {
  await testS3().send(new PutObjectCommand({ Bucket: testEnv().S3_BUCKET, Key: key, Body: bytes, ContentType: contentType }));
}

/** supertest leaves binary bodies unparsed unless told to collect them. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function binaryParser(res: any, callback: (error: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on("data", (chunk: Buffer) => chunks.push(chunk));
  res.on("end", () => callback(null, Buffer.concat(chunks)));
  res.on("error", (error: Error) => callback(error, Buffer.alloc(0)));
}
