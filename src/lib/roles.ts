// Roles and which areas of Threadline each may use. Shared by the server checks and the navigation,
// so what a user is shown and what the server allows come from one table.
export const ROLES = ["technician", "inspector", "stores", "reliability", "auditor", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  technician: "Technician",
  inspector: "Inspector",
  stores: "Stores",
  reliability: "Reliability engineer",
  auditor: "Auditor",
  admin: "Administrator",
};

export type Area =
  | "home"
  | "fleet"
  | "swap"
  | "inspections"
  | "parts"
  | "receiving"
  | "stock"
  | "removals"
  | "rates"
  | "trace"
  | "ledger"
  | "people"
  | "account-audit"
  | "catalog"
  | "layouts";

const everyone = [...ROLES];

export const AREA_ROLES: Record<Area, readonly Role[]> = {
  home: everyone,
  fleet: everyone,
  parts: everyone,
  swap: ["technician", "inspector"],
  inspections: ["inspector"],
  receiving: ["stores", "admin"],
  stock: ["stores", "inspector", "auditor", "admin"],
  removals: ["reliability", "auditor", "admin"],
  rates: ["reliability", "auditor", "admin"],
  trace: ["auditor", "reliability", "admin"],
  ledger: ["auditor", "admin"],
  people: ["admin"],
  "account-audit": ["auditor", "admin"],
  catalog: ["admin"],
  layouts: ["admin"],
};

export function mayUse(role: Role, area: Area): boolean {
  return AREA_ROLES[area].includes(role);
}

export interface NavItem {
  area: Area;
  href: string;
  label: string;
}

/** The main navigation, in the order a user meets the work. */
export const NAV_ITEMS: NavItem[] = [
  { area: "fleet", href: "/fleet", label: "Fleet" },
  { area: "parts", href: "/parts", label: "Parts" },
  { area: "inspections", href: "/inspections", label: "Inspections" },
  { area: "receiving", href: "/receiving", label: "Receiving" },
  { area: "stock", href: "/stock", label: "Stock" },
  { area: "removals", href: "/removals", label: "Removals" },
  { area: "rates", href: "/rates", label: "Rates" },
  { area: "trace", href: "/trace", label: "Trace" },
  { area: "ledger", href: "/ledger", label: "Ledger check" },
  { area: "catalog", href: "/catalog", label: "Catalog" },
  { area: "layouts", href: "/layouts", label: "Layouts" },
  { area: "people", href: "/people", label: "People" },
  { area: "account-audit", href: "/people/audit", label: "Account audit" },
];

export function navFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => mayUse(role, item.area));
}
