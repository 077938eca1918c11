import type { Area, Role } from "./roles";

export interface RoleTask {
  area: Area;
  href: string;
  title: string;
  detail: string;
}

/** What each role comes to Threadline to do, shown on its home page in this order. */
export const ROLE_TASKS: Record<Role, RoleTask[]> = {
  technician: [
    { area: "fleet", href: "/fleet", title: "Find the aircraft", detail: "Open the Fleet, pick the registration and the position on its map." },
    { area: "fleet", href: "/fleet", title: "Record a swap", detail: "At the position, scan the off part and the on part and sign the change." },
    { area: "parts", href: "/parts", title: "Look up a unit", detail: "Search a serial or part number to see where it is and its times." },
    { area: "home", href: "/scan-check", title: "Check a label", detail: "Try the camera on a part label before the job, and see what Threadline reads." },
  ],
  inspector: [
    { area: "inspections", href: "/inspections", title: "Countersign swaps", detail: "Swaps at positions that need an independent inspection wait here for your signature." },
    { area: "fleet", href: "/fleet", title: "Check the fleet", detail: "See what is fitted where and which positions carry findings." },
    { area: "parts", href: "/parts", title: "Look up a unit", detail: "Search a serial to see its status, times and thread." },
    { area: "stock", href: "/stock", title: "Review stock", detail: "See quarantined and unserviceable units waiting for a decision." },
  ],
  stores: [
    { area: "receiving", href: "/receiving", title: "Receive a part", detail: "Book a serviceable unit in with its release certificate and print its label." },
    { area: "stock", href: "/stock", title: "Manage stock", detail: "Issue units to work orders, take removed units back, send them for repair." },
    { area: "parts", href: "/parts", title: "Look up a unit", detail: "Search a serial to see where it is." },
  ],
  reliability: [
    { area: "removals", href: "/removals", title: "Study removals", detail: "Filter the removal history and export it as CSV." },
    { area: "rates", href: "/rates", title: "Watch the rates", detail: "Removal rates, MTBUR, MTBF and alert levels by part number." },
    { area: "trace", href: "/trace", title: "Trace a serial", detail: "Follow one unit across every airframe it has flown on." },
  ],
  auditor: [
    { area: "trace", href: "/trace", title: "Trace a serial", detail: "Back-to-birth history of one unit, with its findings." },
    { area: "ledger", href: "/ledger", title: "Run the ledger check", detail: "Recompute the hash chain and prove nothing was altered." },
    { area: "removals", href: "/removals", title: "Review removals", detail: "Every removal with its reason, times and signatures." },
  ],
  admin: [
    { area: "people", href: "/people", title: "Manage people", detail: "Invite users, change roles, deactivate accounts." },
    { area: "catalog", href: "/catalog", title: "Keep the catalog", detail: "Part numbers, alternates and life limits." },
    { area: "layouts", href: "/layouts", title: "Keep the layouts", detail: "The positions of each aircraft type and where they sit on the map." },
  ],
};
