// What each movement dialog asks for. Names are the fields of POST /api/parts/{id}/movements.
import { FORM_TYPE_LABELS, FORM_TYPES, STATUS_WORD_LABELS, STATUS_WORDS } from "@/lib/schemas/receiving";
import { SHOP_FINDING_LABELS, SHOP_FINDINGS, type MovementKind } from "@/lib/schemas/stock";

export interface MovementField {
  name: string;
  label: string;
  type: "text" | "textarea" | "select" | "date" | "checkbox" | "yesno" | "file";
  options?: Array<[value: string, label: string]>;
  hint?: string;
  /** Shown only when another field has this value. */
  when?: { field: string; value: string };
  mono?: boolean;
}

const certificateOptions = FORM_TYPES.filter((t) => t !== "certificate_of_conformity").map((t) => [t, FORM_TYPE_LABELS[t]] as [string, string]);
const repairWords = STATUS_WORDS.filter((w) => w !== "new").map((w) => [w, STATUS_WORD_LABELS[w]] as [string, string]);

export const MOVEMENT_FIELDS: Record<MovementKind, MovementField[]> = {
  issued: [
    { name: "workOrder", label: "Work order", type: "text", mono: true },
    { name: "issuedTo", label: "Issued to (technician)", type: "text", hint: "Give the work order, the technician, or both." },
  ],
  returned: [
    { name: "tagNumber", label: "Unserviceable tag number", type: "text", mono: true, hint: "From the tag the technician attached at removal. Not needed for an unused unit." },
    { name: "bin", label: "Bin", type: "text", mono: true },
    { name: "reason", label: "Reason on the tag", type: "text" },
  ],
  sent_for_repair: [
    { name: "shop", label: "Repair shop", type: "text" },
    { name: "shopApproval", label: "Shop approval reference", type: "text", mono: true },
    { name: "repairOrder", label: "Repair order number", type: "text", mono: true },
    { name: "reason", label: "Reason", type: "textarea" },
  ],
  repaired: [
    { name: "formType", label: "Form type", type: "select", options: certificateOptions },
    { name: "statusWork", label: "Status/work (block 11)", type: "select", options: repairWords, hint: "Overhauled restarts TSO and CSO at zero; TSN and CSN continue." },
    { name: "trackingNumber", label: "Tracking number (block 3)", type: "text", mono: true },
    { name: "issuerName", label: "Issuing organisation", type: "text" },
    { name: "issuerApproval", label: "Approval reference", type: "text", mono: true },
    { name: "issuedOn", label: "Certificate date", type: "date" },
    { name: "remarks", label: "Remarks (block 12)", type: "textarea" },
    { name: "shopFinding", label: "Shop finding", type: "select", options: SHOP_FINDINGS.map((f) => [f, SHOP_FINDING_LABELS[f]]) },
    { name: "bin", label: "Bin", type: "text", mono: true },
    { name: "certificateMatches", label: "Do the P/N and S/N on the certificate match the unit?", type: "yesno" },
    { name: "discrepancyNote", label: "What differs?", type: "textarea", when: { field: "certificateMatches", value: "false" } },
    { name: "certificate", label: "Certificate file (PDF, JPEG or PNG)", type: "file" },
  ],
  quarantined: [
    { name: "reason", label: "Reason", type: "textarea" },
    { name: "suspectedUnapproved", label: "Suspected unapproved part", type: "checkbox", hint: "Quality reports it to the authority if the suspicion holds." },
    { name: "bin", label: "Quarantine bin", type: "text", mono: true },
  ],
  released: [
    { name: "reason", label: "Release decision", type: "textarea", hint: "What was checked and why the unit may be used again." },
    { name: "releaseTo", label: "Release as", type: "select", options: [["serviceable", "Serviceable"], ["unserviceable", "Unserviceable (needs repair)"]] },
    { name: "bin", label: "Bin", type: "text", mono: true },
  ],
  scrapped: [
    { name: "reason", label: "Reason", type: "textarea" },
    { name: "mutilation", label: "How it was made unusable", type: "text", hint: "E.g. cut through the housing at the mounting flange; data plate defaced." },
  ],
};
