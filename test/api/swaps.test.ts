import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { dbFingerprint } from "../integrity/integrity-support";
import { http, signInAs, testDb, testEnv } from "../support/api";
import { fittedProjection, fittedRebuiltFromLedger, verifyLedger } from "../support/ledger";
import { waitForMail } from "../support/mail-inbox";
import { fittedAt, latestTotals, postSwap, spares, swapBody } from "../support/swaps";

const ACTUATORS = ["QF-3242-50", "QF-3242-51"];
let technician: string;
let inspector: string;
beforeAll(async () => {
  technician = await signInAs("technician");
  inspector = await signInAs("inspector");
});

describe("POST /api/swaps", () => {
  it("records an off/on change: two chained entries, the fitted projection, both parts, and mail for an unscheduled removal", async () => {
    const off = await fittedAt("Q-FRAC", "B2-EBA3");
    const [on] = await spares(ACTUATORS, 1);
    const totals = await latestTotals("Q-FRAC");
    const key = randomUUID();
    const body = swapBody({ registration: "Q-FRAC", positionCode: "B2-EBA3", minutes: totals.minutes + 30, cycles: totals.cycles + 1, removed: off, installed: on });
    const response = await postSwap(technician, body, key);
    expect(response.status, response.text).toBe(201);
    expect(response.body.entries.map((e: { kind: string }) => e.kind)).toEqual(["removed", "installed"]);
    expect(response.body.entries[1].seq).toBe(response.body.entries[0].seq + 1);
    expect(response.body.swap).toMatchObject({ registration: "Q-FRAC", positionCode: "B2-EBA3", status: "complete" });

    expect((await fittedAt("Q-FRAC", "B2-EBA3")).serialNumber).toBe(on.serialNumber);
    const removed = await testDb()("parts").where({ id: off.id }).first();
    expect(removed.status).toBe("unserviceable");
    const installed = await testDb()("parts").where({ id: on.id }).first();
    expect(installed.status).toBe("installed");

    // TSN carries: the removed unit's TSN grew by exactly what the aircraft flew while it was fitted.
    const [removedEntry] = await testDb()("ledger_entries").where({ seq: response.body.entries[0].seq });
    const [installEntry] = await testDb()("ledger_entries").where({ part_id: off.id, kind: "installed" }).orderBy("seq", "desc").limit(1);
    expect(Number(removedEntry.tsn_minutes) - Number(installEntry.tsn_minutes)).toBe(Number(removedEntry.aircraft_minutes) - Number(installEntry.aircraft_minutes));

    const mail = await waitForMail((m) => m.subject.includes(off.serialNumber));
    expect(mail.subject).toMatch(/^Unscheduled removal/);
    expect(mail.to.map((t) => t.address)).toContain("reliability@demo.threadline.test");

    // The same request again (a retry) returns the first answer, writing nothing new.
    const retry = await postSwap(technician, body, key);
    expect(retry.status).toBe(201);
    expect(retry.body).toEqual(response.body);
    // The same key with another body is refused.
    const reused = await postSwap(technician, { ...body, reason: "Something else" }, key);
    expect(reused.status).toBe(422);
    expect(reused.body.error.code).toBe("idempotency_key_reused");
  });

  it("requires an Idempotency-Key (422 naming it) and refuses bad fields with 422", async () => {
    const missingKey = await http().post("/api/swaps").set("cookie", technician).send({});
    expect(missingKey.status).toBe(422);
    expect(missingKey.body.error.fields).toHaveProperty("Idempotency-Key");
    const bad = await postSwap(technician, { registration: "Q-FRAC", positionCode: "", aircraftHours: "1:99", aircraftCycles: -1, performedAt: "soon", removed: null, installed: null, workOrder: "" });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(["positionCode", "aircraftHours", "aircraftCycles", "performedAt", "workOrder"]));
  });

  it("answers each refusal with the contract's 409 code and a sentence a technician understands", async () => {
    const totals = await latestTotals("Q-FRAB");
    const base = { registration: "Q-FRAB", minutes: totals.minutes, cycles: totals.cycles };
    const fitted = await fittedAt("Q-FRAB", "B1-EBA1");
    const [spare] = await spares(ACTUATORS, 1);
    const elsewhere = await fittedAt("Q-FRAA", "B1-EBA1");

    const mismatch = await postSwap(technician, swapBody({ ...base, positionCode: "B1-EBA1", removed: { partNumber: fitted.partNumber, serialNumber: "NOT-THIS-ONE" }, installed: spare }));
    expect(mismatch.status).toBe(409);
    expect(mismatch.body.error.code).toBe("position_mismatch");
    expect(mismatch.body.error.message).toContain(fitted.serialNumber);

    const fittedElsewhere = await postSwap(technician, swapBody({ ...base, positionCode: "B1-EBA1", removed: fitted, installed: elsewhere }));
    expect(fittedElsewhere.body.error.code).toBe("part_fitted_elsewhere");
    expect(fittedElsewhere.body.error.message).toContain("Q-FRAA");

    const [battery] = await spares(["QF-2431-10"], 1);
    const notEligible = await postSwap(technician, swapBody({ ...base, positionCode: "B1-EBA1", removed: fitted, installed: battery }));
    expect(notEligible.body.error.code).toBe("not_eligible");

    const unserviceable = await testDb()("parts as pt").join("part_numbers as pn", "pn.id", "pt.part_number_id").whereIn("pn.part_number", ACTUATORS).andWhere("pt.status", "unserviceable").first("pt.serial_number as serialNumber", "pn.part_number as partNumber");
    const notServiceable = await postSwap(technician, swapBody({ ...base, positionCode: "B1-EBA1", removed: fitted, installed: unserviceable }));
    expect(notServiceable.body.error.code).toBe("part_not_serviceable");

    const regression = await postSwap(technician, swapBody({ ...base, minutes: totals.minutes - 60, positionCode: "B1-EBA1", removed: fitted, installed: spare }));
    expect(regression.body.error.code).toBe("time_regression");

    // A unit at its cycle limit: the retraction actuator's limit is 20,000 cycles in the demo catalog.
    const [worn] = await spares(["QF-3231-10"], 1);
    await testDb()("parts").where({ id: worn.id }).update({ csn: 20_000 });
    const raFitted = await fittedAt("Q-FRAB", "MLG-L-RA");
    const lifeExceeded = await postSwap(technician, swapBody({ ...base, positionCode: "MLG-L-RA", removed: raFitted, installed: worn }));
    expect(lifeExceeded.status).toBe(409);
    expect(lifeExceeded.body.error.code).toBe("life_exceeded");

    // Nothing of the refused attempts was written.
    expect((await fittedAt("Q-FRAB", "B1-EBA1")).serialNumber).toBe(fitted.serialNumber);
    expect((await verifyLedger()).ok).toBe(true);
  });

  it("refuses a role that does not sign maintenance records", async () => {
    const stores = await signInAs("stores");
    const response = await postSwap(stores, {});
    expect(response.status).toBe(403);
  });

  it("refuses a signer whose licence has expired, naming the expiry", async () => {
    await testDb()("users").where({ id: "usr-inspector" }).update({ licence_expires_on: "2026-01-31" });
    try {
      const cookie = await signInAs("inspector");
      const totals = await latestTotals("Q-FRBB");
      const fitted = await fittedAt("Q-FRBB", "B1-EBA1");
      const [spare] = await spares(ACTUATORS, 1);
      const response = await postSwap(cookie, swapBody({ registration: "Q-FRBB", positionCode: "B1-EBA1", minutes: totals.minutes, cycles: totals.cycles, removed: fitted, installed: spare }));
      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe("licence_expired");
      expect(response.body.error.message).toContain("2026-01-31");
    } finally {
      await testDb()("users").where({ id: "usr-inspector" }).update({ licence_expires_on: "2028-06-30" });
    }
  });

  it("needs an inspector's countersignature where the position requires an independent inspection", async () => {
    const totals = await latestTotals("Q-FRBA");
    const fitted = await fittedAt("Q-FRBA", "NLG-STEER");
    const [spare] = await spares(["QF-3251-10"], 1);
    const response = await postSwap(technician, swapBody({ registration: "Q-FRBA", positionCode: "NLG-STEER", minutes: totals.minutes, cycles: totals.cycles, removed: fitted, installed: spare }));
    expect(response.status, response.text).toBe(201);
    expect(response.body.swap.status).toBe("awaiting_inspection");
    const id = response.body.swap.id;

    const waiting = await http().get("/inspections").set("cookie", inspector);
    expect(waiting.status).toBe(200);
    expect(waiting.text).toContain(spare.serialNumber);
    expect((await http().get("/inspections").set("cookie", technician)).status).toBe(403);

    expect((await http().post(`/api/swaps/${id}/inspection`).set("cookie", technician)).status).toBe(403);
    const signed = await http().post(`/api/swaps/${id}/inspection`).set("cookie", inspector);
    expect(signed.status).toBe(200);
    expect(signed.body.swap.status).toBe("complete");
    expect((await http().post(`/api/swaps/${id}/inspection`).set("cookie", inspector)).status).toBe(409);
  });

  it("lets exactly one of 20 concurrent conflicting swaps on one position win; the ledger still verifies", async () => {
    const totals = await latestTotals("Q-FRAD");
    const off = await fittedAt("Q-FRAD", "B4-EBA2");
    const candidates = await spares(ACTUATORS, 20);
    const responses = await Promise.all(
      candidates.map((on) => postSwap(technician, swapBody({ registration: "Q-FRAD", positionCode: "B4-EBA2", minutes: totals.minutes + 5, cycles: totals.cycles, removed: off, installed: on }))),
    );
    const statuses = responses.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    expect(responses.filter((r) => r.status === 409).every((r) => r.body.error.code === "position_mismatch")).toBe(true);

    const verification = await verifyLedger();
    expect(verification.ok).toBe(true);
    expect(await fittedProjection()).toEqual(await fittedRebuiltFromLedger());
  });

  it("answers 10 concurrent retries of one swap (same key, same body) with the same 201 and records it once", async () => {
    const totals = await latestTotals("Q-FRAB");
    const off = await fittedAt("Q-FRAB", "B2-EBA3");
    const [on] = await spares(ACTUATORS, 1);
    const installedEntries = () => testDb()("ledger_entries").where({ part_id: on.id, kind: "installed" }).count({ n: "*" });
    const [before] = await installedEntries();
    const key = randomUUID();
    const body = swapBody({ registration: "Q-FRAB", positionCode: "B2-EBA3", minutes: totals.minutes + 5, cycles: totals.cycles, removed: off, installed: on });
    const responses = await Promise.all(Array.from({ length: 10 }, () => postSwap(technician, body, key)));
    expect(responses.map((r) => r.status)).toEqual(Array(10).fill(201));
    expect(new Set(responses.map((r) => r.body.swap.id)).size).toBe(1);
    expect(await testDb()("swaps").where({ idempotency_key: key }).count({ n: "*" })).toEqual([{ n: 1 }]);
    expect(await installedEntries()).toEqual([{ n: Number(before.n) + 1 }]);
  });
});

describe("recordSwap in the caller's transaction (how the demo history is recorded)", () => {
  it("writes with the same checks, the caller's clock and swap id, and leaves nothing when the caller rolls back", async () => {
    // The server module reads its connection from the environment on first use.
    Object.assign(process.env, testEnv());
    const { recordSwap } = await import("../../src/server/swaps");
    const { db } = await import("../../src/server/db");
    const { SwapSchema } = await import("../../src/lib/schemas/swaps");
    const { demoActor } = await import("../../seeds/replay/support");
    const actor = await demoActor(testDb(), "technician");
    const totals = await latestTotals("Q-FRBB");
    const off = await fittedAt("Q-FRBB", "B3-EBA2");
    const [on] = await spares(ACTUATORS, 1);
    const now = new Date(Date.now() - 60 * 60_000);
    const body = swapBody({ registration: "Q-FRBB", positionCode: "B3-EBA2", minutes: totals.minutes, cycles: totals.cycles, removed: off, installed: on, performedAt: new Date(now.getTime() - 20 * 60_000).toISOString() });
    const input = { swap: SwapSchema.parse(body), rawBody: body, idempotencyKey: randomUUID(), actor, now, id: randomUUID() };

    try {
      const before = await dbFingerprint();
      await expect(db().transaction(async (trx) => {
        await recordSwap({ ...input, trx });
        throw new Error("the caller rolls back");
      })).rejects.toThrow("the caller rolls back");
      expect(await dbFingerprint()).toBe(before);
      // A refusal comes out of the caller's transaction as the same 409.
      const refused = db().transaction((trx) => recordSwap({ ...input, idempotencyKey: randomUUID(), swap: { ...input.swap, removed: { ...off, serialNumber: "NOT-THIS-ONE" } }, trx }));
      await expect(refused).rejects.toMatchObject({ status: 409, code: "position_mismatch" });

      const result = await db().transaction((trx) => recordSwap({ ...input, trx }));
      expect(result.body.swap.id).toBe(input.id);
      expect((await fittedAt("Q-FRBB", "B3-EBA2")).serialNumber).toBe(on.serialNumber);
      const entries = await testDb()("ledger_entries").whereIn("seq", result.body.entries.map((e) => e.seq));
      expect(entries.map((e) => new Date(e.recorded_at).toISOString())).toEqual([now.toISOString(), now.toISOString()]);
      const mail = await testDb()("mail_outbox").where("subject", "like", `%${off.serialNumber} from Q-FRBB B3-EBA2%`).orderBy("id", "desc").first();
      expect(new Date(mail.created_at).toISOString()).toBe(now.toISOString());
      expect((await verifyLedger()).ok).toBe(true);
      expect(await fittedProjection()).toEqual(await fittedRebuiltFromLedger());
    } finally {
      await db().destroy();
    }
  });
});

describe("POST /api/swaps/check", () => {
  it("shows the pre-install checks without writing anything", async () => {
    const totals = await latestTotals("Q-FRAA");
    const fitted = await fittedAt("Q-FRAA", "B2-EBA4");
    const [spare] = await spares(ACTUATORS, 1);
    const before = await testDb()("ledger_head").first();
    const response = await http()
      .post("/api/swaps/check")
      .set("cookie", technician)
      .send({ registration: "Q-FRAA", positionCode: "B2-EBA4", aircraftHours: totals.minutes / 60, aircraftCycles: totals.cycles, removed: fitted, installed: spare });
    expect(response.status).toBe(200);
    expect(response.body.ok).toBe(true);
    expect(response.body.checks.map((c: { name: string }) => c.name)).toEqual(expect.arrayContaining(["snapshot", "off part", "eligibility", "status", "certificate", "life"]));
    expect(await testDb()("ledger_head").first()).toEqual(before);
  });
});
