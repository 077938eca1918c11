// mariadbd killed with SIGKILL while swaps are being recorded: after InnoDB's recovery every swap the
// app answered 201 is there in full, nothing is half-written, and retries with the same
// Idempotency-Key end exactly once.
import { execFile, spawn } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { serverArgs } from "../../scripts/lib/mariadb";
import { http, signInAs, testDb, testEnv } from "../support/api";
import { fittedProjection, fittedRebuiltFromLedger, verifyLedger } from "../support/ledger";
import { fittedAt, latestTotals, postSwap, swapBody } from "../support/swaps";
import { ledgerCount, positionsWithEligibleSpares, receiveSpares } from "./integrity-support";

const run = promisify(execFile);
const SWAPS = 40;
const CLIENTS = 4;

const dataDir = () => testEnv().DB_DATA_DIR ?? path.join(testEnv().TEST_TEMP_DIR, "mariadb");
const currentPid = () => Number(readFileSync(path.join(dataDir(), "mysqld.pid"), "utf8").trim());
const isAlive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

async function ping(): Promise<boolean> {
  try {
    await run("mariadb-admin", ["--no-defaults", `--socket=${path.join(dataDir(), "mysqld.sock")}`, "--connect-timeout=1", "ping"]);
    return true;
  } catch {
    return false;
  }
}

async function killDatabase(): Promise<void> {
  const pid = currentPid();
  process.kill(pid, "SIGKILL");
  while (isAlive(pid)) await new Promise((resolve) => setTimeout(resolve, 20));
}

/** Starts mariadbd on the same data directory and port; InnoDB replays its redo log before it answers. */
async function restartDatabase(): Promise<void> {
  const child = spawn("mariadbd", serverArgs(dataDir(), Number(testEnv().DB_PORT)), { detached: true, stdio: "ignore" });
  child.unref();
  for (let attempt = 0; attempt < 600; attempt++) {
    if (await ping()) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`mariadbd did not come back; see ${dataDir()}/mysqld.err`);
}

/** The test's own pool also lost its connections; retry a read until the pool has reconnected. */
async function dbReady(): Promise<void> {
  for (let attempt = 0; attempt < 50; attempt++) {
    try {
      await testDb().raw("SELECT 1");
      return;
    } catch {
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }
  throw new Error("the test's database pool did not reconnect");
}

interface Attempt {
  key: string;
  body: ReturnType<typeof swapBody>;
  status: number | "connection error";
  answer?: unknown;
}

let technician: string;
afterAll(async () => {
  // Leave a running server for the suites after this one whatever happened here.
  if (!(await ping())) await restartDatabase();
});

describe("crash recovery", () => {
  beforeAll(async () => {
    technician = await signInAs("technician");
  });

  it("keeps every answered swap whole across a kill -9 of mariadbd, and retries end exactly once", async () => {
    const stores = await signInAs("stores");
    const positions = await positionsWithEligibleSpares(SWAPS);
    const spares = await receiveSpares(stores, positions.map((p) => ({ partNumber: p.partNumber, cage: p.cage })));
    const performedAt = new Date().toISOString();
    const attempts: Attempt[] = [];
    for (const [i, position] of positions.entries()) {
      const totals = await latestTotals(position.registration);
      attempts.push({
        key: `crash-${performedAt}-${i}`,
        body: swapBody({ registration: position.registration, positionCode: position.positionCode, minutes: totals.minutes + 30, cycles: totals.cycles + 1, performedAt, removed: position, installed: spares[i] }),
        status: "connection error",
      });
    }
    const ledgerBefore = await ledgerCount();
    const swapsBefore = Number((await testDb()("swaps").count({ count: "*" }))[0].count);

    // A few clients swapping in a loop; the database is killed once a handful have been answered.
    let next = 0;
    let answered = 0;
    let killed: Promise<void> | null = null;
    await Promise.all(
      Array.from({ length: CLIENTS }, async () => {
        while (next < attempts.length) {
          const attempt = attempts[next++];
          try {
            const response = await postSwap(technician, attempt.body, attempt.key).timeout({ response: 30_000 });
            attempt.status = response.status;
            attempt.answer = response.body;
            if (response.status === 201) answered++;
          } catch {
            attempt.status = "connection error";
          }
          if (answered >= 8 && !killed) killed = killDatabase();
          if (killed) await killed;
        }
      }),
    );
    expect(killed, "the database was killed mid-run").not.toBeNull();

    const during = attempts.filter((a) => a.status !== 201);
    expect(during.length, "some swaps were attempted while the database was down").toBeGreaterThan(0);
    // During the outage a refusal is a 5xx or a dropped connection, never a 4xx that would tell the client to give up.
    for (const attempt of during) {
      expect(attempt.status === "connection error" || (typeof attempt.status === "number" && attempt.status >= 500), `${attempt.status} ${JSON.stringify(attempt.answer)}`).toBe(true);
    }
    const outage = await http().get("/api/session").set("cookie", technician);
    expect(outage.status).toBeGreaterThanOrEqual(500);

    await restartDatabase();
    await dbReady();

    // The app reconnects by itself: once one request has gone through, the following ones answer normally.
    let recovered = false;
    for (let attempt = 0; attempt < 50 && !recovered; attempt++) {
      recovered = (await http().get("/api/session").set("cookie", technician)).status === 200;
      if (!recovered) await new Promise((resolve) => setTimeout(resolve, 200));
    }
    expect(recovered, "the app answers after the restart").toBe(true);
    for (let i = 0; i < 5; i++) expect((await http().get("/api/aircraft").set("cookie", technician)).status).toBe(200);

    // Every swap answered 201 survived in full.
    const confirmed = attempts.filter((a) => a.status === 201);
    for (const attempt of confirmed) {
      const answer = attempt.answer as { swap: { id: string }; entries: Array<{ seq: number; kind: string; hash: string }> };
      const swap = await testDb()("swaps").where({ id: answer.swap.id }).first();
      expect(swap, `swap ${answer.swap.id}`).toBeTruthy();
      const entries = await testDb()("ledger_entries").whereIn("seq", answer.entries.map((e) => e.seq)).orderBy("seq");
      expect(entries.map((e) => [Number(e.seq), e.kind, e.hash])).toEqual(answer.entries.map((e) => [e.seq, e.kind, e.hash]));
      expect((await fittedAt(attempt.body.registration, attempt.body.positionCode)).serialNumber).toBe(attempt.body.installed!.serialNumber);
    }
    await expectNothingHalfWritten();
    const swapsAfterCrash = Number((await testDb()("swaps").count({ count: "*" }))[0].count) - swapsBefore;
    expect(await ledgerCount()).toBe(ledgerBefore + 2 * swapsAfterCrash);

    // Every attempt retried with its own key: the confirmed ones answer the same, the rest land now (or 409), once.
    for (const attempt of attempts) {
      const retry = await postSwap(technician, attempt.body, attempt.key);
      if (attempt.status === 201) {
        expect(retry.status).toBe(201);
        expect(retry.body).toEqual(attempt.answer);
      } else {
        expect([201, 409], `${retry.status} ${retry.text}`).toContain(retry.status);
      }
      const again = await postSwap(technician, attempt.body, attempt.key);
      expect(again.status).toBe(retry.status);
      if (retry.status === 201) expect(again.body).toEqual(retry.body);
    }
    const swapsAfterRetries = Number((await testDb()("swaps").count({ count: "*" }))[0].count) - swapsBefore;
    expect(swapsAfterRetries).toBeLessThanOrEqual(SWAPS);
    expect(await ledgerCount()).toBe(ledgerBefore + 2 * swapsAfterRetries);
    const keys = await testDb()("swaps").whereIn("idempotency_key", attempts.map((a) => a.key)).select("idempotency_key");
    expect(keys.length).toBe(swapsAfterRetries);
    await expectNothingHalfWritten();
  });
});

/** Each swap row has both its entries, the chain verifies, and fitted and parts agree with the ledger. */
async function expectNothingHalfWritten() {
  const verified = await verifyLedger();
  expect(verified.ok, JSON.stringify(verified)).toBe(true);
  expect([...(await fittedProjection())].sort()).toEqual([...(await fittedRebuiltFromLedger())].sort());
  const orphans = await testDb()("swaps as s")
    .leftJoin("ledger_entries as r", "r.seq", "s.removed_seq")
    .leftJoin("ledger_entries as i", "i.seq", "s.installed_seq")
    .where((q) => q.where((w) => w.whereNotNull("s.removed_seq").whereNull("r.seq")).orWhere((w) => w.whereNotNull("s.installed_seq").whereNull("i.seq")))
    .select("s.id");
  expect(orphans).toEqual([]);
  // A fitted unit is installed; an installed unit is fitted.
  const mismatched = await testDb()("parts as pt")
    .leftJoin("fitted as f", "f.part_id", "pt.id")
    .where((q) => q.where((w) => w.where("pt.status", "installed").whereNull("f.part_id")).orWhere((w) => w.whereNot("pt.status", "installed").whereNotNull("f.part_id")))
    .select("pt.id", "pt.status");
  expect(mismatched).toEqual([]);
}
