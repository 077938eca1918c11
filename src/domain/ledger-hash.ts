// The ledger's tamper evidence: each entry's hash covers the previous entry's hash and a
// canonical encoding of the entry, so altering, removing or reordering any stored entry
// breaks the chain from that entry on. The encoding must never change once entries are
// written with it: the regression pin in test/domain/ledger-hash.test.ts guards that.

import * as crypto from "node:crypto";
import { DomainInputError } from "./errors";
import { normaliseInstant } from "./flight-time";
import {
  LEDGER_KINDS,
  REMOVAL_TYPES,
  type ChainedLedgerEntry,
  type LedgerEntryFields,
} from "./ledger-types";

/** The prevHash of the first entry of the ledger. */
export const GENESIS_HASH = "0".repeat(64);

const KINDS: ReadonlySet<string> = new Set(LEDGER_KINDS);
const REMOVALS: ReadonlySet<string> = new Set(REMOVAL_TYPES);

// ---------------------------------------------------------------------------------------
// Canonical encoding

function encodeInt(value: number, field: string): string {
  if (!Number.isSafeInteger(value)) {
    throw new DomainInputError(`${field} must be an integer, got ${value}.`, field);
  }
  return String(value);
}

function encodeNullableInt(value: number | null, field: string): string {
  return value === null ? "null" : encodeInt(value, field);
}

// Only a string with a non-ASCII character can change under NFC, and only one with a
// control character, quote or backslash needs JSON escaping. Printable ASCII without those
// (nearly every field) is quoted as it stands, skipping both the ICU call and JSON.stringify.
const NEEDS_WORK = /[^\x20\x21\x23-\x5b\x5d-\x7e]/;

function nfc(value: string): string {
  return NEEDS_WORK.test(value) ? value.normalize("NFC") : value;
}

function encodeString(value: string, field: string): string {
  if (typeof value !== "string") throw new DomainInputError(`${field} must be a string.`, field);
  return NEEDS_WORK.test(value) ? JSON.stringify(value.normalize("NFC")) : '"' + value + '"';
}

function encodeNullableString(value: string | null, field: string): string {
  return value === null ? "null" : encodeString(value, field);
}

function encodeDetails(details: Record<string, string> | null): string {
  if (details === null) return "null";
  if (typeof details !== "object" || Array.isArray(details)) {
    throw new DomainInputError("details must be a flat map of strings or null.", "details");
  }
  const pairs: Array<[string, string]> = [];
  for (const key of Object.keys(details)) {
    const value = details[key];
    if (typeof value !== "string") {
      throw new DomainInputError(`details.${key} must be a string.`, "details");
    }
    pairs.push([nfc(key), nfc(value)]);
  }
  if (pairs.length === 0) return "{}";
  // Sorted by UTF-16 code units after NFC, so the order a caller built the map in never matters.
  pairs.sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  let out = "{";
  for (let i = 0; i < pairs.length; i++) {
    if (i > 0) {
      if (pairs[i][0] === pairs[i - 1][0]) {
        throw new DomainInputError(`details has two keys that are the same after normalisation: ${pairs[i][0]}.`, "details");
      }
      out += ",";
    }
    out += encodeString(pairs[i][0], "details") + ":" + encodeString(pairs[i][1], "details");
  }
  return out + "}";
}

/**
 * The entry as a JSON array, values in the order of the fields of LedgerEntryFields:
 * integers as integers, instants as UTC with milliseconds, strings NFC, nulls explicit,
 * details as an object with sorted keys. Built by hand (not JSON.stringify on an object)
 * because an object's key order is not ours to fix: integer-like keys would move first.
 */
export function canonicalEncodeEntry(entry: LedgerEntryFields): string {
  if (!KINDS.has(entry.kind)) throw new DomainInputError(`kind "${entry.kind}" is not a ledger kind.`, "kind");
  if (entry.removalType !== null && !REMOVALS.has(entry.removalType)) {
    throw new DomainInputError(`removalType "${entry.removalType}" is not scheduled or unscheduled.`, "removalType");
  }
  // One join of the values: a flat string in one pass, where two dozen `+` would build a rope
  // that hashing must then flatten (measurably dearer over a million entries).
  return (
    "[" +
    [
      encodeInt(entry.seq, "seq"),
      '"' + entry.kind + '"',
      encodeInt(entry.partId, "partId"),
      encodeNullableInt(entry.aircraftId, "aircraftId"),
      encodeNullableInt(entry.positionId, "positionId"),
      '"' + normaliseInstant(entry.occurredAt, "occurredAt") + '"',
      '"' + normaliseInstant(entry.recordedAt, "recordedAt") + '"',
      encodeString(entry.recordedBy, "recordedBy"),
      encodeNullableInt(entry.aircraftMinutes, "aircraftMinutes"),
      encodeNullableInt(entry.aircraftCycles, "aircraftCycles"),
      encodeNullableInt(entry.tsnMinutes, "tsnMinutes"),
      encodeNullableInt(entry.csn, "csn"),
      encodeNullableInt(entry.tsoMinutes, "tsoMinutes"),
      encodeNullableInt(entry.cso, "cso"),
      entry.removalType === null ? "null" : '"' + entry.removalType + '"',
      encodeNullableString(entry.reason, "reason"),
      encodeNullableString(entry.workOrder, "workOrder"),
      encodeNullableString(entry.taskReference, "taskReference"),
      encodeNullableString(entry.testResult, "testResult"),
      encodeNullableInt(entry.documentId, "documentId"),
      encodeNullableInt(entry.correctsSeq, "correctsSeq"),
      encodeDetails(entry.details),
    ].join(",") +
    "]"
  );
}

// ---------------------------------------------------------------------------------------
// Hashing

// One-shot crypto.hash (Node >= 20.12) is faster than createHash for short inputs; the
// engines field still admits Node 20.9, hence the fallback.
const sha256Hex: (text: string) => string =
  typeof crypto.hash === "function"
    ? (text) => crypto.hash("sha256", text, "hex")
    : (text) => crypto.createHash("sha256").update(text, "utf8").digest("hex");

/** SHA-256 (lowercase hex) over prevHash + "\n" + the canonical encoding. */
export function computeEntryHash(prevHash: string, entry: LedgerEntryFields): string {
  return sha256Hex(prevHash + "\n" + canonicalEncodeEntry(entry));
}

/** The entry with its prevHash and hash filled in, ready to append. */
export function chainEntry(prevHash: string, entry: LedgerEntryFields): ChainedLedgerEntry {
  return { ...entry, prevHash, hash: computeEntryHash(prevHash, entry) };
}

// ---------------------------------------------------------------------------------------
// Verification

export type ChainBreakReason = "hash_mismatch" | "prev_hash_mismatch" | "seq_gap";

export interface ChainIntact {
  ok: true;
  /** Entries verified. */
  entries: number;
  /** Hash of the last entry verified (the start hash when there were none). */
  head: string;
}

export interface ChainBreak {
  ok: false;
  /** The first seq at which the chain is not intact: for a seq_gap, the seq that was expected. */
  brokenAt: number;
  reason: ChainBreakReason;
  /** Entries verified intact before the break. */
  entries: number;
  /** The seq actually found where the break was seen (differs from brokenAt for seq_gap). */
  foundSeq: number;
  /** Why the entry could not be encoded, when that is what broke it. */
  detail?: string;
}

export type ChainVerification = ChainIntact | ChainBreak;

const PUSH_OK = Object.freeze({ ok: true as const });

/**
 * Verifies a chain one entry at a time, holding only the running head, so a database
 * stream can feed it row by row. push() keeps no reference to the entry: a caller may
 * reuse one object for every row. After a break, push() keeps returning that break.
 *
 * seq must rise by exactly one from entry to entry, so the ledger must assign seq
 * gaplessly (from the head row), not by AUTO_INCREMENT, which skips values on rollback.
 */
export class ChainVerifier {
  private head: string;
  private expectedSeq: number | undefined;
  private verified = 0;
  private broken: ChainBreak | null = null;

  /**
   * @param startPrevHash prevHash of the first entry to come: GENESIS_HASH, or a checkpointed head.
   * @param firstSeq seq the first entry must have; defaults to 1 from genesis, and to
   *   whatever comes first when starting from a checkpoint.
   */
  constructor(startPrevHash: string = GENESIS_HASH, firstSeq?: number) {
    this.head = startPrevHash;
    this.expectedSeq = firstSeq ?? (startPrevHash === GENESIS_HASH ? 1 : undefined);
  }

  push(entry: ChainedLedgerEntry): { readonly ok: true } | ChainBreak {
    if (this.broken) return this.broken;
    const expected = this.expectedSeq ?? entry.seq;
    if (entry.seq !== expected) return this.fail(expected, "seq_gap", entry.seq);
    if (entry.prevHash !== this.head) return this.fail(expected, "prev_hash_mismatch", entry.seq);
    let hash: string;
    try {
      hash = computeEntryHash(this.head, entry);
    } catch (error) {
      // An entry that cannot be encoded cannot be the one that was hashed.
      if (!(error instanceof DomainInputError)) throw error;
      return this.fail(expected, "hash_mismatch", entry.seq, error.message);
    }
    if (hash !== entry.hash) return this.fail(expected, "hash_mismatch", entry.seq);
    this.head = hash;
    this.expectedSeq = expected + 1;
    this.verified++;
    return PUSH_OK;
  }

  /** The outcome so far. */
  result(): ChainVerification {
    return this.broken ?? { ok: true, entries: this.verified, head: this.head };
  }

  private fail(brokenAt: number, reason: ChainBreakReason, foundSeq: number, detail?: string): ChainBreak {
    this.broken = { ok: false, brokenAt, reason, entries: this.verified, foundSeq };
    if (detail !== undefined) this.broken.detail = detail;
    return this.broken;
  }
}

/** Verifies entries in seq order and says where the chain first breaks. */
export function verifyChain(
  entries: Iterable<ChainedLedgerEntry>,
  startPrevHash: string = GENESIS_HASH,
  firstSeq?: number,
): ChainVerification {
  const verifier = new ChainVerifier(startPrevHash, firstSeq);
  for (const entry of entries) {
    if (!verifier.push(entry).ok) break;
  }
  return verifier.result();
}
