// The ledger check split into consecutive seq ranges that can be verified side by side (one thread
// each) and then joined into the answer a single pass over the whole ledger would have given.
//
// Why that is sound: a segment starting at seq `lo` is verified from the *stored* hash of entry
// lo - 1. If everything before lo is intact, that stored hash is exactly the head a single pass
// would have reached at lo - 1, so the segment's verifier meets the same entries in the same state
// and breaks (or not) at the same place for the same reason. If something before lo is not intact,
// an earlier segment breaks first, and only the first break is reported. So the joined answer equals
// the single pass (test/domain/ledger-segments.test.ts checks that against verifyChain for
// arbitrary tampering and arbitrary splits).

import type { ChainVerification } from "./ledger-hash";

/** One range of seqs, verified from the stored hash of the entry before it. */
export interface LedgerSegment {
  firstSeq: number;
  lastSeq: number;
  /** The stored hash of entry firstSeq - 1 (GENESIS_HASH for seq 1; MISSING_PREV_HASH if there is no such entry). */
  startPrevHash: string;
}

/** What verifying one segment found. */
export interface SegmentOutcome {
  firstSeq: number;
  lastSeq: number;
  verification: ChainVerification;
  /** The first and last seq actually read in the range; null when it held no entries. */
  firstSeenSeq: number | null;
  lastSeenSeq: number | null;
}

/** Stands in for the hash of an entry that is not there: no entry's prevHash can equal it. */
export const MISSING_PREV_HASH = "(no entry)";

/**
 * Splits seqs 1..lastSeq into at most `maxSegments` ranges of at least `minSegmentSize` entries
 * (one range when the ledger is smaller than two of them), as even as whole numbers allow.
 */
export function planSegmentRanges(lastSeq: number, maxSegments: number, minSegmentSize: number): Array<{ firstSeq: number; lastSeq: number }> {
  if (lastSeq < 1) return [];
  const count = Math.max(1, Math.min(Math.floor(maxSegments), Math.floor(lastSeq / Math.max(1, minSegmentSize))));
  const ranges: Array<{ firstSeq: number; lastSeq: number }> = [];
  for (let k = 0; k < count; k++) {
    ranges.push({ firstSeq: Math.floor((lastSeq * k) / count) + 1, lastSeq: Math.floor((lastSeq * (k + 1)) / count) });
  }
  return ranges;
}

export interface JoinedVerification {
  verification: ChainVerification;
  /** The last seq read before the answer was settled (0 when none was), for the caller's head check. */
  lastSeenSeq: number;
}

/** Joins the outcomes of consecutive segments (in seq order) into the single-pass answer. */
export function joinSegmentOutcomes(outcomes: readonly SegmentOutcome[], startHead: string): JoinedVerification {
  let entries = 0;
  let head = startHead;
  let lastSeenSeq = 0;
  for (let i = 0; i < outcomes.length; i++) {
    const outcome = outcomes[i];
    const { verification } = outcome;
    if (!verification.ok) {
      return { verification: { ...verification, entries: entries + verification.entries }, lastSeenSeq: outcome.lastSeenSeq ?? lastSeenSeq };
    }
    entries += verification.entries;
    if (verification.entries > 0) head = verification.head;
    if (outcome.lastSeenSeq !== null) lastSeenSeq = outcome.lastSeenSeq;
    const endOfRange = outcome.lastSeenSeq ?? outcome.firstSeq - 1;
    if (endOfRange < outcome.lastSeq) {
      // The range ends early: its last entries are missing. A single pass would meet the next entry
      // that is there as a gap; if none is, it would simply end early, which the head check names.
      const next = outcomes.slice(i + 1).find((later) => later.firstSeenSeq !== null);
      if (!next) return { verification: { ok: true, entries, head }, lastSeenSeq };
      return { verification: { ok: false, brokenAt: endOfRange + 1, reason: "seq_gap", entries, foundSeq: next.firstSeenSeq! }, lastSeenSeq };
    }
  }
  return { verification: { ok: true, entries, head }, lastSeenSeq };
}
