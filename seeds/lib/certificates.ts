// Release certificates for the demo: a small generated PDF per certificate, stored in the S3 fake
// exactly as receiving stores an upload (object key, SHA-256, size, sniffed type).
import { createHash } from "node:crypto";
import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";

export function s3FromEnv(env: NodeJS.ProcessEnv = process.env): { client: S3Client; bucket: string } {
  const client = new S3Client({
    endpoint: env.S3_ENDPOINT ?? "http://127.0.0.1:4569",
    region: env.S3_REGION ?? "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID ?? "S3RVER", secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? "S3RVER" },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return { client, bucket: env.S3_BUCKET ?? "threadline-documents" };
}

/** A minimal valid one-page PDF showing the certificate's lines (demo content, invented). */
export function demoCertificatePdf(lines: string[]): Buffer {
  const escape = (s: string) => s.replace(/[\\()]/g, (c) => `\\${c}`);
  const text = lines.map((line, i) => `BT /F1 11 Tf 50 ${780 - i * 16} Td (${escape(line)}) Tj ET`).join("\n");
  const objects = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Resources << /Font << /F1 4 0 R >> >> /Contents 5 0 R >>",
    "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>",
    `<< /Length ${Buffer.byteLength(text)} >>\nstream\n${text}\nendstream`,
  ];
  let body = "%PDF-1.4\n";
  const offsets: number[] = [];
  objects.forEach((object, i) => {
    offsets.push(Buffer.byteLength(body));
    body += `${i + 1} 0 obj\n${object}\nendobj\n`;
  });
  const xref = Buffer.byteLength(body);
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, "0")} 00000 n \n`).join("")}`;
  body += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(body);
}

export async function uploadAll(items: Array<{ key: string; body: Buffer }>, concurrency = 32): Promise<void> {
  const { client, bucket } = s3FromEnv();
  let next = 0;
  await Promise.all(
    Array.from({ length: concurrency }, async () => {
      while (next < items.length) {
        const item = items[next++];
        await client.send(new PutObjectCommand({ Bucket: bucket, Key: item.key, Body: item.body, ContentType: "application/pdf" }));
      }
    }),
  );
  client.destroy();
}

export const sha256 = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");
