import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { computeEntryHash } from "../../src/domain/ledger-hash";
import { rowToEntry } from "../../src/server/ledger";
import { http, signInAs, testDb } from "../support/api";
import { parseLabel } from "../../src/domain/labels";
import { decodeSymbol } from "../domain/label-print-decoder";
import { binaryParser, certificateObjectKeys, pdfUpload, postMultipartMovement, postReceipt, receiptFields, uniqueSuffix } from "./receipts-fixtures";

let stores: string;
let auditor: string;
beforeAll(async () => {
  stores = await signInAs("stores");
  auditor = await signInAs("auditor");
});
afterAll(async () => {
  await testDb().destroy();
});

async function receiveUnit(overrides: Record<string, string> = {}): Promise<number> {
  const response = await postReceipt(stores, receiptFields({ serialNumber: uniqueSuffix("STK"), ...overrides }));
  expect(response.status, response.text).toBe(201);
  return response.body.part.id;
}

const move = (cookie: string, partId: number, body: Record<string, unknown>) => http().post(`/api/parts/${partId}/movements`).set("cookie", cookie).send(body);

async function entriesOf(partId: number) {
  return testDb()("ledger_entries").where({ part_id: partId }).orderBy("seq");
}
async function lastEntry(partId: number) {
  const rows = await entriesOf(partId);
  const row = rows[rows.length - 1];
  return { ...row, details: row.details ? JSON.parse(row.details) : null };
}

/** A demo unit whose latest entry is a removal from an aircraft (the seed leaves a few). */
async function removedDemoUnit(): Promise<{ id: number; removedSeq: number }> {
  const row = await testDb()("parts as p")
    .join("ledger_entries as e", "e.part_id", "p.id")
    .where("p.status", "unserviceable")
    .where("e.kind", "removed")
    .whereRaw("e.seq = (select max(seq) from ledger_entries where part_id = p.id)")
    .orderBy("p.id")
    .first("p.id", "e.seq");
  expect(row, "the demo seed leaves units just removed from aircraft").toBeDefined();
  return { id: Number(row.id), removedSeq: Number(row.seq) };
}

describe("POST /api/parts/{id}/movements", () => {
  it("issues a serviceable unit to a work order, refuses a second issue, and takes it back unused", async () => {
    const partId = await receiveUnit();
    const missing = await move(stores, partId, { kind: "issued" });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty("workOrder");

    const issued = await move(stores, partId, { kind: "issued", workOrder: "WO-77120", issuedTo: "Ines Marwood" });
    expect(issued.status, issued.text).toBe(201);
    expect(issued.body.part).toMatchObject({ status: "serviceable", bin: null });
    const entry = await lastEntry(partId);
    expect(entry).toMatchObject({ kind: "issued", work_order: "WO-77120", recorded_by: "usr-stores" });
    expect(entry.details).toMatchObject({ issuedTo: "Ines Marwood", fromBin: "S1-B4" });
    expect(new Date(entry.recorded_at).getTime()).toBeGreaterThan(0);

    const twice = await move(stores, partId, { kind: "issued", workOrder: "WO-77121" });
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toMatch(/issued to WO-77120/);
    expect((await move(stores, partId, { kind: "sent_for_repair", shop: "X", repairOrder: "RO-1", reason: "r" })).status).toBe(409);

    const back = await move(stores, partId, { kind: "returned", bin: "S1-C2" });
    expect(back.status, back.text).toBe(201);
    expect(back.body.part).toMatchObject({ status: "serviceable", bin: "S1-C2" });
    expect((await lastEntry(partId)).details).toEqual({ bin: "S1-C2", unused: "yes" });
    expect((await move(stores, partId, { kind: "returned", bin: "S1-C2" })).status).toBe(409);
  });

  it("takes a removed unit back with its tag, sends it for repair, and books it back with a new certificate", async () => {
    const { id: partId, removedSeq } = await removedDemoUnit();
    const before = await testDb()("parts").where({ id: partId }).first();

    const noTag = await move(stores, partId, { kind: "returned", bin: "QUAR-US" });
    expect(noTag.status).toBe(422);
    expect(noTag.body.error.fields).toHaveProperty("tagNumber");
    const returned = await move(stores, partId, { kind: "returned", bin: "QUAR-US", tagNumber: "US-58812", reason: "Failed built-in test" });
    expect(returned.status, returned.text).toBe(201);
    expect(returned.body.part).toMatchObject({ status: "unserviceable", bin: "QUAR-US" });
    expect(await lastEntry(partId)).toMatchObject({ kind: "returned", reason: "Failed built-in test", details: { tag: "US-58812", bin: "QUAR-US" } });
    expect((await move(stores, partId, { kind: "returned", bin: "QUAR-US", tagNumber: "US-58812" })).status).toBe(409);

    const sent = await move(stores, partId, { kind: "sent_for_repair", shop: "Harbourline Repair Services", shopApproval: "QA.145.0047", repairOrder: "RO-90411", reason: "Repair and test after unscheduled removal" });
    expect(sent.status, sent.text).toBe(201);
    expect(sent.body.part).toMatchObject({ status: "in_repair", bin: null });
    expect(await lastEntry(partId)).toMatchObject({ kind: "sent_for_repair", details: { shop: "Harbourline Repair Services", shopApproval: "QA.145.0047", repairOrder: "RO-90411" } });
    const again = await move(stores, partId, { kind: "sent_for_repair", shop: "X", repairOrder: "RO-2", reason: "again" });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("illegal_transition");
    expect(again.body.error.message).toMatch(/at the repair shop/);

    const trackingNumber = uniqueSuffix("HRS-");
    const repaired = await postMultipartMovement(stores, partId, {
      kind: "repaired",
      formType: "easa_form_1",
      statusWork: "overhauled",
      trackingNumber,
      issuerName: "Harbourline Repair Services",
      issuerApproval: "QA.145.0047",
      issuedOn: new Date(Date.now() - 86_400_000).toISOString().slice(0, 10),
      remarks: "Overhauled per CMM; seals replaced.",
      shopFinding: "confirmed_failure",
      bin: "S2-R3",
      certificateMatches: "true",
    });
    expect(repaired.status, repaired.text).toBe(201);
    // TSN/CSN continue; an overhaul restarts TSO/CSO.
    expect(repaired.body.part).toMatchObject({ status: "serviceable", bin: "S2-R3", csn: Number(before.csn), tso: "0:00", cso: 0 });
    expect(repaired.body.document).toMatchObject({ trackingNumber, statusWork: "overhauled", partId });
    const entry = await lastEntry(partId);
    expect(entry).toMatchObject({ kind: "repaired", document_id: repaired.body.document.id, tsn_minutes: Number(before.tsn_minutes), csn: Number(before.csn), tso_minutes: 0, cso: 0 });
    expect(entry.details).toMatchObject({ shopFinding: "confirmed_failure", removalSeq: String(removedSeq), shop: "Harbourline Repair Services", repairOrder: "RO-90411", statusWork: "overhauled", bin: "S2-R3" });

    // The part page lists the new certificate; the entries of this unit still hash correctly.
    const detail = await http().get(`/api/parts/${partId}`).set("cookie", stores);
    expect(detail.body.part.documents.map((d: { id: number }) => d.id)).toContain(repaired.body.document.id);
    for (const row of await entriesOf(partId)) expect(computeEntryHash(row.prev_hash, rowToEntry(row))).toBe(row.hash);
  });

  it("refuses a return from repair without its certificate (422) or for a unit that is not at a shop (409), storing nothing", async () => {
    const partId = await receiveUnit();
    const fields = { kind: "repaired", formType: "easa_form_1", statusWork: "repaired", trackingNumber: uniqueSuffix("T-"), issuerName: "Shop", issuerApproval: "QA.145.0099", issuedOn: "2026-11-01", shopFinding: "no_fault_found", bin: "S1-A1", certificateMatches: "true" };
    const noFile = await postMultipartMovement(stores, partId, fields, null);
    expect(noFile.status).toBe(422);
    expect(noFile.body.error.fields).toHaveProperty("certificate");
    const keysBefore = await certificateObjectKeys();
    const notAtShop = await postMultipartMovement(stores, partId, fields, pdfUpload());
    expect(notAtShop.status).toBe(409);
    expect(notAtShop.body.error.message).toMatch(/is serviceable/);
    expect(await certificateObjectKeys()).toEqual(keysBefore);
  });

  it("quarantines a suspected unapproved part with mail to quality; only an auditor or admin may release it", async () => {
    const partId = await receiveUnit();
    const missing = await move(stores, partId, { kind: "quarantined" });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty("reason");

    const serial = (await testDb()("parts").where({ id: partId }).first()).serial_number;
    const quarantined = await move(stores, partId, { kind: "quarantined", reason: "Data plate riveted over a ground-off plate", suspectedUnapproved: true, bin: "QUAR-1" });
    expect(quarantined.status, quarantined.text).toBe(201);
    expect(quarantined.body.part).toMatchObject({ status: "quarantined", bin: "QUAR-1" });
    expect(await lastEntry(partId)).toMatchObject({ kind: "quarantined", reason: "Data plate riveted over a ground-off plate", details: { suspectedUnapproved: "yes", bin: "QUAR-1" } });
    const mail = await testDb()("mail_outbox").where("subject", "like", `%${serial}%`);
    // Quality is every active auditor (other suites may have invited more).
    const auditors = await testDb()("users").where({ role: "auditor", status: "active" }).pluck("email");
    expect(mail.map((m) => m.to_address).sort()).toEqual([...auditors].sort());
    expect(auditors).toContain("auditor@demo.threadline.test");
    expect(mail[0].subject).toMatch(/suspected unapproved part/);

    const byStores = await move(stores, partId, { kind: "released", reason: "Looks fine" });
    expect(byStores.status).toBe(403);
    expect(byStores.body.error.message).toMatch(/Only quality/);
    expect((await move(await signInAs("technician"), partId, { kind: "released", reason: "x" })).status).toBe(403);
    expect((await move(stores, partId, { kind: "issued", workOrder: "WO-1" })).status).toBe(409);

    const released = await move(auditor, partId, { kind: "released", reason: "Manufacturer confirmed the plate replacement; traceable to the original CoC.", bin: "S1-B4" });
    expect(released.status, released.text).toBe(201);
    expect(released.body.part).toMatchObject({ status: "serviceable", bin: "S1-B4" });
    expect(await lastEntry(partId)).toMatchObject({ kind: "released", recorded_by: "usr-auditor", details: { releasedTo: "serviceable", bin: "S1-B4" } });

    const notQuarantined = await move(auditor, partId, { kind: "released", reason: "again" });
    expect(notQuarantined.status).toBe(409);
    expect(notQuarantined.body.error.message).toMatch(/needs a unit that is quarantined/);
  });

  it("scraps a unit with how it was made unusable; nothing moves after that", async () => {
    const partId = await receiveUnit();
    const missing = await move(stores, partId, { kind: "scrapped", reason: "Beyond economical repair" });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty("mutilation");
    const scrapped = await move(stores, partId, { kind: "scrapped", reason: "Beyond economical repair", mutilation: "Housing cut through at the mounting flange" });
    expect(scrapped.status, scrapped.text).toBe(201);
    expect(scrapped.body.part).toMatchObject({ status: "scrapped", bin: null });
    expect(await lastEntry(partId)).toMatchObject({ kind: "scrapped", reason: "Beyond economical repair", details: { mutilation: "Housing cut through at the mounting flange" } });
    const after = await move(stores, partId, { kind: "quarantined", reason: "x" });
    expect(after.status).toBe(409);
    expect(after.body.error.message).toMatch(/scrapped/);
  });

  it("refuses movements of an installed unit with 409 naming where it is fitted", async () => {
    const fitted = await testDb()("fitted as f").join("aircraft as a", "a.id", "f.aircraft_id").first("f.part_id", "a.registration");
    const count = (await entriesOf(fitted.part_id)).length;
    for (const body of [
      { kind: "sent_for_repair", shop: "Shop", repairOrder: "RO-1", reason: "r" },
      { kind: "issued", workOrder: "WO-1" },
      { kind: "scrapped", reason: "r", mutilation: "m" },
    ]) {
      const response = await move(stores, fitted.part_id, body);
      expect(response.status, body.kind).toBe(409);
      expect(response.body.error.code).toBe("illegal_transition");
      expect(response.body.error.message).toContain(fitted.registration);
      expect(response.body.error.message).toMatch(/through a swap/);
    }
    expect((await entriesOf(fitted.part_id)).length).toBe(count);
  });

  it("answers 422 for an unknown kind, a time in the future or before the unit's last entry, 404 for an unknown unit, 403 for roles without stores work", async () => {
    const partId = await receiveUnit();
    expect((await move(stores, partId, { kind: "teleported" })).status).toBe(422);
    const future = await move(stores, partId, { kind: "issued", workOrder: "WO-1", occurredAt: "2999-01-01T00:00:00Z" });
    expect(future.status).toBe(422);
    expect(future.body.error.fields).toHaveProperty("occurredAt");
    const past = await move(stores, partId, { kind: "issued", workOrder: "WO-1", occurredAt: "2020-01-01T00:00:00Z" });
    expect(past.status).toBe(422);
    expect(past.body.error.fields).toHaveProperty("occurredAt");
    expect((await move(stores, 99999999, { kind: "issued", workOrder: "WO-1" })).status).toBe(404);
    for (const role of ["technician", "inspector", "reliability"] as const) {
      expect((await move(await signInAs(role), partId, { kind: "issued", workOrder: "WO-1" })).status, role).toBe(403);
    }
    // An auditor may quarantine (quality acts on a suspicion) but not issue.
    expect((await move(auditor, partId, { kind: "issued", workOrder: "WO-1" })).status).toBe(403);
  });
});

describe("GET /api/stock", () => {
  it("lists stock by status, part number and bin with counts and server-side pages", async () => {
    const partNumber = "QF-3242-50";
    const bin = uniqueSuffix("BIN");
    const ids = [await receiveUnit({ bin }), await receiveUnit({ bin }), await receiveUnit({ bin })];
    const page1 = await http().get("/api/stock").query({ bin, pageSize: 2, page: 1 }).set("cookie", stores);
    expect(page1.status, page1.text).toBe(200);
    expect(page1.body.total).toBe(3);
    expect(page1.body.units).toHaveLength(2);
    const page2 = await http().get("/api/stock").query({ bin, pageSize: 2, page: 2 }).set("cookie", stores);
    expect(page2.body.units).toHaveLength(1);
    expect([...page1.body.units, ...page2.body.units].map((u: { id: number }) => u.id).sort()).toEqual([...ids].sort());
    expect(page1.body.counts).toMatchObject({ serviceable: 3, quarantined: 0 });

    await move(stores, ids[0], { kind: "quarantined", reason: "Paperwork query", bin });
    const counted = await http().get("/api/stock").query({ bin, status: "quarantined" }).set("cookie", auditor);
    expect(counted.body.units.map((u: { id: number }) => u.id)).toEqual([ids[0]]);
    expect(counted.body.counts).toMatchObject({ serviceable: 2, quarantined: 1 });

    const byPn = await http().get("/api/stock").query({ partNumber, status: "serviceable", pageSize: 200 }).set("cookie", stores);
    expect(byPn.body.units.every((u: { partNumber: string; status: string }) => u.partNumber === partNumber && u.status === "serviceable")).toBe(true);

    expect((await http().get("/api/stock").query({ status: "installed" }).set("cookie", stores)).status).toBe(422);
    expect((await http().get("/api/stock").set("cookie", await signInAs("technician"))).status).toBe(403);
  });
});

describe("GET /api/parts/{id}/label.png", () => {
  it("renders each symbol as a PNG that decodes back to the unit's P/N, S/N and CAGE", async () => {
    const serialNumber = uniqueSuffix("LBL");
    const partId = await receiveUnit({ serialNumber });
    const technician = await signInAs("technician");
    for (const symbol of ["datamatrix", "code128"] as const) {
      const response = await http().get(`/api/parts/${partId}/label.png`).query({ symbol }).set("cookie", technician).buffer(true).parse(binaryParser);
      expect(response.status, symbol).toBe(200);
      expect(response.headers["content-type"]).toBe("image/png");
      expect(parseLabel(decodeSymbol(response.body as Buffer, symbol))).toMatchObject({ ok: true, partNumber: "QF-3242-50", serialNumber, cage: "Q4B22" });
    }
    expect((await http().get(`/api/parts/${partId}/label.png`).query({ symbol: "qr" }).set("cookie", technician)).status).toBe(422);
    expect((await http().get("/api/parts/99999999/label.png").set("cookie", technician)).status).toBe(404);
    expect((await http().get(`/api/parts/${partId}/label.png`)).status).toBe(401);
  });
});
