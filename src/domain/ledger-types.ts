// Shapes of ledger data as the pure domain code sees them: plain values only,
// flight time in integer minutes, cycles as integers, instants as ISO 8601 UTC strings.

export const LEDGER_KINDS = [
  "received",
  "issued",
  "installed",
  "removed",
  "returned",
  "sent_for_repair",
  "repaired",
  "quarantined",
  "released",
  "scrapped",
  "corrected",
] as const;
export type LedgerKind = (typeof LEDGER_KINDS)[number];

export const REMOVAL_TYPES = ["scheduled", "unscheduled"] as const;
export type RemovalType = (typeof REMOVAL_TYPES)[number];

export const PART_STATUSES = [
  "serviceable",
  "installed",
  "unserviceable",
  "in_repair",
  "quarantined",
  "scrapped",
] as const;
export type PartStatus = (typeof PART_STATUSES)[number];

/** One ledger entry, exactly the fields the hash chain covers. */
export interface LedgerEntryFields {
  seq: number;
  kind: LedgerKind;
  partId: number;
  aircraftId: number | null;
  positionId: number | null;
  occurredAt: string; // ISO 8601 UTC with milliseconds, e.g. 2026-03-01T10:15:00.000Z
  recordedAt: string;
  recordedBy: string; // user id
  aircraftMinutes: number | null;
  aircraftCycles: number | null;
  tsnMinutes: number | null;
  csn: number | null;
  tsoMinutes: number | null;
  cso: number | null;
  removalType: RemovalType | null;
  reason: string | null;
  workOrder: string | null;
  taskReference: string | null;
  testResult: string | null;
  documentId: number | null;
  correctsSeq: number | null;
  /** Free-form facts of the entry (shop, order number, bin, tag...), as a flat string map. */
  details: Record<string, string> | null;
}

export interface ChainedLedgerEntry extends LedgerEntryFields {
  prevHash: string; // 64 hex chars; the genesis entry's prevHash is GENESIS_HASH
  hash: string;
}
