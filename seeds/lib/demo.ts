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

/** The invented fleet: registrations use the prefix Q-, which no state uses. */
export const DEMO_AIRCRAFT = [
  { id: 1, registration: "Q-FRAA", msn: "72-0104", typeId: 1, stationId: 1, startHours: 18_240, startCycles: 11_905 },
  { id: 2, registration: "Q-FRAB", msn: "72-0117", typeId: 1, stationId: 1, startHours: 16_012, startCycles: 10_448 },
  { id: 3, registration: "Q-FRAC", msn: "72-0131", typeId: 1, stationId: 2, startHours: 12_377, startCycles: 8_020 },
  { id: 4, registration: "Q-FRAD", msn: "72-0142", typeId: 1, stationId: 2, startHours: 9_605, startCycles: 6_210 },
  { id: 5, registration: "Q-FRBA", msn: "40-0211", typeId: 2, stationId: 1, startHours: 21_480, startCycles: 24_950 },
  { id: 6, registration: "Q-FRBB", msn: "40-0226", typeId: 2, stationId: 1, startHours: 19_733, startCycles: 23_102 },
  { id: 7, registration: "Q-FRBC", msn: "40-0238", typeId: 2, stationId: 2, startHours: 14_120, startCycles: 16_874 },
  { id: 8, registration: "Q-FRBD", msn: "40-0249", typeId: 2, stationId: 2, startHours: 8_806, startCycles: 10_391 },
] as const;

/** The demo history runs from the operator's first records to DEMO_NOW. */
export const HISTORY_START = new Date("2024-12-01T00:00:00.000Z");
