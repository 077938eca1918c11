// The invented demo scenario: fixed ids and names that the seeds write and the tests reuse.
// Every operator, person, aircraft type, registration, part number and serial here is made up.

export const DEMO_PASSWORD = "threadline-demo";
export const DEMO_OPERATOR = "Quillfeather Regional";

/** A fixed "now" for the seed, so the demo is the same on every machine. */
export const DEMO_NOW = new Date("2026-11-30T18:00:00.000Z");

export const STATIONS = [
  { id: 1, code: "QNF", name: "North Field line station", time_zone: "Europe/Lisbon" },
  { id: 2, code: "QSH", name: "South Harbour line station", time_zone: "Europe/Helsinki" },
] as const;

export const DEMO_USERS = [
  { id: "usr-technician", role: "technician", name: "Ines Marwood", licence: "QL-B1-40217", station_id: 1 },
  { id: "usr-inspector", role: "inspector", name: "Tomasz Edevane", licence: "QL-B1-30988", station_id: 1 },
  { id: "usr-stores", role: "stores", name: "Priya Lonsdale", licence: "QS-ST-1142", station_id: 1 },
  { id: "usr-reliability", role: "reliability", name: "Okon Halvorsen", licence: "QE-RE-0207", station_id: 2 },
  { id: "usr-auditor", role: "auditor", name: "Marguerite Ashdown", licence: "QQ-AU-0031", station_id: 2 },
  { id: "usr-admin", role: "admin", name: "Caspian Threlkeld", licence: "QA-AD-0001", station_id: 1 },
] as const;

export const demoEmail = (role: string) => `${role}@demo.threadline.test`;
