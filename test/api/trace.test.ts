import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_FINDING_PART_NUMBER } from "../../seeds/04_demo-findings";
import { http, signInAs, testDb } from "../support/api";
import { fittedProjection, fittedRebuiltFromLedger, verifyLedger } from "../support/ledger";
import { appendTestEntries, receiveUnitForTest } from "../support/ledger-append";
import { fittedAt, hm, latestTotals, postSwap, swapBody } from "../support/swaps";

let auditor: string;
let technician: string;
beforeAll(async () => {
  auditor = await signInAs("auditor");
  technician = await signInAs("technician");
});

const trace = (cookie: string, partId: number) => http().get(`/api/parts/${partId}/trace`).set("cookie", cookie);

/** Demo units whose threads cross at least three airframes and a shop visit (most airframes first). */
async function multiAirframeDemoUnits() {
  const [rows] = await testDb().raw(`
    SELECT pt.id, pt.serial_number, pn.part_number,
           COUNT(DISTINCT CASE WHEN e.kind = 'installed' THEN e.aircraft_id END) AS airframes,
           SUM(e.kind = 'sent_for_repair') AS shop_visits
      FROM parts pt JOIN part_numbers pn ON pn.id = pt.part_number_id JOIN ledger_entries e ON e.part_id = pt.id
     WHERE pt.serial_number NOT LIKE 'TT-%'
     GROUP BY pt.id HAVING airframes >= 3 AND shop_visits >= 1 ORDER BY airframes DESC, pt.id LIMIT 60`);
  return rows as Array<{ id: number; serial_number: string; part_number: string; airframes: number }>;
}

describe("GET /api/trace", () => {
  it("finds a serial exactly, lists several matches rather than guessing, and narrows by P/N and CAGE", async () => {
    const serial = `TT-${randomUUID().slice(0, 8).toUpperCase()}`;
    const a = await receiveUnitForTest({ partNumber: "QF-3242-50", serialNumber: serial, tsnMinutes: 60_000, csn: 4_000 });
    const b = await receiveUnitForTest({ partNumber: "QF-2431-10", serialNumber: serial, tsnMinutes: 1_000, csn: 300 });

    const both = await http().get(`/api/trace?serial=${serial.toLowerCase()}`).set("cookie", auditor);
    expect(both.status, both.text).toBe(200);
    expect(both.body.matches.map((m: { id: number }) => m.id).sort()).toEqual([a.partId, b.partId].sort());
    expect(both.body.matches[0]).toMatchObject({ serialNumber: serial, entries: 1 });

    const one = await http().get(`/api/trace?serial=${serial}&partNumber=QF-3242-50`).set("cookie", auditor);
    expect(one.body.matches.map((m: { id: number }) => m.id)).toEqual([a.partId]);
    const byCage = await http().get(`/api/trace?serial=${serial}&cage=Q5P12`).set("cookie", auditor);
    expect(byCage.body.matches.map((m: { id: number }) => m.id)).toEqual([b.partId]);
    const none = await http().get(`/api/trace?serial=${serial}&partNumber=QF-0000-00`).set("cookie", auditor);
    expect(none.body.matches).toEqual([]);
  });

  it("asks for the serial (422 naming it) and refuses roles outside trace (403)", async () => {
    const missing = await http().get("/api/trace").set("cookie", auditor);
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty("serial");
    const tooLong = await http().get(`/api/trace?serial=X&cage=TOOLONG`).set("cookie", auditor);
    expect(tooLong.status).toBe(422);
    expect(tooLong.body.error.fields).toHaveProperty("cage");
    expect((await http().get("/api/trace?serial=X").set("cookie", technician)).status).toBe(403);
    expect((await http().get("/api/trace?serial=X")).status).toBe(401);
  });
});

describe("GET /api/parts/{id}/trace", () => {
  it("gives a clean demo thread across three or more airframes and a shop visit, every entry in seq order from the first receipt", async () => {
    // The first such unit whose thread has no finding (the simulated history is not free of them).
    let unit: Awaited<ReturnType<typeof multiAirframeDemoUnits>>[number] | undefined;
    let response;
    for (const candidate of await multiAirframeDemoUnits()) {
      response = await trace(auditor, candidate.id);
      expect(response.status, response.text).toBe(200);
      if (response.body.findings.length === 0) {
        unit = candidate;
        break;
      }
    }
    expect(unit, "the demo should hold a clean serial that crossed three airframes and a shop visit").toBeDefined();
    const { part, entries, findings } = response!.body;
    expect(part).toMatchObject({ id: unit!.id, serialNumber: unit!.serial_number, partNumber: unit!.part_number });
    expect(findings).toEqual([]);
    expect(entries[0].kind).toBe("received");
    const seqs = entries.map((e: { seq: number }) => e.seq);
    expect(seqs).toEqual([...seqs].sort((x: number, y: number) => x - y));
    const count = await testDb()("ledger_entries").where({ part_id: unit!.id }).count({ n: "*" });
    expect(entries).toHaveLength(Number(count[0].n));
    const install = entries.find((e: { kind: string }) => e.kind === "installed");
    expect(install).toMatchObject({ registration: expect.stringMatching(/^Q-/), positionCode: expect.any(String), aircraftHours: expect.stringMatching(/^\d+:\d\d$/), tsn: expect.stringMatching(/^\d+:\d\d$/) });
    expect(install.signedBy).toMatchObject({ name: expect.any(String), licenceNumber: expect.stringMatching(/^Q/) });
    expect(install.document).toMatchObject({ kind: "release_certificate", sha256: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(new Set(entries.filter((e: { kind: string }) => e.kind === "installed").map((e: { registration: string }) => e.registration)).size).toBeGreaterThanOrEqual(3);
  });

  it("shows the demo's deliberate finding: a receipt with lower times than the record (time regression)", async () => {
    const unit = await testDb()("parts as pt")
      .join("part_numbers as pn", "pn.id", "pt.part_number_id")
      .join("ledger_entries as e", "e.part_id", "pt.id")
      .where({ "pn.part_number": DEMO_FINDING_PART_NUMBER, "e.reason": "Received back from a pool exchange" })
      .first("pt.id", "e.seq");
    const response = await trace(auditor, unit.id);
    expect(response.body.findings).toEqual([{ kind: "time_regression", seq: Number(unit.seq), relatedSeqs: [expect.any(Number)], message: expect.stringMatching(/^TSN went back/) }]);
  });

  it("answers 404 for an unknown unit, 422 for a malformed id and 403 for a technician", async () => {
    expect((await trace(auditor, 99_999_999)).status).toBe(404);
    const bad = await http().get("/api/parts/abc/trace").set("cookie", auditor);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("partId");
    expect((await trace(technician, 1)).status).toBe(403);
  });
});

describe("a thread built through the API across three aircraft", () => {
  // The receipts route is not in this branch: receiveUnitForTest stands in for it. An overlap cannot
  // be made through the API at all (the swap refuses part_fitted_elsewhere), so the test helper
  // appends that one installation directly, chained exactly as the app appends.
  it("has exactly the deliberate gap and overlap as findings, and the position map flags the unit", async () => {
    const serial = `TT-${randomUUID().slice(0, 8).toUpperCase()}`;
    const partNumber = "QF-3242-51";
    const unit = { partNumber, serialNumber: serial };
    const received = await receiveUnitForTest({ ...unit, tsnMinutes: 120_000, csn: 9_000 });
    // Instants a few seconds apart from now: later than anything earlier suites recorded, never in the future.
    const clock = Date.now();
    const at = (step: number) => new Date(clock + step * 2_000).toISOString();

    // Aircraft A: fitted, flown (utilisation), removed.
    const offA = await fittedAt("Q-FRAA", "B2-EBA2");
    let totals = await latestTotals("Q-FRAA");
    const onA = await postSwap(technician, swapBody({ registration: "Q-FRAA", positionCode: "B2-EBA2", minutes: totals.minutes, cycles: totals.cycles, removed: offA, installed: unit, performedAt: at(1) }));
    expect(onA.status, onA.text).toBe(201);
    const flown = await http().post("/api/aircraft/Q-FRAA/utilization").set("cookie", technician).send({ asOf: at(2), hours: hm(totals.minutes + 300), cycles: totals.cycles + 120 });
    expect(flown.status, flown.text).toBe(201);
    const offFromA = await postSwap(technician, swapBody({ registration: "Q-FRAA", positionCode: "B2-EBA2", minutes: totals.minutes + 300, cycles: totals.cycles + 120, removed: unit, installed: null, performedAt: at(3) }));
    expect(offFromA.status, offFromA.text).toBe(201);
    const removalA = await testDb()("ledger_entries").where({ seq: offFromA.body.entries[0].seq }).first();
    expect(Number(removalA.tsn_minutes)).toBe(120_000 + 300);

    // The deliberate gap: booked back in with 50 hours more than it left aircraft A with, and no shop visit.
    const gapReceipt = await receiveUnitForTest({ ...unit, tsnMinutes: 120_000 + 300 + 50 * 60, csn: 9_000 + 120 });

    // Aircraft B: fitted.
    const offB = await fittedAt("Q-FRAB", "B3-EBA1");
    totals = await latestTotals("Q-FRAB");
    const onB = await postSwap(technician, swapBody({ registration: "Q-FRAB", positionCode: "B3-EBA1", minutes: totals.minutes, cycles: totals.cycles, removed: offB, installed: unit, performedAt: at(4) }));
    expect(onB.status, onB.text).toBe(201);
    const installB = onB.body.entries[1];

    // The API refuses an installation elsewhere while it is fitted on B.
    const totalsC = await latestTotals("Q-FRAD");
    const refused = await postSwap(technician, swapBody({ registration: "Q-FRAD", positionCode: "B4-EBA3", minutes: totalsC.minutes, cycles: totalsC.cycles, removed: await fittedAt("Q-FRAD", "B4-EBA3"), installed: unit, performedAt: at(5) }));
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("part_fitted_elsewhere");

    // The deliberate overlap: aircraft C's installation recorded while B still has it.
    const positionC = await testDb()("positions").where({ aircraft_type_id: 1, code: "B4-EBA3" }).first("id");
    const installB_row = await testDb()("ledger_entries").where({ seq: installB.seq }).first();
    const [overlap] = await appendTestEntries([
      {
        kind: "installed", partId: received.partId, aircraftId: 4, positionId: positionC.id, occurredAt: at(6), recordedBy: "usr-technician",
        aircraftMinutes: totalsC.minutes, aircraftCycles: totalsC.cycles, tsnMinutes: Number(installB_row.tsn_minutes), csn: Number(installB_row.csn),
        workOrder: "WO-TEST-OVERLAP", taskReference: "AMM 32-42 brake actuator replacement", testResult: "Operational test: passed", documentId: gapReceipt.documentId,
      },
    ]);

    const mid = await trace(auditor, received.partId);
    expect(mid.body.findings.map((f: { kind: string; seq: number }) => [f.kind, f.seq])).toEqual([
      ["gap", gapReceipt.seq],
      ["overlap", overlap.seq],
    ]);
    // The position map counts the findings of the unit fitted on B, and marks the position.
    const map = await http().get("/api/aircraft/Q-FRAB").set("cookie", auditor);
    const position = map.body.positions.find((p: { code: string }) => p.code === "B3-EBA1");
    expect(position).toMatchObject({ findings: 2, state: "finding", fitted: { serialNumber: serial } });
    const clean = map.body.positions.find((p: { code: string; fitted: unknown; findings: number }) => p.code !== "B3-EBA1" && p.fitted && p.findings === 0);
    expect(clean?.state).not.toBe("finding");

    // Removed from B through the API; the thread still has exactly those two findings.
    totals = await latestTotals("Q-FRAB");
    const offFromB = await postSwap(technician, swapBody({ registration: "Q-FRAB", positionCode: "B3-EBA1", minutes: totals.minutes + 60, cycles: totals.cycles + 20, removed: unit, installed: null, performedAt: at(7) }));
    expect(offFromB.status, offFromB.text).toBe(201);

    const response = await trace(auditor, received.partId);
    expect(response.status).toBe(200);
    const { entries, findings } = response.body;
    expect(new Set(entries.filter((e: { kind: string }) => e.kind === "installed").map((e: { registration: string }) => e.registration))).toEqual(new Set(["Q-FRAA", "Q-FRAB", "Q-FRAD"]));
    expect(findings).toHaveLength(2);
    expect(findings[0]).toMatchObject({ kind: "gap", seq: gapReceipt.seq, relatedSeqs: [offFromA.body.entries[0].seq] });
    expect(findings[0].message).toMatch(/TSN rose .* 50:00 unaccounted for/);
    expect(findings[1]).toMatchObject({ kind: "overlap", seq: overlap.seq, relatedSeqs: [installB.seq] });
    expect(findings[1].message).toContain("while still fitted on Q-FRAB");

    // The ledger still verifies, and the fitted projection still matches a replay of the ledger.
    expect((await verifyLedger()).ok).toBe(true);
    expect(await fittedProjection()).toEqual(await fittedRebuiltFromLedger());
  });
});
