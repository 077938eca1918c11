// Whether a swap's record carries what a maintenance record entry must hold. The elements follow
// 14 CFR 43.9(a) -- from memory (trade-facts §3 marks 43.9(a) [M]; check the primary text before
// relying on the exact wording):
//   (1) a description of the work performed (or reference to data acceptable to the regulator),
//   (2) the date of completion of the work,
//   (3) the name of the person performing the work, if other than the person approving it,
//   (4) the signature, certificate number and kind of certificate of the person approving the
//       work for return to service.
// In Threadline, (1) is each entry's kind with its work order and maintenance manual task
// reference; (2) the swap's completion instant; (3) the performing technician's name, asked of
// every swap (not only when someone else approves it) because the record names both anyway;
// (4) the approver's electronic signature (the signed-in user recorded on the entry or the
// countersignature) with their licence or authorisation number. The kind of certificate is not
// stored apart from the number, so it is not checked here.

export const RULE_43_9_A_1 = "14 CFR 43.9(a)(1) (from memory): description of the work";
export const RULE_43_9_A_2 = "14 CFR 43.9(a)(2) (from memory): date of completion";
export const RULE_43_9_A_3 = "14 CFR 43.9(a)(3) (from memory): name of the person performing the work";
export const RULE_43_9_A_4 = "14 CFR 43.9(a)(4) (from memory): signature and certificate number of the person approving return to service";

export interface RecordPerson {
  /** The signed-in user who signed (their id is the electronic signature on the entry). */
  userId: string | null;
  name: string | null;
  licenceNumber: string | null;
}

export interface SwapRecordEntry {
  seq: number;
  kind: string;
  workOrder: string | null;
  taskReference: string | null;
  occurredAt: string | null;
  recordedBy: string | null;
}

export interface SwapRecord {
  swapId: string;
  performedAt: string | null;
  performedBy: RecordPerson | null;
  /** Required at positions needing an independent inspection: the inspector then approves return to service. */
  inspectionRequired: boolean;
  inspectedBy: RecordPerson | null;
  inspectedAt: string | null;
  entries: readonly SwapRecordEntry[];
}

export interface CompletenessIssue {
  rule: string;
  message: string;
}

const blank = (value: string | null | undefined) => value === null || value === undefined || value.trim() === "";
const validInstant = (value: string | null | undefined) => !blank(value) && Number.isFinite(Date.parse(value as string));

/** Everything missing from one swap's record, each naming the rule it fails; empty when complete. */
export function checkSwapRecord(record: SwapRecord): CompletenessIssue[] {
  const issues: CompletenessIssue[] = [];
  const where = `Swap ${record.swapId}`;
  if (record.entries.length === 0) issues.push({ rule: RULE_43_9_A_1, message: `${where} has no ledger entries, so nothing describes the work.` });
  for (const entry of record.entries) {
    if (entry.kind !== "removed" && entry.kind !== "installed") {
      issues.push({ rule: RULE_43_9_A_1, message: `${where}: seq ${entry.seq} is a ${entry.kind} entry; a swap removes or installs.` });
    }
    if (blank(entry.workOrder)) issues.push({ rule: RULE_43_9_A_1, message: `${where}: seq ${entry.seq} (${entry.kind}) has no work order.` });
    if (blank(entry.taskReference)) issues.push({ rule: RULE_43_9_A_1, message: `${where}: seq ${entry.seq} (${entry.kind}) has no maintenance manual task reference.` });
    if (!validInstant(entry.occurredAt)) issues.push({ rule: RULE_43_9_A_2, message: `${where}: seq ${entry.seq} (${entry.kind}) has no date.` });
  }
  if (!validInstant(record.performedAt)) issues.push({ rule: RULE_43_9_A_2, message: `${where} has no date of completion.` });

  if (!record.performedBy || blank(record.performedBy.name)) {
    issues.push({ rule: RULE_43_9_A_3, message: `${where} does not name the person who performed the work.` });
  }

  // Without an independent inspection the performing technician approves return to service;
  // with one, the inspector's countersignature does, and until then the unit is not returned to service.
  const approver = record.inspectionRequired ? record.inspectedBy : record.performedBy;
  const role = record.inspectionRequired ? "inspector approving return to service" : "technician approving return to service";
  if (record.inspectionRequired && !record.inspectedBy) {
    issues.push({ rule: RULE_43_9_A_4, message: `${where} needs an independent inspection and has no countersignature: nobody has approved return to service.` });
  } else if (approver) {
    if (blank(approver.userId)) issues.push({ rule: RULE_43_9_A_4, message: `${where}: the ${role} did not sign.` });
    if (blank(approver.licenceNumber)) {
      issues.push({ rule: RULE_43_9_A_4, message: `${where}: the ${role}${approver.name ? ` (${approver.name})` : ""} has no licence or authorisation number on record.` });
    }
    if (record.inspectionRequired && !validInstant(record.inspectedAt)) issues.push({ rule: RULE_43_9_A_4, message: `${where}: the countersignature has no date.` });
  } else {
    issues.push({ rule: RULE_43_9_A_4, message: `${where}: nobody approving return to service is on record.` });
  }
  // Each entry is signed by whoever recorded it; an unsigned entry is no record at all.
  for (const entry of record.entries) {
    if (blank(entry.recordedBy)) issues.push({ rule: RULE_43_9_A_4, message: `${where}: seq ${entry.seq} (${entry.kind}) carries no signature.` });
  }
  return issues;
}
