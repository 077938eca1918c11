// The demo's deliberate continuity finding (seeds/replay/demo-finding.ts), named for the tests.

/** The part number of the unit given the finding; chosen because no test draws its spares from it. */
export const DEMO_FINDING_PART_NUMBER = "QF-3452-10";

export const DEMO_FINDING = {
  /** How much lower the pool's certificate states the unit's times than its own record. */
  tsnShortfallMinutes: 150 * 60,
  csnShortfall: 90,
  trackingNumber: "RC-POOL-0417",
  reason: "Received back from a pool exchange",
  /** Where the unit is fitted afterwards (on the first aircraft, by registration, that has it). */
  positionCode: "XPDR-1",
} as const;
