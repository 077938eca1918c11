import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";
import { verifyLedger } from "../support/ledger";
import { receiveUnitForTest } from "../support/ledger-append";

let inspector: string;
let auditor: string;
beforeAll(async () => {
  inspector = await signInAs("inspector");
  auditor = await signInAs("auditor");
});

const correct = (cookie: string, body: unknown) => http().post("/api/ledger/corrections").set("cookie", cookie).send(body as object);

describe("POST /api/ledger/corrections", () => {
  it("appends a corrected entry that restates the whole entry with the changed values and names the one it corrects", async () => {
    const serial = `TT-${randomUUID().slice(0, 8).toUpperCase()}`;
    const unit = await receiveUnitForTest({ partNumber: "QF-3242-50", serialNumber: serial, tsnMinutes: 60_000, csn: 4_000 });
    const original = await testDb()("ledger_entries").where({ seq: unit.seq }).first();

    const response = await correct(inspector, { correctsSeq: unit.seq, reason: "Certificate block 12 states TSN 1005:30, not 1000:00", tsn: "1005:30" });
    expect(response.status, response.text).toBe(201);
    expect(response.body.entry).toMatchObject({ kind: "corrected", correctsSeq: unit.seq, hash: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(response.body.changed).toEqual(["tsnMinutes"]);

    const row = await testDb()("ledger_entries").where({ seq: response.body.entry.seq }).first();
    expect(row).toMatchObject({
      kind: "corrected",
      part_id: unit.partId,
      corrects_seq: unit.seq,
      reason: "Certificate block 12 states TSN 1005:30, not 1000:00",
      recorded_by: "usr-inspector",
      csn: original.csn,
      document_id: original.document_id,
      details: original.details,
    });
    expect(Number(row.tsn_minutes)).toBe(1005 * 60 + 30);
    expect(new Date(row.occurred_at).toISOString()).toBe(new Date(original.occurred_at).toISOString());
    // The original is untouched.
    expect(await testDb()("ledger_entries").where({ seq: unit.seq }).first()).toEqual(original);

    // The thread shows both: the original marked as corrected, the correction naming it and what changed.
    const trace = await http().get(`/api/parts/${unit.partId}/trace`).set("cookie", auditor);
    const [first, second] = trace.body.entries;
    expect(first).toMatchObject({ seq: unit.seq, correctedBy: [response.body.entry.seq], tsn: "1000:00" });
    expect(second).toMatchObject({ seq: response.body.entry.seq, kind: "corrected", correctsSeq: unit.seq, reason: expect.stringContaining("block 12"), changes: [{ field: "TSN", from: "1000:00", to: "1005:30" }] });

    // A correction of the correction applies to the original, restating the values as they now stand.
    const again = await correct(inspector, { correctsSeq: response.body.entry.seq, reason: "CSN also misread from the certificate", csn: 4_010 });
    expect(again.status, again.text).toBe(201);
    const third = await testDb()("ledger_entries").where({ seq: again.body.entry.seq }).first();
    expect(Number(third.tsn_minutes)).toBe(1005 * 60 + 30);
    expect(third.csn).toBe(4_010);
    const after = await http().get(`/api/parts/${unit.partId}/trace`).set("cookie", auditor);
    expect(after.body.entries[0].correctedBy).toEqual([response.body.entry.seq, again.body.entry.seq]);
    expect(after.body.findings).toEqual([]);

    expect((await verifyLedger()).ok).toBe(true);
  });

  it("refuses bad input with a 422 naming the field, and writes nothing", async () => {
    const unit = await receiveUnitForTest({ partNumber: "QF-3242-50", serialNumber: `TT-${randomUUID().slice(0, 8).toUpperCase()}`, tsnMinutes: 600, csn: 40 });
    const headBefore = await testDb()("ledger_head").first("last_seq");
    const cases: Array<[unknown, string]> = [
      [{ reason: "No seq given here" }, "correctsSeq"],
      [{ correctsSeq: unit.seq }, "reason"],
      [{ correctsSeq: unit.seq, reason: "Wrong hours", tsn: "10:75" }, "tsn"],
      [{ correctsSeq: unit.seq, reason: "Wrong kind", kind: "installed" }, "kind"],
      [{ correctsSeq: 99_999_999, reason: "No such entry", csn: 1 }, "correctsSeq"],
      [{ correctsSeq: unit.seq, reason: "Nothing changes", csn: 40 }, "correctsSeq"],
      [{ correctsSeq: unit.seq, reason: "Unknown aircraft", registration: "Q-NONE" }, "registration"],
      [{ correctsSeq: unit.seq, reason: "Unknown document", documentId: 99_999_999 }, "documentId"],
    ];
    for (const [body, field] of cases) {
      const response = await correct(inspector, body);
      expect(response.status, `${JSON.stringify(body)} -> ${response.text}`).toBe(422);
      expect(response.body.error.fields, JSON.stringify(body)).toHaveProperty(field);
    }
    const malformed = await http().post("/api/ledger/corrections").set("cookie", inspector).set("content-type", "application/json").send("{not json");
    expect(malformed.status).toBe(400);
    expect((await testDb()("ledger_head").first("last_seq")).last_seq).toBe(headBefore.last_seq);
  });

  it("is for inspectors and administrators", async () => {
    for (const role of ["technician", "auditor", "stores", "reliability"] as const) {
      const response = await correct(await signInAs(role), { correctsSeq: 1, reason: "Not my role to correct", csn: 1 });
      expect(response.status, role).toBe(403);
    }
    expect((await correct("", { correctsSeq: 1, reason: "Not signed in at all", csn: 1 })).status).toBe(401);
  });
});
