import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { DomainInputError } from "@/domain/errors";
import {
  ChainVerifier,
  GENESIS_HASH,
  canonicalEncodeEntry,
  chainEntry,
  computeEntryHash,
  verifyChain,
} from "@/domain/ledger-hash";
import { instantToEpochMs, normaliseInstant } from "@/domain/flight-time";
import type { ChainedLedgerEntry, LedgerEntryFields } from "@/domain/ledger-types";

// Invented data throughout: part numbers, serials, users and work orders are made up.
function entry(overrides: Partial<LedgerEntryFields> = {}): LedgerEntryFields {
  return {
    seq: 1,
    kind: "installed",
    partId: 4410,
    aircraftId: 12,
    positionId: 31,
    occurredAt: "2026-03-01T10:15:00.000Z",
    recordedAt: "2026-03-01T10:20:00.000Z",
    recordedBy: "u-tech-07",
    aircraftMinutes: 1_234_530,
    aircraftCycles: 20_411,
    tsnMinutes: 74_070,
    csn: 1_502,
    tsoMinutes: null,
    cso: null,
    removalType: null,
    reason: null,
    workOrder: "WO-2026-0042",
    taskReference: "32-42-11-400-801",
    testResult: "Operational test satisfactory",
    documentId: null,
    correctsSeq: null,
    details: null,
    ...overrides,
  };
}

function buildChain(fields: LedgerEntryFields[], start = GENESIS_HASH): ChainedLedgerEntry[] {
  const chain: ChainedLedgerEntry[] = [];
  let prev = start;
  for (const f of fields) {
    const linked = chainEntry(prev, f);
    chain.push(linked);
    prev = linked.hash;
  }
  return chain;
}

const thread: LedgerEntryFields[] = [
  entry({ seq: 1, kind: "received", aircraftId: null, positionId: null, aircraftMinutes: null, aircraftCycles: null, documentId: 900, details: { bin: "S-04", tag: "T-118" } }),
  entry({ seq: 2, kind: "installed" }),
  entry({ seq: 3, kind: "removed", removalType: "unscheduled", reason: "Brake wear pin at limit", aircraftMinutes: 1_240_530, tsnMinutes: 80_070, csn: 1_600, aircraftCycles: 20_509 }),
  entry({ seq: 4, kind: "sent_for_repair", aircraftId: null, positionId: null, details: { shop: "Invented Repair Shop", order: "RO-7" } }),
  entry({ seq: 5, kind: "repaired", aircraftId: null, positionId: null, tsoMinutes: 0, cso: 0, documentId: 901 }),
  entry({ seq: 6, kind: "corrected", correctsSeq: 3, reason: "Brake wear pin at limit (corrected)" }),
];

describe("canonicalEncodeEntry", () => {
  it("lists the values in field order, nulls explicit, details keys sorted", () => {
    const encoded = canonicalEncodeEntry(entry({ details: { tag: "T-1", bin: "S-04" } }));
    expect(encoded).toBe(
      '[1,"installed",4410,12,31,"2026-03-01T10:15:00.000Z","2026-03-01T10:20:00.000Z","u-tech-07",' +
        '1234530,20411,74070,1502,null,null,null,null,"WO-2026-0042","32-42-11-400-801",' +
        '"Operational test satisfactory",null,null,{"bin":"S-04","tag":"T-1"}]',
    );
    expect(JSON.parse(encoded)).toHaveLength(22);
  });

  it("does not depend on the order details were built in, integer-like keys included", () => {
    const a = canonicalEncodeEntry(entry({ details: { "9": "a", "10": "b", bin: "c" } }));
    const b = canonicalEncodeEntry(entry({ details: { bin: "c", "10": "b", "9": "a" } }));
    expect(a).toBe(b);
    expect(a).toContain('{"10":"b","9":"a","bin":"c"}');
  });

  it("tells an empty details map from none", () => {
    expect(canonicalEncodeEntry(entry({ details: {} }))).not.toBe(canonicalEncodeEntry(entry({ details: null })));
  });

  it("normalises strings to NFC, in fields and in details", () => {
    const composed = "Contr\u00f4le";
    const decomposed = "Contro\u0302le";
    expect(composed).not.toBe(decomposed);
    expect(canonicalEncodeEntry(entry({ reason: decomposed, details: { [decomposed]: decomposed } }))).toBe(
      canonicalEncodeEntry(entry({ reason: composed, details: { [composed]: composed } })),
    );
  });

  it("escapes quotes, backslashes and control characters as JSON does", () => {
    const reason = 'Tag says "U/S"\\ line\nnext';
    const encoded = canonicalEncodeEntry(entry({ reason }));
    expect(JSON.parse(encoded)[15]).toBe(reason);
  });

  it("normalises instants to UTC with milliseconds", () => {
    const variants = ["2026-03-01T10:15:00.000Z", "2026-03-01T10:15Z", "2026-03-01T10:15:00Z", "2026-03-01T11:15:00.000+01:00", "2026-03-01T05:15:00-05:00", "2026-03-01T10:15:00.0Z"];
    const encodings = new Set(variants.map((occurredAt) => canonicalEncodeEntry(entry({ occurredAt }))));
    expect(encodings.size).toBe(1);
    expect(normaliseInstant("2026-03-01T10:15:00.5Z")).toBe("2026-03-01T10:15:00.500Z");
    expect(normaliseInstant("2024-02-29T23:30:00.000-01:00")).toBe("2024-03-01T00:30:00.000Z");
    expect(normaliseInstant("0099-01-01T00:00:00.000Z")).toBe("0099-01-01T00:00:00.000Z");
    expect(instantToEpochMs("1970-01-01T00:00:00.001Z")).toBe(1);
  });

  it.each([
    ["garbage"],
    [""],
    ["2026-03-01"],
    ["2026-03-01T10:15:00"], // no zone: would depend on the machine's time zone
    ["2026-03-01 10:15:00.000Z"],
    ["2026-02-30T10:15:00.000Z"],
    ["2025-02-29T10:15:00.000Z"],
    ["2026-13-01T10:15:00.000Z"],
    ["2026-03-01T24:00:00.000Z"],
    ["2026-03-01T10:60:00.000Z"],
    ["2026-03-01T10:15:60.000Z"],
    ["2026-03-01T10:15:00.0001Z"], // finer than the database keeps
    ["2026-03-01T10:15:00.000+25:00"],
    ["March 1, 2026 10:15 UTC"],
  ])("refuses the instant %j", (occurredAt) => {
    expect(() => canonicalEncodeEntry(entry({ occurredAt }))).toThrow(DomainInputError);
  });

  it("refuses non-integer minutes and cycles, unknown kinds and non-string details", () => {
    expect(() => canonicalEncodeEntry(entry({ aircraftMinutes: 1.5 }))).toThrow(/aircraftMinutes/);
    expect(() => canonicalEncodeEntry(entry({ csn: Number.NaN }))).toThrow(/csn/);
    expect(() => canonicalEncodeEntry(entry({ seq: Number.MAX_SAFE_INTEGER + 1 }))).toThrow(/seq/);
    expect(() => canonicalEncodeEntry(entry({ kind: "borrowed" as never }))).toThrow(/kind/);
    expect(() => canonicalEncodeEntry(entry({ removalType: "sometimes" as never }))).toThrow(/removalType/);
    expect(() => canonicalEncodeEntry(entry({ details: { bin: 4 as never } }))).toThrow(/details\.bin/);
    expect(() => canonicalEncodeEntry(entry({ recordedBy: null as never }))).toThrow(/recordedBy/);
  });

  it("refuses details keys that collide after normalisation", () => {
    expect(() => canonicalEncodeEntry(entry({ details: { "Contr\u00f4le": "a", "Contro\u0302le": "b" } }))).toThrow(/same after normalisation/);
  });
});

describe("computeEntryHash", () => {
  it("is SHA-256 hex over prevHash, a newline and the canonical encoding", () => {
    const e = entry();
    const expected = createHash("sha256").update(GENESIS_HASH + "\n" + canonicalEncodeEntry(e)).digest("hex");
    expect(computeEntryHash(GENESIS_HASH, e)).toBe(expected);
    expect(GENESIS_HASH).toBe("0".repeat(64));
  });

  it("regression pin: a fixed entry's hash never changes", () => {
    // A regression pin, not a published check value: computed once from this implementation
    // (and cross-checked with Python's hashlib over the UTF-8 bytes of the same text). If it
    // fails, the encoding changed and every stored chain would stop verifying: do not re-pin
    // without a migration plan for existing ledgers.
    const pinned = entry({ details: { tag: "T-118", bin: "S-04" }, reason: "Contro\u0302le visuel" });
    expect(canonicalEncodeEntry(pinned)).toBe(
      '[1,"installed",4410,12,31,"2026-03-01T10:15:00.000Z","2026-03-01T10:20:00.000Z","u-tech-07",' +
        '1234530,20411,74070,1502,null,null,null,"Contr\u00f4le visuel","WO-2026-0042","32-42-11-400-801",' +
        '"Operational test satisfactory",null,null,{"bin":"S-04","tag":"T-118"}]',
    );
    expect(computeEntryHash(GENESIS_HASH, pinned)).toBe("d55226a8dac88f817879a3e538e31e8992642e0b37b6d0f4d68b3ca29767349d");
  });
});

describe("verifyChain", () => {
  const chain = buildChain(thread);

  it("verifies an intact chain and gives its head", () => {
    expect(verifyChain(chain)).toEqual({ ok: true, entries: 6, head: chain[5].hash });
  });

  it("verifies an empty chain as intact at the start hash", () => {
    expect(verifyChain([])).toEqual({ ok: true, entries: 0, head: GENESIS_HASH });
  });

  // One altered value per field kind; applied to every field of every entry below.
  function alter(key: keyof ChainedLedgerEntry, value: unknown): unknown {
    if (key === "kind") return value === "scrapped" ? "released" : "scrapped";
    if (key === "removalType") return value === "scheduled" ? "unscheduled" : "scheduled";
    if (key === "occurredAt" || key === "recordedAt") return new Date(Date.parse(value as string) + 1).toISOString();
    if (key === "details") return value === null ? { bin: "X" } : { ...(value as object), bin: "X-99" };
    if (key === "prevHash" || key === "hash") return ((value as string)[0] === "a" ? "b" : "a") + (value as string).slice(1);
    if (typeof value === "number") return value + 1;
    if (typeof value === "string") return value + " ";
    return key === "recordedBy" || key === "reason" || key === "workOrder" || key === "taskReference" || key === "testResult" ? "x" : 7;
  }

  const fields = Object.keys(chain[0]) as Array<keyof ChainedLedgerEntry>;

  it("names exactly the seq of any single altered field of any entry", () => {
    expect(fields).toHaveLength(24);
    for (let i = 0; i < chain.length; i++) {
      for (const key of fields) {
        const tampered = chain.map((e) => ({ ...e }));
        (tampered[i] as unknown as Record<string, unknown>)[key] = alter(key, chain[i][key]);
        const result = verifyChain(tampered);
        const reason = key === "seq" ? "seq_gap" : key === "prevHash" ? "prev_hash_mismatch" : "hash_mismatch";
        expect(result, `entry ${i + 1}, field ${key}`).toMatchObject({ ok: false, brokenAt: i + 1, reason, entries: i });
      }
    }
  });

  it("catches two entries swapped", () => {
    const swapped = [chain[0], chain[2], chain[1], ...chain.slice(3)];
    expect(verifyChain(swapped)).toMatchObject({ ok: false, brokenAt: 2, foundSeq: 3, reason: "seq_gap", entries: 1 });
  });

  it("catches two entries swapped and renumbered", () => {
    const renumbered = [chain[0], { ...chain[2], seq: 2 }, { ...chain[1], seq: 3 }, ...chain.slice(3)];
    expect(verifyChain(renumbered)).toMatchObject({ ok: false, brokenAt: 2, reason: "prev_hash_mismatch" });
  });

  it("catches a deleted entry as a seq gap at the missing seq", () => {
    const deleted = chain.filter((e) => e.seq !== 4);
    expect(verifyChain(deleted)).toMatchObject({ ok: false, brokenAt: 4, foundSeq: 5, reason: "seq_gap", entries: 3 });
  });

  it("catches a deleted first entry", () => {
    expect(verifyChain(chain.slice(1))).toMatchObject({ ok: false, brokenAt: 1, foundSeq: 2, reason: "seq_gap" });
  });

  it("catches a deleted last entry only against a known head", () => {
    // Truncating the tail leaves a valid shorter chain; the caller compares the head it gets
    // with the head row it stored.
    const result = verifyChain(chain.slice(0, -1));
    expect(result).toEqual({ ok: true, entries: 5, head: chain[4].hash });
    expect(result.ok && result.head).not.toBe(chain[5].hash);
  });

  it("catches a changed prevHash even when the entry was re-hashed to match it", () => {
    const forged = chain.map((e) => ({ ...e }));
    forged[3] = chainEntry("f".repeat(64), thread[3]);
    expect(verifyChain(forged)).toMatchObject({ ok: false, brokenAt: 4, reason: "prev_hash_mismatch" });
  });

  it("catches an entry re-hashed after an edit at the next entry", () => {
    const forged = chain.map((e) => ({ ...e }));
    forged[2] = chainEntry(chain[1].hash, { ...thread[2], reason: "Routine" });
    expect(verifyChain(forged)).toMatchObject({ ok: false, brokenAt: 4, reason: "prev_hash_mismatch" });
  });

  it("reports an entry that cannot be encoded as a hash mismatch, with the reason", () => {
    const broken = chain.map((e) => ({ ...e }));
    broken[1].occurredAt = "not a date";
    const result = verifyChain(broken);
    expect(result).toMatchObject({ ok: false, brokenAt: 2, reason: "hash_mismatch" });
    expect(!result.ok && result.detail).toMatch(/occurredAt/);
  });

  it("verifies from a checkpoint: a stored head and the seq after it", () => {
    const tail = chain.slice(3);
    expect(verifyChain(tail, chain[2].hash)).toEqual({ ok: true, entries: 3, head: chain[5].hash });
    expect(verifyChain(tail, chain[2].hash, 4)).toMatchObject({ ok: true });
    expect(verifyChain(tail, chain[2].hash, 5)).toMatchObject({ ok: false, brokenAt: 5, foundSeq: 4, reason: "seq_gap" });
    expect(verifyChain(tail, chain[1].hash)).toMatchObject({ ok: false, brokenAt: 4, reason: "prev_hash_mismatch" });
  });
});

describe("ChainVerifier", () => {
  const chain = buildChain(thread);

  it("takes entries one at a time and gives the same result as verifyChain", () => {
    const verifier = new ChainVerifier();
    for (const e of chain) expect(verifier.push(e)).toEqual({ ok: true });
    expect(verifier.result()).toEqual(verifyChain(chain));
  });

  it("keeps returning the first break once broken", () => {
    const verifier = new ChainVerifier();
    verifier.push(chain[0]);
    const first = verifier.push(chain[2]);
    expect(first).toMatchObject({ ok: false, brokenAt: 2, reason: "seq_gap" });
    expect(verifier.push(chain[1])).toBe(first);
    expect(verifier.result()).toBe(first);
  });

  it("keeps no reference to a pushed entry, so one row object can be reused (10,000 rows)", () => {
    // Functional only: no timing is asserted here; throughput is the benchmark's business.
    const hashes: string[] = [];
    let prev = GENESIS_HASH;
    const fieldsAt = (seq: number) =>
      entry({ seq, kind: seq % 2 ? "installed" : "removed", aircraftMinutes: 1_000_000 + seq * 90, tsnMinutes: 50_000 + seq * 90, csn: seq, details: seq % 5 ? null : { bin: `B-${seq}` } });
    for (let seq = 1; seq <= 10_000; seq++) {
      prev = computeEntryHash(prev, fieldsAt(seq));
      hashes.push(prev);
    }
    const row = { ...fieldsAt(1), prevHash: GENESIS_HASH, hash: hashes[0] };
    const verifier = new ChainVerifier();
    for (let seq = 1; seq <= 10_000; seq++) {
      Object.assign(row, fieldsAt(seq), { prevHash: seq === 1 ? GENESIS_HASH : hashes[seq - 2], hash: hashes[seq - 1] });
      if (!verifier.push(row).ok) break;
    }
    expect(verifier.result()).toEqual({ ok: true, entries: 10_000, head: hashes[9_999] });
  });
});
