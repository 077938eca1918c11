import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ChainVerifier, GENESIS_HASH, chainEntry, verifyChain } from "@/domain/ledger-hash";
import { MISSING_PREV_HASH, joinSegmentOutcomes, planSegmentRanges, type SegmentOutcome } from "@/domain/ledger-segments";
import type { ChainedLedgerEntry, LedgerEntryFields } from "@/domain/ledger-types";

// Invented entries: a made-up unit moving between made-up aircraft.
function buildChain(length: number): ChainedLedgerEntry[] {
  const chain: ChainedLedgerEntry[] = [];
  let prev = GENESIS_HASH;
  for (let seq = 1; seq <= length; seq++) {
    const fields: LedgerEntryFields = {
      seq, kind: seq % 2 ? "installed" : "removed", partId: 700 + (seq % 3), aircraftId: 4, positionId: 10 + (seq % 5),
      occurredAt: new Date(Date.UTC(2026, 0, 1, 0, seq)).toISOString(), recordedAt: new Date(Date.UTC(2026, 0, 1, 0, seq, 30)).toISOString(),
      recordedBy: "u-tech-02", aircraftMinutes: 60_000 + seq * 90, aircraftCycles: 900 + seq, tsnMinutes: seq * 60, csn: seq, tsoMinutes: null, cso: null,
      removalType: seq % 2 ? null : "scheduled", reason: seq % 2 ? null : "Planned exchange", workOrder: `WO-${seq}`, taskReference: "32-42-11-400-801",
      testResult: seq % 2 ? "Operational test satisfactory" : null, documentId: null, correctsSeq: null, details: seq % 4 === 0 ? { bin: `B-${seq}` } : null,
    };
    const chained = chainEntry(prev, fields);
    chain.push(chained);
    prev = chained.hash;
  }
  return chain;
}

/** What the database hands back for `seq BETWEEN first AND last ORDER BY seq`. */
function rowsIn(rows: ChainedLedgerEntry[], firstSeq: number, lastSeq: number) {
  return rows.filter((row) => row.seq >= firstSeq && row.seq <= lastSeq).sort((a, b) => a.seq - b.seq);
}

/** Verifies one range as a worker does: from the stored hash of the entry before it. */
function verifyRange(rows: ChainedLedgerEntry[], firstSeq: number, lastSeq: number): SegmentOutcome {
  const before = rows.find((row) => row.seq === firstSeq - 1);
  const verifier = new ChainVerifier(firstSeq === 1 ? GENESIS_HASH : (before?.hash ?? MISSING_PREV_HASH), firstSeq);
  const inRange = rowsIn(rows, firstSeq, lastSeq);
  let lastSeenSeq: number | null = null;
  for (const row of inRange) {
    lastSeenSeq = row.seq;
    if (!verifier.push(row).ok) break;
  }
  return { firstSeq, lastSeq, verification: verifier.result(), firstSeenSeq: inRange[0]?.seq ?? null, lastSeenSeq };
}

/** The single pass the segments must agree with, and the last seq it read. */
function singlePass(rows: ChainedLedgerEntry[], headSeq: number) {
  const inOrder = rowsIn(rows, 1, headSeq);
  const verification = verifyChain(inOrder);
  const lastSeenSeq = verification.ok ? (inOrder.at(-1)?.seq ?? 0) : undefined;
  return { verification, lastSeenSeq };
}

type Tamper =
  | { kind: "alter"; at: number; field: "reason" | "workOrder" | "csn" | "hash" | "prevHash" | "occurredAt" }
  | { kind: "delete"; at: number; count: number }
  | { kind: "swapContents"; at: number; with: number }
  | { kind: "none" };

function applyTamper(chain: ChainedLedgerEntry[], tamper: Tamper): ChainedLedgerEntry[] {
  const rows = chain.map((row) => ({ ...row }));
  if (tamper.kind === "alter") {
    const row = rows[tamper.at % rows.length];
    if (tamper.field === "csn") row.csn = (row.csn ?? 0) + 1;
    else if (tamper.field === "occurredAt") row.occurredAt = new Date(Date.parse(row.occurredAt) + 1000).toISOString();
    else if (tamper.field === "hash" || tamper.field === "prevHash") row[tamper.field] = (row[tamper.field][0] === "a" ? "b" : "a") + row[tamper.field].slice(1);
    else row[tamper.field] = (row[tamper.field] ?? "") + " (edited)";
  }
  if (tamper.kind === "delete") rows.splice(tamper.at % rows.length, tamper.count);
  if (tamper.kind === "swapContents") {
    // Two rows exchange everything but their seq, as an UPDATE behind the triggers' back could do.
    const a = rows[tamper.at % rows.length];
    const b = rows[tamper.with % rows.length];
    const aSeq = a.seq;
    const bSeq = b.seq;
    const copy = { ...a };
    Object.assign(a, b, { seq: aSeq });
    Object.assign(b, copy, { seq: bSeq });
  }
  return rows;
}

const tampers: fc.Arbitrary<Tamper> = fc.oneof(
  fc.constant({ kind: "none" as const }),
  fc.record({ kind: fc.constant("alter" as const), at: fc.nat(), field: fc.constantFrom("reason" as const, "workOrder" as const, "csn" as const, "hash" as const, "prevHash" as const, "occurredAt" as const) }),
  fc.record({ kind: fc.constant("delete" as const), at: fc.nat(), count: fc.integer({ min: 1, max: 12 }) }),
  fc.record({ kind: fc.constant("swapContents" as const), at: fc.nat(), with: fc.nat() }),
);

describe("planSegmentRanges", () => {
  it("covers 1..lastSeq with consecutive ranges of at least the minimum size", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5_000 }), fc.integer({ min: 1, max: 8 }), fc.integer({ min: 1, max: 2_000 }), (lastSeq, maxSegments, minSize) => {
        const ranges = planSegmentRanges(lastSeq, maxSegments, minSize);
        expect(ranges[0].firstSeq).toBe(1);
        expect(ranges.at(-1)!.lastSeq).toBe(lastSeq);
        expect(ranges.length).toBeLessThanOrEqual(maxSegments);
        for (let i = 1; i < ranges.length; i++) expect(ranges[i].firstSeq).toBe(ranges[i - 1].lastSeq + 1);
        if (ranges.length > 1) for (const range of ranges) expect(range.lastSeq - range.firstSeq + 1).toBeGreaterThanOrEqual(minSize);
      }),
    );
  });

  it("keeps a ledger smaller than two minimum segments in one range, and an empty one in none", () => {
    expect(planSegmentRanges(150, 4, 100)).toEqual([{ firstSeq: 1, lastSeq: 150 }]);
    expect(planSegmentRanges(400, 4, 100)).toEqual([
      { firstSeq: 1, lastSeq: 100 }, { firstSeq: 101, lastSeq: 200 }, { firstSeq: 201, lastSeq: 300 }, { firstSeq: 301, lastSeq: 400 },
    ]);
    expect(planSegmentRanges(0, 4, 100)).toEqual([]);
  });
});

describe("joinSegmentOutcomes", () => {
  const chain = buildChain(60);

  it("gives the single pass's answer for any tampering and any split", () => {
    fc.assert(
      fc.property(tampers, fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 30 }), (tamper, maxSegments, minSize) => {
        const rows = applyTamper(chain, tamper);
        const headSeq = chain.length;
        const outcomes = planSegmentRanges(headSeq, maxSegments, minSize).map((range) => verifyRange(rows, range.firstSeq, range.lastSeq));
        const joined = joinSegmentOutcomes(outcomes, GENESIS_HASH);
        const expected = singlePass(rows, headSeq);
        expect(joined.verification).toEqual(expected.verification);
        if (expected.verification.ok) expect(joined.lastSeenSeq).toBe(expected.lastSeenSeq);
      }),
      { numRuns: 2_000 },
    );
  });

  it("names an entry deleted at a segment boundary as a seq gap at its seq", () => {
    const rows = chain.filter((row) => row.seq !== 30);
    const outcomes = [verifyRange(rows, 1, 30), verifyRange(rows, 31, 60)];
    expect(joinSegmentOutcomes(outcomes, GENESIS_HASH).verification).toEqual({ ok: false, brokenAt: 30, reason: "seq_gap", entries: 29, foundSeq: 31 });
  });

  it("names an altered entry in a later segment with the count of every intact entry before it", () => {
    const rows = applyTamper(chain, { kind: "alter", at: 44, field: "reason" });
    const outcomes = [verifyRange(rows, 1, 20), verifyRange(rows, 21, 40), verifyRange(rows, 41, 60)];
    expect(joinSegmentOutcomes(outcomes, GENESIS_HASH).verification).toEqual({ ok: false, brokenAt: 45, reason: "hash_mismatch", entries: 44, foundSeq: 45 });
  });

  it("leaves entries missing at the end of the ledger to the head check: ok, with the last seq read", () => {
    const rows = chain.filter((row) => row.seq <= 50);
    const joined = joinSegmentOutcomes([verifyRange(rows, 1, 30), verifyRange(rows, 31, 60)], GENESIS_HASH);
    expect(joined).toEqual({ verification: { ok: true, entries: 50, head: chain[49].hash }, lastSeenSeq: 50 });
  });
});
