import { beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";
import { appendTestEntries } from "../support/ledger-append";

// The position map's findings counts come from a cache (thread_findings). These tests change what a
// count depends on - the unit's thread, and the catalog behind the app's back - and expect the map to
// show the new count on the next read, never the cached one.

let technician: string;
beforeAll(async () => {
  technician = await signInAs("technician");
});

interface MapPosition {
  id: number;
  code: string;
  state: string;
  findings: number;
  fitted: { partId: number; serialNumber: string } | null;
}

async function positionsOf(registration: string): Promise<MapPosition[]> {
  const response = await http().get(`/api/aircraft/${registration}`).set("cookie", technician);
  expect(response.status).toBe(200);
  return response.body.positions;
}

/** A fitted unit with a clean thread on a demo aircraft (the map is read once, which fills the cache). */
async function cleanFittedUnit(registration: string): Promise<MapPosition & { fitted: NonNullable<MapPosition["fitted"]> }> {
  const positions = await positionsOf(registration);
  const position = positions.find((p) => p.fitted && p.findings === 0 && p.state === "fitted");
  expect(position, `some unit on ${registration} has no finding`).toBeDefined();
  return position as MapPosition & { fitted: NonNullable<MapPosition["fitted"]> };
}

const countAt = async (registration: string, code: string) => (await positionsOf(registration)).find((p) => p.code === code)!.findings;

describe("findings counts on the position map", () => {
  it("are cached per unit with the thread's newest seq and the catalog revision", async () => {
    const position = await cleanFittedUnit("Q-FRAC");
    const db = testDb();
    const row = await db("thread_findings").where({ part_id: position.fitted.partId }).first();
    const [{ last }] = await db("ledger_entries").where({ part_id: position.fitted.partId }).max("seq as last");
    const revision = await db("catalog_revision").where({ id: 1 }).first("revision");
    expect(row).toMatchObject({ finding_count: 0, through_seq: Number(last), catalog_revision: Number(revision.revision) });
  });

  it("follow a change to the unit's thread", async () => {
    const position = await cleanFittedUnit("Q-FRAC");
    const db = testDb();
    const part = await db("parts").where({ id: position.fitted.partId }).first("tsn_minutes", "csn");
    const fitted = await db("fitted").where({ part_id: position.fitted.partId }).first();
    // A shop entry saying the unit, still fitted, was repaired with less time than it had when fitted:
    // two findings at once (repaired while fitted, and a time regression) in the thread.
    await appendTestEntries([
      { kind: "repaired", partId: position.fitted.partId, occurredAt: new Date().toISOString(), recordedBy: "usr-stores", tsnMinutes: Math.max(0, Number(fitted.tsn_minutes_at_install) - 600), csn: Number(part.csn) },
    ]);
    expect(await countAt("Q-FRAC", position.code)).toBeGreaterThan(0);
  });

  it("follow a change to the catalog made behind the app's back", async () => {
    const position = await cleanFittedUnit("Q-FRAD");
    const db = testDb();
    const eligibility = await db("position_eligibility").where({ position_id: position.id });
    expect(eligibility.length).toBeGreaterThan(0);
    const before = await db("catalog_revision").where({ id: 1 }).first("revision");
    await db("position_eligibility").where({ position_id: position.id }).delete();
    try {
      const after = await db("catalog_revision").where({ id: 1 }).first("revision");
      expect(Number(after.revision)).toBeGreaterThan(Number(before.revision));
      // Nothing may be fitted at a position no part number is eligible for: the unit there is flagged.
      expect(await countAt("Q-FRAD", position.code)).toBeGreaterThan(0);
    } finally {
      await db("position_eligibility").insert(eligibility);
    }
    expect(await countAt("Q-FRAD", position.code)).toBe(0);
  });
});
