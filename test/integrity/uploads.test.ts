// Certificate uploads beyond what test/api/receipts.test.ts covers: content judged by its bytes in
// more disguises, the exact size cap, hostile file names, and stored files altered in other ways.
import { createHash } from "node:crypto";
import { DeleteObjectCommand } from "@aws-sdk/client-s3";
import { beforeAll, describe, expect, it } from "vitest";
import { MAX_CERTIFICATE_BYTES } from "../../src/lib/schemas/receiving";
import { http, signInAs, testDb, testEnv } from "../support/api";
import { binaryParser, certificateObjectKeys, minimalPdf, overwriteObject, postReceipt, receiptFields, testS3, type Upload } from "../api/receipts-fixtures";

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const png = () => Buffer.concat([PNG_SIGNATURE, Buffer.alloc(256, 0x11)]);
const sha256 = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");

let stores: string;
let auditor: string;
beforeAll(async () => {
  stores = await signInAs("stores");
  auditor = await signInAs("auditor");
});

async function refusedWithoutTrace(upload: Upload, status: number, code: string) {
  const before = await certificateObjectKeys();
  const fields = receiptFields();
  const response = await postReceipt(stores, fields, upload);
  expect(response.status, `${upload.name}: ${response.text}`).toBe(status);
  expect(response.body.error.code).toBe(code);
  expect(await certificateObjectKeys()).toEqual(before);
  expect(await testDb()("parts").where({ serial_number: fields.serialNumber }).first()).toBeUndefined();
}

describe("certificate type by content", () => {
  it("refuses files whose bytes are not PDF, JPEG or PNG whatever their name and declared type", async () => {
    const disguises: Upload[] = [
      { bytes: Buffer.from("<html><script>alert(1)</script></html>"), name: "certificate.pdf", type: "application/pdf" },
      { bytes: Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), name: "scan.png", type: "image/png" },
      { bytes: Buffer.from("PK\x03\x04 a zip archive", "latin1"), name: "certificate.pdf", type: "application/pdf" },
      { bytes: Buffer.from(" %PDF-1.4 with a leading space"), name: "certificate.pdf", type: "application/pdf" },
      { bytes: Buffer.from("%PD"), name: "short.pdf", type: "application/pdf" },
      { bytes: PNG_SIGNATURE.subarray(0, 4), name: "half.png", type: "image/png" },
    ];
    for (const upload of disguises) await refusedWithoutTrace(upload, 415, "unsupported_type");
  });

  it("stores the type the bytes show, not the one the browser declared", async () => {
    const response = await postReceipt(stores, receiptFields(), { bytes: png(), name: "scan.pdf", type: "application/pdf" });
    expect(response.status, response.text).toBe(201);
    const row = await testDb()("documents").where({ id: response.body.document.id }).first();
    expect(row.content_type).toBe("image/png");
    const download = await http().get(`/api/documents/${row.id}`).set("cookie", auditor).buffer(true).parse(binaryParser);
    expect(download.status).toBe(200);
    expect(download.headers["content-type"]).toBe("image/png");
    expect(download.headers["x-content-type-options"]).toBe("nosniff");
  });

  it("accepts a file of exactly the size cap and refuses one byte more", async () => {
    const pdf = minimalPdf("at the cap");
    const atCap = Buffer.concat([pdf, Buffer.alloc(MAX_CERTIFICATE_BYTES - pdf.byteLength, 0x20)]);
    const accepted = await postReceipt(stores, receiptFields(), { bytes: atCap, name: "cap.pdf", type: "application/pdf" });
    expect(accepted.status, accepted.text).toBe(201);
    expect(accepted.body.document.sizeBytes ?? (await testDb()("documents").where({ id: accepted.body.document.id }).first()).size_bytes).toBe(MAX_CERTIFICATE_BYTES);
    await refusedWithoutTrace({ bytes: Buffer.concat([atCap, Buffer.from(" ")]), name: "cap-plus-one.pdf", type: "application/pdf" }, 413, "too_large");
  });
});

describe("hostile file names", () => {
  const names = [
    "../../etc/passwd.pdf",
    "..\\..\\windows\\system32\\cert.pdf",
    "/absolute/path/cert.pdf",
    `${"a".repeat(1000)}.pdf`,
    `${"😀".repeat(300)}.pdf`,
    "cert\u0000.exe.pdf",
    "line\r\nContent-Disposition: inline\r\n.pdf",
    "tab\tand\u0007bell.pdf",
    "invoice\u202Efdp.exe",
    "\u202Ecert.pdf",
    '"; filename="evil.html',
  ];

  it("keeps each certificate under its own object key and serves it under a safe name", async () => {
    for (const name of names) {
      const pdf = minimalPdf(`named ${name.length}`);
      const response = await postReceipt(stores, receiptFields(), { bytes: pdf, name, type: "application/pdf" });
      expect(response.status, `${JSON.stringify(name)}: ${response.text}`).toBe(201);
      const row = await testDb()("documents").where({ id: response.body.document.id }).first();
      // The object key never comes from the name a client chose.
      expect(row.object_key).toMatch(/^certificates\/[A-Za-z0-9/_.-]+$/);
      expect(row.object_key).not.toContain("..");
      expect(row.object_key).not.toContain("passwd");
      // The name kept for the record is one line of printable text without direction overrides or path parts.
      if (row.original_name !== null) {
        expect(row.original_name).not.toMatch(/[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/);
        expect(row.original_name).not.toMatch(/[/\\]/);
        expect([...row.original_name].length).toBeLessThanOrEqual(255);
        expect(row.original_name).not.toMatch(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])/);
      }
      const download = await http().get(`/api/documents/${row.id}`).set("cookie", auditor).buffer(true).parse(binaryParser);
      expect(download.status).toBe(200);
      expect(Buffer.compare(download.body, pdf)).toBe(0);
      const disposition = String(download.headers["content-disposition"]);
      expect(disposition).toMatch(/^attachment; filename="[A-Za-z0-9._-]+"$/);
    }
  });
});

describe("stored files altered behind the app's back", () => {
  async function storedCertificate() {
    const pdf = minimalPdf("Original certificate for tampering");
    const response = await postReceipt(stores, receiptFields(), { bytes: pdf, name: "c.pdf", type: "application/pdf" });
    expect(response.status).toBe(201);
    const row = await testDb()("documents").where({ id: response.body.document.id }).first();
    return { pdf, id: row.id as number, key: row.object_key as string };
  }

  it("flags a single flipped byte, a truncated file and an appended tail", async () => {
    const { pdf, id, key } = await storedCertificate();
    const flipped = Buffer.from(pdf);
    flipped[Math.floor(flipped.length / 2)] ^= 0x01;
    for (const altered of [flipped, pdf.subarray(0, pdf.length - 1), Buffer.concat([pdf, Buffer.from("%tail")])]) {
      await overwriteObject(key, altered);
      const download = await http().get(`/api/documents/${id}`).set("cookie", auditor);
      expect(download.status).toBe(409);
      expect(download.body.error.code).toBe("document_altered");
      expect(download.headers["x-content-sha256"]).toBe(sha256(pdf));
    }
    await overwriteObject(key, pdf);
    expect((await http().get(`/api/documents/${id}`).set("cookie", auditor)).status).toBe(200);
  });

  it("flags a file replaced by one larger than the cap without buffering it all", async () => {
    const { id, key } = await storedCertificate();
    await overwriteObject(key, Buffer.alloc(MAX_CERTIFICATE_BYTES + 1024, 0x41));
    const download = await http().get(`/api/documents/${id}`).set("cookie", auditor);
    expect(download.status).toBe(409);
    expect(download.body.error.code).toBe("document_altered");
  });

  it("answers 409 document_missing, not a 500, when the stored file is gone", async () => {
    const { pdf, id, key } = await storedCertificate();
    await testS3().send(new DeleteObjectCommand({ Bucket: testEnv().S3_BUCKET, Key: key }));
    try {
      const download = await http().get(`/api/documents/${id}`).set("cookie", auditor);
      expect(download.status).toBe(409);
      expect(download.body.error.code).toBe("document_missing");
    } finally {
      // Other suites check that every document row has its object.
      await overwriteObject(key, pdf);
    }
  });
});
