// Who may use what: every route handler and every page, against every role and a signed-out visitor.
// Written out by hand from the areas in src/lib/roles.ts and the API contract, so a route whose role
// list drifts from it fails the role-table suite instead of agreeing with itself.
// Bodies are empty or invalid on purpose: an allowed write is refused by validation (or finds no such
// id) and changes nothing, while a forbidden one must be refused before validation.
import { AREA_ROLES, ROLES, type Role } from "../../src/lib/roles";

type Method = "GET" | "POST" | "PATCH" | "DELETE";

export interface RouteAccess {
  method: Method;
  /** With placeholders filled by the suite: {partId}, {documentId}, {typeCode}, {positionCode}, {userId}, {partNumberId}. */
  path: string;
  /** Roles that may use it; "public" routes answer everyone, signed in or not. */
  roles: readonly Role[] | "public";
  body?: unknown;
}

const everyone = ROLES;
const swapSigners = ["technician", "inspector"] as const;
const utilizationWriters = ["technician", "inspector", "admin"] as const;
const movers = ["stores", "auditor", "admin"] as const;
const admin = ["admin"] as const;
const missingSwap = "00000000-0000-4000-8000-000000000000";

export const API_ACCESS: RouteAccess[] = [
  { method: "GET", path: "/api/aircraft", roles: everyone },
  { method: "GET", path: "/api/aircraft/Q-FRAA", roles: everyone },
  { method: "GET", path: "/api/aircraft/Q-FRAA/utilization", roles: everyone },
  { method: "GET", path: "/api/aircraft/Q-FRAA/positions/{positionCode}/label.png", roles: everyone },
  { method: "POST", path: "/api/aircraft/Q-FRAA/utilization", roles: utilizationWriters, body: {} },
  { method: "POST", path: "/api/aircraft/Q-FRAA/utilization/import", roles: utilizationWriters, body: {} },
  { method: "GET", path: "/api/account-events", roles: AREA_ROLES["account-audit"] },
  { method: "POST", path: "/api/discrepancies", roles: swapSigners, body: {} },
  { method: "GET", path: "/api/documents/{documentId}", roles: everyone },
  { method: "GET", path: "/api/layouts", roles: everyone },
  { method: "POST", path: "/api/layouts", roles: admin, body: {} },
  { method: "GET", path: "/api/layouts/{typeCode}", roles: everyone },
  { method: "POST", path: "/api/layouts/{typeCode}/positions", roles: admin, body: {} },
  { method: "GET", path: "/api/layouts/{typeCode}/positions/{positionCode}", roles: everyone },
  { method: "PATCH", path: "/api/layouts/{typeCode}/positions/{positionCode}", roles: admin, body: { label: 42 } },
  { method: "GET", path: "/api/part-numbers", roles: everyone },
  { method: "POST", path: "/api/part-numbers", roles: admin, body: {} },
  { method: "GET", path: "/api/part-numbers/{partNumberId}", roles: everyone },
  { method: "PATCH", path: "/api/part-numbers/{partNumberId}", roles: admin, body: { description: 42 } },
  { method: "POST", path: "/api/part-numbers/import", roles: admin, body: {} },
  { method: "GET", path: "/api/parts?q=QF", roles: everyone },
  { method: "GET", path: "/api/parts/{partId}", roles: everyone },
  { method: "GET", path: "/api/parts/{partId}/label.png", roles: everyone },
  { method: "POST", path: "/api/parts/{partId}/movements", roles: movers, body: {} },
  { method: "POST", path: "/api/receipts", roles: AREA_ROLES.receiving, body: {} },
  { method: "POST", path: "/api/receipts/part-number-requests", roles: AREA_ROLES.receiving, body: {} },
  { method: "GET", path: "/api/stock", roles: AREA_ROLES.stock },
  { method: "POST", path: "/api/swaps", roles: swapSigners, body: {} },
  { method: "POST", path: "/api/swaps/check", roles: swapSigners, body: {} },
  { method: "POST", path: `/api/swaps/${missingSwap}/inspection`, roles: ["inspector"] },
  { method: "GET", path: "/api/users", roles: admin },
  { method: "GET", path: "/api/users/{userId}", roles: admin },
  { method: "PATCH", path: "/api/users/{userId}", roles: admin, body: { role: "pilot" } },
  { method: "POST", path: "/api/users/invitations", roles: admin, body: {} },
  { method: "POST", path: "/api/users/no-such-user/invitation/resend", roles: admin },
  { method: "GET", path: "/api/session", roles: "public" },
  { method: "POST", path: "/api/session", roles: "public", body: {} },
  { method: "POST", path: "/api/password-resets", roles: "public", body: {} },
  { method: "POST", path: "/api/password-resets/not-a-token", roles: "public", body: {} },
  { method: "POST", path: "/api/invitations/not-a-token/accept", roles: "public", body: {} },
];

export interface PageAccess {
  path: string;
  roles: readonly Role[] | "public";
}

export const PAGE_ACCESS: PageAccess[] = [
  { path: "/", roles: AREA_ROLES.home },
  { path: "/scan-check", roles: AREA_ROLES.home },
  { path: "/fleet", roles: AREA_ROLES.fleet },
  { path: "/aircraft/Q-FRAA", roles: AREA_ROLES.fleet },
  { path: "/aircraft/Q-FRAA/swap", roles: AREA_ROLES.swap },
  { path: "/aircraft/Q-FRAA/position-labels", roles: AREA_ROLES.fleet },
  { path: "/swaps/{swapId}/tag", roles: AREA_ROLES.fleet },
  { path: "/parts", roles: AREA_ROLES.parts },
  { path: "/parts/{partId}", roles: AREA_ROLES.parts },
  { path: "/parts/{partId}/label", roles: AREA_ROLES.parts },
  { path: "/receiving", roles: AREA_ROLES.receiving },
  { path: "/stock", roles: AREA_ROLES.stock },
  { path: "/catalog", roles: AREA_ROLES.catalog },
  { path: "/catalog/new", roles: AREA_ROLES.catalog },
  { path: "/catalog/import", roles: AREA_ROLES.catalog },
  { path: "/catalog/{partNumberId}", roles: AREA_ROLES.catalog },
  { path: "/layouts", roles: AREA_ROLES.layouts },
  { path: "/layouts/{typeCode}", roles: AREA_ROLES.layouts },
  { path: "/layouts/{typeCode}/new-position", roles: AREA_ROLES.layouts },
  { path: "/layouts/{typeCode}/{positionCode}", roles: AREA_ROLES.layouts },
  { path: "/people", roles: AREA_ROLES.people },
  { path: "/people/invite", roles: AREA_ROLES.people },
  { path: "/people/audit", roles: AREA_ROLES["account-audit"] },
  { path: "/people/{userId}", roles: AREA_ROLES.people },
  { path: "/sign-in", roles: "public" },
  { path: "/reset-password", roles: "public" },
];
