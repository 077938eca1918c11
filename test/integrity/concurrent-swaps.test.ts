// Many technicians at once: conflicting swaps on one position must have one winner, and swaps on
// different positions must all land, with nothing lost, doubled or left out of the chain.
import { beforeAll, describe, expect, it } from "vitest";
import { signInAs, testDb } from "../support/api";
import { fittedProjection, fittedRebuiltFromLedger, verifyLedger } from "../support/ledger";
import { fittedAt, latestTotals, postSwap, swapBody } from "../support/swaps";
import { ledgerCount, positionsWithEligibleSpares, receiveSpares } from "./integrity-support";

let technician: string;
let stores: string;
beforeAll(async () => {
  technician = await signInAs("technician");
  stores = await signInAs("stores");
});

async function expectLedgerConsistent() {
  const verified = await verifyLedger();
  expect(verified.ok, JSON.stringify(verified)).toBe(true);
  expect([...(await fittedProjection())].sort()).toEqual([...(await fittedRebuiltFromLedger())].sort());
}

describe("concurrent swaps", () => {
  it("lets exactly one of 100 concurrent conflicting swaps on one position win (99 get 409)", async () => {
    const registration = "Q-FRAC";
    const positionCode = "B1-EBA1";
    const off = await fittedAt(registration, positionCode);
    const candidates = await receiveSpares(stores, Array.from({ length: 100 }, () => ({ partNumber: off.partNumber, cage: off.cage })));
    const totals = await latestTotals(registration);
    const before = await ledgerCount();
    const performedAt = new Date().toISOString();

    const responses = await Promise.all(
      candidates.map((on) => postSwap(technician, swapBody({ registration, positionCode, minutes: totals.minutes + 10, cycles: totals.cycles + 1, performedAt, removed: off, installed: on }))),
    );
    const statuses = responses.map((r) => r.status);
    const unexpected = responses.filter((r) => r.status !== 201 && r.status !== 409).map((r) => `${r.status} ${r.text}`);
    expect(unexpected).toEqual([]);
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(99);
    for (const loser of responses.filter((r) => r.status === 409)) expect(loser.body.error.code).toBe("position_mismatch");

    const winner = responses.find((r) => r.status === 201)!;
    expect(await ledgerCount()).toBe(before + 2);
    const installedSerial = candidates[responses.indexOf(winner)].serialNumber;
    expect((await fittedAt(registration, positionCode)).serialNumber).toBe(installedSerial);
    await expectLedgerConsistent();
  });

  it("lands all of 100 concurrent swaps on 100 different positions across the fleet", async () => {
    const positions = await positionsWithEligibleSpares(100);
    const spares = await receiveSpares(stores, positions.map((p) => ({ partNumber: p.partNumber, cage: p.cage })));
    const totalsByAircraft = new Map<string, { minutes: number; cycles: number }>();
    for (const registration of new Set(positions.map((p) => p.registration))) totalsByAircraft.set(registration, await latestTotals(registration));
    const before = await ledgerCount();
    const swapsBefore = Number((await testDb()("swaps").count({ count: "*" }))[0].count);
    const performedAt = new Date().toISOString();

    const responses = await Promise.all(
      positions.map((position, i) => {
        const totals = totalsByAircraft.get(position.registration)!;
        return postSwap(
          technician,
          swapBody({ registration: position.registration, positionCode: position.positionCode, minutes: totals.minutes + 20, cycles: totals.cycles + 1, performedAt, removed: position, installed: spares[i] }),
        );
      }),
    );
    const failures = responses.map((r, i) => (r.status === 201 ? null : `${positions[i].registration} ${positions[i].positionCode}: ${r.status} ${r.text}`)).filter(Boolean);
    expect(failures).toEqual([]);

    expect(await ledgerCount()).toBe(before + 200);
    expect(Number((await testDb()("swaps").count({ count: "*" }))[0].count)).toBe(swapsBefore + 100);
    const seqs = responses.flatMap((r) => r.body.entries.map((e: { seq: number }) => e.seq));
    expect(new Set(seqs).size).toBe(200);
    for (const [i, position] of positions.entries()) {
      expect((await fittedAt(position.registration, position.positionCode)).serialNumber).toBe(spares[i].serialNumber);
    }
    await expectLedgerConsistent();
  });
});
