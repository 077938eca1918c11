// Stock movements and the stock list: shared by the movement dialogs and the route handlers.
import { z } from "zod";
import { PART_STATUSES, type PartStatus } from "@/domain/ledger-types";
import type { Role } from "@/lib/roles";
import { binField, certificateFields, optionalBinField, optionalText, requiredEnum, requiredText, requiredYesNo } from "./receiving";

/** What the shop found on the unit: the reliability figures count confirmed failures from these. */
export const SHOP_FINDINGS = ["confirmed_failure", "no_fault_found", "damage", "modification"] as const;
export type ShopFinding = (typeof SHOP_FINDINGS)[number];
export const SHOP_FINDING_LABELS: Record<ShopFinding, string> = {
  confirmed_failure: "Confirmed failure",
  no_fault_found: "No fault found",
  damage: "Damage",
  modification: "Modification",
};

export const MOVEMENT_KINDS = ["issued", "returned", "sent_for_repair", "repaired", "quarantined", "released", "scrapped"] as const;
export type MovementKind = (typeof MOVEMENT_KINDS)[number];

export const MOVEMENT_LABELS: Record<MovementKind, string> = {
  issued: "Issue to a work order",
  returned: "Take back from the aircraft",
  sent_for_repair: "Send for repair",
  repaired: "Back from repair",
  quarantined: "Quarantine",
  released: "Release from quarantine",
  scrapped: "Scrap",
};

/** Who may record each movement. Release from quarantine is quality's decision. */
export const MOVEMENT_ROLES: Record<MovementKind, readonly Role[]> = {
  issued: ["stores", "admin"],
  returned: ["stores", "admin"],
  sent_for_repair: ["stores", "admin"],
  repaired: ["stores", "admin"],
  quarantined: ["stores", "auditor", "admin"],
  released: ["auditor", "admin"],
  scrapped: ["stores", "admin"],
};

/**
 * The statuses each movement may start from (the state machine of a unit in stores). A unit that
 * is installed must come off the aircraft through a swap first.
 */
export const MOVEMENT_FROM: Record<MovementKind, readonly PartStatus[]> = {
  issued: ["serviceable"],
  // A removed unit comes back unserviceable with its tag; an issued unit that was not fitted comes back serviceable.
  returned: ["unserviceable", "serviceable"],
  sent_for_repair: ["unserviceable", "serviceable"],
  repaired: ["in_repair"],
  quarantined: ["serviceable", "unserviceable"],
  released: ["quarantined"],
  // A shop may declare a unit beyond economical repair, so in_repair may be scrapped too.
  scrapped: ["serviceable", "unserviceable", "quarantined", "in_repair"],
};

const occurredAt = z.preprocess(
  (value) => (value === undefined || value === null || value === "" ? undefined : value),
  z.iso
    .datetime({ offset: true, error: "When it happened: an ISO 8601 instant with a zone, e.g. 2026-11-30T08:15:00Z." })
    .transform((value) => new Date(value))
    .optional(),
);

const common = { occurredAt };

export const IssueSchema = z.object({
  kind: z.literal("issued"),
  workOrder: optionalText("Work order", 64),
  issuedTo: optionalText("Issued to", 120),
  ...common,
});

export const ReturnSchema = z.object({
  kind: z.literal("returned"),
  tagNumber: optionalText("Tag number", 64),
  bin: binField,
  reason: optionalText("Reason", 500),
  ...common,
});

export const SendForRepairSchema = z.object({
  kind: z.literal("sent_for_repair"),
  shop: requiredText("Repair shop", 160),
  shopApproval: optionalText("Shop approval reference", 64),
  repairOrder: requiredText("Repair order number", 64),
  reason: requiredText("Reason", 500),
  ...common,
});

export const RepairReturnSchema = z
  .object({
    kind: z.literal("repaired"),
    ...certificateFields,
    shopFinding: requiredEnum("Shop finding", SHOP_FINDINGS),
    bin: binField,
    ...common,
  })
  .superRefine((input, ctx) => {
    if (input.statusWork === "new") ctx.addIssue({ code: "custom", path: ["statusWork"], message: "A unit back from repair is not new: choose overhauled, repaired, inspected/tested or modified." });
    if (input.formType === "certificate_of_conformity") ctx.addIssue({ code: "custom", path: ["formType"], message: "A repaired unit needs a release certificate, not a certificate of conformity." });
    if (input.certificateMatches === false && !input.discrepancyNote) ctx.addIssue({ code: "custom", path: ["discrepancyNote"], message: "Say what differs between the certificate and the unit." });
  });

export const QuarantineSchema = z.object({
  kind: z.literal("quarantined"),
  reason: requiredText("Reason", 500),
  suspectedUnapproved: z.preprocess((v) => (v === undefined || v === "" ? false : v), requiredYesNo("is this a suspected unapproved part?")),
  bin: optionalBinField,
  ...common,
});

export const ReleaseSchema = z.object({
  kind: z.literal("released"),
  reason: requiredText("Release decision", 500),
  releaseTo: z.preprocess((v) => (v === undefined || v === "" ? "serviceable" : v), requiredEnum("Release to", ["serviceable", "unserviceable"] as const)),
  bin: optionalBinField,
  ...common,
});

export const ScrapSchema = z.object({
  kind: z.literal("scrapped"),
  reason: requiredText("Reason", 500),
  mutilation: requiredText("How it was made unusable", 300),
  ...common,
});

/** The JSON body of POST /api/parts/{id}/movements. A return from repair comes as multipart with the certificate. */
export const MovementSchema = z.discriminatedUnion(
  "kind",
  [IssueSchema, ReturnSchema, SendForRepairSchema, RepairReturnSchema, QuarantineSchema, ReleaseSchema, ScrapSchema],
  { error: `kind must be one of: ${MOVEMENT_KINDS.join(", ")}.` },
);
export type MovementInput = z.output<typeof MovementSchema>;
export type MovementBody = z.input<typeof MovementSchema>;

/** Statuses a unit can have while stores (or its repair shop) holds it; installed units are on aircraft. */
export const STOCK_STATUSES = ["serviceable", "unserviceable", "quarantined", "in_repair", "scrapped"] as const satisfies readonly PartStatus[];

export const StockQuerySchema = z.object({
  status: z.preprocess((v) => (v === "" ? undefined : v), z.enum(STOCK_STATUSES, { error: `status must be one of: ${STOCK_STATUSES.join(", ")}.` }).optional()),
  partNumber: optionalText("Part number", 40),
  bin: optionalText("Bin", 32),
  q: optionalText("Serial number", 40),
  page: z.preprocess((v) => (v === undefined || v === "" ? 1 : Number(v)), z.number({ error: "page must be a whole number." }).int({ error: "page must be a whole number." }).min(1).max(100_000)),
  pageSize: z.preprocess((v) => (v === undefined || v === "" ? 50 : Number(v)), z.number({ error: "pageSize must be a whole number." }).int().min(1).max(200, { error: "pageSize is at most 200." })),
});
export type StockQuery = z.output<typeof StockQuerySchema>;

export { PART_STATUSES };

/**
 * The movements the stock page offers for a unit: the same rules the server enforces (role, status,
 * an issued unit only comes back), so the page never offers what would be refused.
 */
export function allowedMovements(unit: { status: PartStatus; issued: boolean; lastKind: string | null }, role: Role): MovementKind[] {
  return MOVEMENT_KINDS.filter((kind) => {
    if (!MOVEMENT_ROLES[kind].includes(role) || !MOVEMENT_FROM[kind].includes(unit.status)) return false;
    if (unit.issued) return kind === "returned";
    if (kind === "returned") return unit.status === "unserviceable" && unit.lastKind === "removed";
    return true;
  });
}
