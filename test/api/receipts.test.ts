import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MAX_CERTIFICATE_BYTES } from "../../src/lib/schemas/receiving";
import { http, signInAs, testDb, testEnv } from "../support/api";
import {
  binaryParser,
  certificateObjectKeys,
  elfExecutable,
  minimalPdf,
  mzExecutable,
  overwriteObject,
  pdfUpload,
  postReceipt,
  receiptFields,
  uniqueSuffix,
} from "./receipts-fixtures";

let stores: string;
beforeAll(async () => {
  stores = await signInAs("stores");
});
afterAll(async () => {
  await testDb().destroy();
});

const sha256 = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");

describe("POST /api/receipts", () => {
  it("books a unit in with a real PDF certificate, stores it byte for byte and serves it back through the download route", async () => {
    const pdf = minimalPdf("EASA Form 1 - test certificate");
    const fields = receiptFields();
    const response = await postReceipt(stores, fields, { bytes: pdf, name: "scan from the copier.pdf", type: "application/pdf" });
    expect(response.status, response.text).toBe(201);
    const { part, document } = response.body;
    expect(part).toMatchObject({ partNumber: "QF-3242-50", serialNumber: fields.serialNumber, cage: "Q4B22", status: "serviceable", bin: "S1-B4", tsn: "4210:30", csn: 2875 });
    expect(document).toMatchObject({ formType: "easa_form_1", statusWork: "repaired", trackingNumber: fields.trackingNumber, issuerApproval: "QA.145.0012", contentType: "application/pdf", sizeBytes: pdf.byteLength, sha256: sha256(pdf) });

    const download = await http().get(`/api/documents/${document.id}`).set("cookie", stores).buffer(true).parse(binaryParser);
    expect(download.status).toBe(200);
    expect(download.headers["content-type"]).toBe("application/pdf");
    expect(download.headers["x-content-sha256"]).toBe(sha256(pdf));
    expect(Buffer.compare(download.body as Buffer, pdf)).toBe(0);

    // The object key is ours, never the uploaded file's name.
    const row = await testDb()("documents").where({ id: document.id }).first();
    expect(row.object_key).toMatch(/^certificates\/[0-9a-f-]{36}$/);
    expect(row.original_name).toBe("scan from the copier.pdf");
    expect(row.part_id).toBe(part.id);

    // One received entry per unit, with the document and the declared times; details hold the paperwork facts.
    const entries = await testDb()("ledger_entries").where({ part_id: part.id }).orderBy("seq");
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ kind: "received", document_id: document.id, tsn_minutes: 4210 * 60 + 30, csn: 2875, recorded_by: "usr-stores" });
    expect(JSON.parse(entries[0].details)).toMatchObject({ bin: "S1-B4", statusWork: "repaired", formType: "easa_form_1", trackingNumber: fields.trackingNumber });

    // The part page's API lists the document and the entry.
    const detail = await http().get(`/api/parts/${part.id}`).set("cookie", await signInAs("technician"));
    expect(detail.status).toBe(200);
    expect(detail.body.part.documents).toEqual([expect.objectContaining({ id: document.id, sha256: sha256(pdf), formType: "easa_form_1" })]);
    expect(detail.body.part.thread.map((line: { kind: string }) => line.kind)).toEqual(["received"]);

    const search = await http().get(`/api/parts?q=${encodeURIComponent(fields.serialNumber)}`).set("cookie", stores);
    expect(search.body.parts).toEqual([expect.objectContaining({ id: part.id, status: "serviceable" })]);
  });

  it("takes decimal hours, defaults the CAGE from the part number and starts TSO/CSO at zero on an overhaul certificate", async () => {
    const response = await postReceipt(stores, receiptFields({ cage: "", tsn: "1234.5", csn: "900", statusWork: "overhauled", formType: "faa_8130_3" }));
    expect(response.status, response.text).toBe(201);
    expect(response.body.part).toMatchObject({ cage: "Q4B22", tsn: "1234:30", csn: 900, tso: "0:00", cso: 0 });
  });

  it("accepts JPEG and PNG scans, judged by their bytes", async () => {
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(64, 1)]);
    const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(64, 2)]);
    const asPng = await postReceipt(stores, receiptFields(), { bytes: png, name: "photo.jpg", type: "image/jpeg" });
    expect(asPng.status, asPng.text).toBe(201);
    expect(asPng.body.document.contentType).toBe("image/png");
    const asJpeg = await postReceipt(stores, receiptFields(), { bytes: jpeg, name: "scan", type: "application/octet-stream" });
    expect(asJpeg.status, asJpeg.text).toBe(201);
    expect(asJpeg.body.document.contentType).toBe("image/jpeg");
  });

  it("answers 413 for a certificate over the size cap, and stores nothing", async () => {
    const before = await certificateObjectKeys();
    const big = Buffer.concat([minimalPdf("big"), Buffer.alloc(MAX_CERTIFICATE_BYTES, 0x20)]);
    const fields = receiptFields();
    const response = await postReceipt(stores, fields, { bytes: big, name: "big.pdf", type: "application/pdf" });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe("too_large");
    expect(response.body.error.message).toMatch(/larger than 10 MB/);
    expect(await certificateObjectKeys()).toEqual(before);
    expect(await testDb()("parts").where({ serial_number: fields.serialNumber }).first()).toBeUndefined();
  });

  it("answers 415 for executables renamed .pdf, whatever the browser claims", async () => {
    const before = await certificateObjectKeys();
    for (const bytes of [elfExecutable(), mzExecutable()]) {
      const response = await postReceipt(stores, receiptFields(), { bytes, name: "certificate.pdf", type: "application/pdf" });
      expect(response.status).toBe(415);
      expect(response.body.error.code).toBe("unsupported_type");
      expect(response.body.error.fields).toHaveProperty("certificate");
    }
    expect(await certificateObjectKeys()).toEqual(before);
  });

  it("answers 409 duplicate_serial for a serial already on file under the same part number", async () => {
    const first = receiptFields();
    expect((await postReceipt(stores, first)).status).toBe(201);
    const before = await certificateObjectKeys();
    const again = await postReceipt(stores, receiptFields({ serialNumber: first.serialNumber }));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("duplicate_serial");
    expect(again.body.error.message).toContain(first.serialNumber);
    expect(await certificateObjectKeys()).toEqual(before);
  });

  it("answers 409 duplicate_tracking_number when the issuer already used the tracking number", async () => {
    const first = receiptFields();
    expect((await postReceipt(stores, first)).status).toBe(201);
    const again = await postReceipt(stores, receiptFields({ trackingNumber: first.trackingNumber }));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("duplicate_tracking_number");
    // The same number from another organisation is a different certificate.
    const otherIssuer = await postReceipt(stores, receiptFields({ trackingNumber: first.trackingNumber, issuerApproval: "QA.145.0047", issuerName: "Harbourline Repair Services" }));
    expect(otherIssuer.status, otherIssuer.text).toBe(201);
  });

  it("lets exactly one of several simultaneous receipts of one serial through, and leaves no orphaned file", async () => {
    const serialNumber = uniqueSuffix("RACE");
    const responses = await Promise.all([0, 1, 2].map(() => postReceipt(stores, receiptFields({ serialNumber }))));
    expect(responses.map((r) => r.status).sort()).toEqual([201, 409, 409]);
    const keys = await certificateObjectKeys();
    const rows = await testDb()("documents").where("object_key", "like", "certificates/%").pluck("object_key");
    expect([...keys].sort()).toEqual([...rows].sort());
  });

  it("answers 422 naming each missing field", async () => {
    const required = ["partNumber", "serialNumber", "formType", "statusWork", "trackingNumber", "issuerName", "issuerApproval", "issuedOn", "tsn", "csn", "bin", "certificateMatches"];
    for (const field of required) {
      const response = await postReceipt(stores, receiptFields({ [field]: undefined }));
      expect(response.status, field).toBe(422);
      expect(Object.keys(response.body.error.fields), field).toEqual([field]);
      expect(response.body.error.message, field).toMatch(/required|answer yes or no/i);
    }
    const noFile = await postReceipt(stores, receiptFields(), null);
    expect(noFile.status).toBe(422);
    expect(Object.keys(noFile.body.error.fields)).toEqual(["certificate"]);
    const nothing = await postReceipt(stores, { remarks: "" }, null);
    expect(nothing.status).toBe(422);
    expect(Object.keys(nothing.body.error.fields)).toEqual(expect.arrayContaining([...required, "certificate"]));
  });

  it("answers 422 for values that do not fit: bad flight time, quantity above 1, a discrepancy without a note, a new part with hours", async () => {
    const cases: Array<[Record<string, string>, string]> = [
      [{ tsn: "12:75" }, "tsn"],
      [{ csn: "12.5" }, "csn"],
      [{ quantity: "2" }, "quantity"],
      [{ certificateMatches: "false" }, "discrepancyNote"],
      [{ statusWork: "new" }, "tsn"],
      [{ formType: "certificate_of_conformity" }, "formType"],
      [{ issuedOn: "2999-01-01" }, "issuedOn"],
      [{ cage: "QXXXX" }, "partNumber"],
    ];
    for (const [overrides, field] of cases) {
      const response = await postReceipt(stores, receiptFields(overrides));
      expect(response.status, JSON.stringify(overrides)).toBe(422);
      expect(response.body.error.fields, JSON.stringify(overrides)).toHaveProperty(field);
    }
  });

  it("answers 422 unknown_part_number for a P/N not in the catalog, and queues a request to the administrators", async () => {
    const response = await postReceipt(stores, receiptFields({ partNumber: "QF-9999-99", cage: "" }));
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe("unknown_part_number");
    expect(response.body.error.fields).toHaveProperty("partNumber");

    const request = await http().post("/api/receipts/part-number-requests").set("cookie", stores).send({ partNumber: "QF-9999-99", cage: "Q4B22", note: "On a purchase order for the brake shop." });
    expect(request.status).toBe(202);
    expect(request.body.queued).toBeGreaterThanOrEqual(1);
    const mail = await testDb()("mail_outbox").where("subject", "like", "%QF-9999-99%").first();
    expect(mail).toMatchObject({ to_address: "admin@demo.threadline.test" });
    expect(mail.text_body).toContain("Priya Lonsdale");
  });

  it("records a certificate that does not match the unit as a receiving discrepancy: quarantined, with mail to quality", async () => {
    const fields = receiptFields({ certificateMatches: "false", discrepancyNote: "Block 10 reads EA0999, the data plate reads otherwise." });
    const response = await postReceipt(stores, fields);
    expect(response.status, response.text).toBe(201);
    expect(response.body.part.status).toBe("quarantined");
    const entries = await testDb()("ledger_entries").where({ part_id: response.body.part.id }).orderBy("seq");
    expect(entries.map((e) => e.kind)).toEqual(["received", "quarantined"]);
    expect(entries[1].reason).toMatch(/Receiving discrepancy: Block 10 reads EA0999/);
    const mail = await testDb()("mail_outbox").where("subject", "like", `%${fields.serialNumber}%`);
    // Quality is every active auditor (other suites may have invited more).
    const auditors = await testDb()("users").where({ role: "auditor", status: "active" }).pluck("email");
    expect(mail.map((m) => m.to_address).sort()).toEqual([...auditors].sort());
    expect(auditors).toContain("auditor@demo.threadline.test");
    // The outbox hands it to SMTP after the commit; the mail fake's REST inbox (maildev 3: /api/email) shows it.
    await expect
      .poll(async () => {
        const inbox = (await (await fetch(`${testEnv().MAIL_INBOX_URL}/api/email`)).json()) as Array<{ subject: string; to: Array<{ address: string }> }>;
        return inbox.some((m) => m.subject.includes(fields.serialNumber) && m.to.some((t) => t.address === "auditor@demo.threadline.test"));
      }, { timeout: 30_000 })
      .toBe(true);
  });

  it("refuses roles other than stores and admin with 403, and a visitor with 401", async () => {
    for (const role of ["technician", "inspector", "reliability", "auditor"] as const) {
      const response = await postReceipt(await signInAs(role), receiptFields());
      expect(response.status, role).toBe(403);
    }
    expect((await postReceipt(await signInAs("admin"), receiptFields())).status).toBe(201);
    expect((await postReceipt("", receiptFields())).status).toBe(401);
  });
});

describe("GET /api/documents/{id}", () => {
  it("refuses a file altered in storage behind the app's back with 409 document_altered, serving none of it", async () => {
    const pdf = minimalPdf("Original certificate");
    const response = await postReceipt(stores, receiptFields(), { bytes: pdf, name: "c.pdf", type: "application/pdf" });
    expect(response.status).toBe(201);
    const { document } = response.body;
    const { object_key: key } = await testDb()("documents").where({ id: document.id }).first();

    await overwriteObject(key, minimalPdf("Forged certificate"));
    const rowsBefore = await testDb()("ledger_entries").count({ n: "*" });
    const download = await http().get(`/api/documents/${document.id}`).set("cookie", await signInAs("auditor"));
    expect(download.status).toBe(409);
    expect(download.headers["content-type"]).toMatch(/application\/json/);
    expect(download.body.error.code).toBe("document_altered");
    expect(download.body.error.message).toMatch(/has changed since it was uploaded/);
    expect(download.headers["x-content-sha256"]).toBe(sha256(pdf));
    expect(await testDb()("ledger_entries").count({ n: "*" })).toEqual(rowsBefore);

    // Put back, it is served again.
    await overwriteObject(key, pdf);
    expect((await http().get(`/api/documents/${document.id}`).set("cookie", stores)).status).toBe(200);
  });

  it("lets every signed-in role read certificates, answers 404 for an unknown id and 401 without a session", async () => {
    const response = await postReceipt(stores, receiptFields(), pdfUpload());
    const id = response.body.document.id;
    for (const role of ["technician", "inspector", "stores", "reliability", "auditor", "admin"] as const) {
      expect((await http().get(`/api/documents/${id}`).set("cookie", await signInAs(role))).status, role).toBe(200);
    }
    expect((await http().get("/api/documents/99999999").set("cookie", stores)).status).toBe(404);
    expect((await http().get(`/api/documents/${id}`)).status).toBe(401);
  });
});
