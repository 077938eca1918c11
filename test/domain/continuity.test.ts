import { describe, expect, it } from "vitest";
import {
  correctedView,
  findContinuityIssues,
  nextStatus,
  type Finding,
  type ThreadEntry,
  type ThreadFacts,
} from "@/domain/continuity";
import { DomainInputError } from "@/domain/errors";
import { parseFlightTime as hm } from "@/domain/flight-time";
import type { LifeLimits } from "@/domain/life";
import type { LedgerKind } from "@/domain/ledger-types";

// Hand-built threads with invented part numbers, serials, registrations and positions.
// Aircraft 1 and 2 are of type 10, aircraft 3 of type 20.

const NO_LIMITS: LifeLimits = { minutes: null, cycles: null, days: null };
const AIRCRAFT = [
  { id: 1, typeId: 10, registration: "TL-AAA" },
  { id: 2, typeId: 10, registration: "TL-BBB" },
  { id: 3, typeId: 20, registration: "TL-CCC" },
];
const POSITIONS = [
  { id: 101, code: "32-LH-1" },
  { id: 102, code: "32-RH-1" },
  { id: 103, code: "29-PUMP-1" },
  { id: 201, code: "32-LH-1" },
];
const ELIGIBILITY = [
  { partNumber: "TL-4410-01", aircraftTypeId: 10, positionId: 101 },
  { partNumber: "TL-4410-01", aircraftTypeId: 10, positionId: 102 },
  { partNumber: "TL-4410-01", aircraftTypeId: 20, positionId: 201 },
];

interface Times {
  ac?: string; // aircraft hours H:MM
  acc?: number; // aircraft cycles
  tsn?: string;
  csn?: number;
  tso?: string;
  cso?: number;
}

function entry(seq: number, kind: LedgerKind, more: Partial<ThreadEntry> = {}, times: Times = {}): ThreadEntry {
  return {
    seq,
    kind,
    partId: 7001,
    aircraftId: null,
    positionId: null,
    occurredAt: new Date(Date.UTC(2026, 0, 1 + seq, 8)).toISOString(),
    recordedAt: new Date(Date.UTC(2026, 0, 1 + seq, 9)).toISOString(),
    recordedBy: "u-tech-07",
    aircraftMinutes: times.ac === undefined ? null : hm(times.ac),
    aircraftCycles: times.acc ?? null,
    tsnMinutes: times.tsn === undefined ? null : hm(times.tsn),
    csn: times.csn ?? null,
    tsoMinutes: times.tso === undefined ? null : hm(times.tso),
    cso: times.cso ?? null,
    removalType: kind === "removed" ? "scheduled" : null,
    reason: null,
    workOrder: null,
    taskReference: null,
    testResult: null,
    documentId: null,
    correctsSeq: null,
    details: null,
    ...more,
  };
}

const received = (seq: number, times: Times = { tsn: "1200:00", csn: 800 }, documentId: number | null = 900) =>
  entry(seq, "received", { documentId }, times);
const installed = (seq: number, aircraftId: number, positionId: number, times: Times) =>
  entry(seq, "installed", { aircraftId, positionId }, times);
const removed = (seq: number, aircraftId: number, positionId: number, times: Times) =>
  entry(seq, "removed", { aircraftId, positionId }, times);

function facts(entries: ThreadEntry[], more: Partial<ThreadFacts> = {}, limits: LifeLimits = NO_LIMITS): ThreadFacts {
  return {
    part: { id: 7001, partNumberId: 44, partNumber: "TL-4410-01", serialNumber: "Q7A0012", limits, manufacturedOn: "2019-06-14" },
    entries,
    certificates: [],
    eligibility: ELIGIBILITY,
    aircraft: AIRCRAFT,
    positions: POSITIONS,
    ...more,
  };
}

const kindsOf = (findings: Finding[]) => findings.map((f) => [f.kind, f.seq]);

// A unit received, fitted to TL-AAA, removed, returned serviceable and fitted to TL-BBB.
function cleanTwoAircraft(): ThreadEntry[] {
  return [
    received(1),
    installed(2, 1, 101, { ac: "15000:00", acc: 9000, tsn: "1200:00", csn: 800 }),
    removed(3, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1450:30", csn: 980 }),
    entry(4, "returned"),
    installed(5, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1450:30", csn: 980 }),
    removed(6, 2, 102, { ac: "30100:00", acc: 20050, tsn: "1550:30", csn: 1030 }),
  ];
}

describe("clean threads", () => {
  it("finds nothing in an empty thread", () => {
    expect(findContinuityIssues(facts([]))).toEqual([]);
  });

  it("finds nothing in a clean thread across two aircraft", () => {
    expect(findContinuityIssues(facts(cleanTwoAircraft()))).toEqual([]);
  });

  it("finds nothing across three aircraft with a shop visit, TSO reset and test-cell time", () => {
    const thread = [
      received(1),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000, tsn: "1200:00", csn: 800 }),
      removed(3, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1450:30", csn: 980 }),
      entry(4, "sent_for_repair", { details: { shop: "Invented Overhaul Shop", order: "RO-0071" } }),
      // The shop ran the unit for half an hour on test: the shop visit explains the rise.
      entry(5, "repaired", { documentId: 901 }, { tsn: "1451:00", csn: 980, tso: "0:00", cso: 0 }),
      installed(6, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1451:00", csn: 980, tso: "0:00", cso: 0 }),
      removed(7, 2, 102, { ac: "30100:00", acc: 20050, tsn: "1551:00", csn: 1030, tso: "100:00", cso: 50 }),
      entry(8, "returned"),
      installed(9, 3, 201, { ac: "800:00", acc: 400, tsn: "1551:00", csn: 1030, tso: "100:00", cso: 50 }),
      removed(10, 3, 201, { ac: "812:15", acc: 409, tsn: "1563:15", csn: 1039, tso: "112:15", cso: 59 }),
    ];
    const limits = { minutes: hm("20000:00"), cycles: 15000, days: 3650 };
    expect(findContinuityIssues(facts(thread, {}, limits))).toEqual([]);
  });

  it("carries a TSN that the installation did not record over from the last known value", () => {
    const thread = cleanTwoAircraft();
    thread[4] = installed(5, 2, 102, { ac: "30000:00", acc: 20000 });
    expect(findContinuityIssues(facts(thread))).toEqual([]);
  });
});

describe("gap", () => {
  it("flags hours rising between a removal and the next installation with no shop visit", () => {
    const thread = cleanTwoAircraft();
    thread[4] = installed(5, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1500:30", csn: 980 });
    thread[5] = removed(6, 2, 102, { ac: "30100:00", acc: 20050, tsn: "1600:30", csn: 1030 });
    const findings = findContinuityIssues(facts(thread));
    expect(findings).toEqual([
      {
        kind: "gap",
        seq: 5,
        relatedSeqs: [3],
        message: "TSN rose from 1450:30 (seq 3) to 1500:30 at the installation on TL-BBB (seq 5) with no shop visit in between: 50:00 unaccounted for.",
      },
    ]);
  });

  it("reads hours and cycles unaccounted for at one entry as one finding", () => {
    const thread = cleanTwoAircraft();
    thread[4] = installed(5, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1451:30", csn: 990 });
    thread[5] = removed(6, 2, 102, { ac: "30100:00", acc: 20050, tsn: "1551:30", csn: 1040 });
    const findings = findContinuityIssues(facts(thread));
    expect(kindsOf(findings)).toEqual([["gap", 5]]);
    expect(findings[0].message).toMatch(/TSN rose .* 1:00 unaccounted for\. CSN rose from 980 \(seq 3\) to 990 .* 10 unaccounted for\./);
  });

  it("flags a TSN at removal that differs from the carry-over of the installation's", () => {
    const thread = cleanTwoAircraft();
    thread[2] = removed(3, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1460:30", csn: 980 });
    thread[4] = installed(5, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1460:30", csn: 980 });
    thread[5] = removed(6, 2, 102, { ac: "30100:00", acc: 20050, tsn: "1560:30", csn: 1030 });
    const findings = findContinuityIssues(facts(thread));
    expect(findings).toEqual([
      {
        kind: "gap",
        seq: 3,
        relatedSeqs: [2],
        message: "TSN at the removal from TL-AAA (seq 3) is 1460:30, but 1200:00 at installation (seq 2) plus 250:30 flown gives 1450:30: 10:00 unaccounted for.",
      },
    ]);
  });

  it("flags a removal TSN short of the hours flown", () => {
    const thread = cleanTwoAircraft().slice(0, 3);
    thread[2] = removed(3, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1440:30", csn: 980 });
    const [finding] = findContinuityIssues(facts(thread));
    expect(finding).toMatchObject({ kind: "gap", seq: 3, relatedSeqs: [2] });
    expect(finding.message).toContain("10:00 flown but not counted");
  });

  it("flags a removal with no installation on record", () => {
    const thread = [received(1), removed(2, 1, 101, { ac: "15000:00", acc: 9000 })];
    expect(findContinuityIssues(facts(thread))).toEqual([
      { kind: "gap", seq: 2, relatedSeqs: [], message: "Removed from TL-AAA at seq 2 with no installation on record in this thread." },
    ]);
  });
});

describe("overlap", () => {
  it("flags an installation on a second aircraft while still fitted on the first", () => {
    const thread = [
      received(1),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000, tsn: "1200:00", csn: 800 }),
      installed(3, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1210:00", csn: 805 }),
      removed(4, 1, 101, { ac: "15020:00", acc: 9010, tsn: "1220:00", csn: 810 }),
    ];
    expect(findContinuityIssues(facts(thread))).toEqual([
      {
        kind: "overlap",
        seq: 3,
        relatedSeqs: [2],
        message: "Installed on TL-BBB at seq 3 while still fitted on TL-AAA since seq 2, with no removal in between.",
      },
    ]);
  });

  it("flags a second installation on the same aircraft at another position", () => {
    const thread = [
      received(1),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000 }),
      installed(3, 1, 102, { ac: "15000:00", acc: 9000 }),
    ];
    const findings = findContinuityIssues(facts(thread));
    expect(kindsOf(findings)).toEqual([["overlap", 3]]);
    expect(findings[0].message).toContain("still fitted on TL-AAA at position 32-LH-1 since seq 2");
  });
});

describe("time_regression", () => {
  it("flags a part TSN lower than at the preceding removal", () => {
    const thread = cleanTwoAircraft();
    thread[4] = installed(5, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1400:30", csn: 980 });
    thread[5] = removed(6, 2, 102, { ac: "30100:00", acc: 20050, tsn: "1500:30", csn: 1030 });
    expect(findContinuityIssues(facts(thread))).toEqual([
      { kind: "time_regression", seq: 5, relatedSeqs: [3], message: "TSN went back from 1450:30 (seq 3) to 1400:30 at the installation on TL-BBB (seq 5)." },
    ]);
  });

  it("flags a lower TSN even across a shop visit", () => {
    const thread = [
      received(1),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000, tsn: "1200:00", csn: 800 }),
      removed(3, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1450:30", csn: 980 }),
      entry(4, "sent_for_repair"),
      entry(5, "repaired", { documentId: 901 }, { tsn: "1450:00", csn: 980 }),
    ];
    expect(kindsOf(findContinuityIssues(facts(thread)))).toEqual([["time_regression", 5]]);
  });

  it("flags aircraft hours at a removal lower than at its installation", () => {
    const thread = [
      received(1),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000, tsn: "1200:00", csn: 800 }),
      removed(3, 1, 101, { ac: "14990:00", acc: 9010 }),
    ];
    expect(findContinuityIssues(facts(thread))).toEqual([
      { kind: "time_regression", seq: 3, relatedSeqs: [2], message: "TL-AAA hours went back from 15000:00 (seq 2) to 14990:00 at the removal from TL-AAA (seq 3)." },
    ]);
  });

  it("flags aircraft cycles at a removal lower than at its installation", () => {
    const thread = [received(1), installed(2, 1, 101, { ac: "15000:00", acc: 9000 }), removed(3, 1, 101, { ac: "15010:00", acc: 8999 })];
    const findings = findContinuityIssues(facts(thread));
    expect(kindsOf(findings)).toEqual([["time_regression", 3]]);
    expect(findings[0].message).toBe("TL-AAA cycles went back from 9000 (seq 2) to 8999 at the removal from TL-AAA (seq 3).");
  });

  it("flags TSO going back without a shop visit, and accepts its reset at one", () => {
    const base = [
      received(1, { tsn: "5000:00", csn: 3000, tso: "900:00", cso: 600 }),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000, tsn: "5000:00", csn: 3000, tso: "900:00", cso: 600 }),
      removed(3, 1, 101, { ac: "15100:00", acc: 9050, tsn: "5100:00", csn: 3050, tso: "1000:00", cso: 650 }),
    ];
    const noShop = [...base, entry(4, "returned", {}, { tso: "0:00" })];
    expect(kindsOf(findContinuityIssues(facts(noShop)))).toEqual([["time_regression", 4]]);
    const withShop = [...base, entry(4, "sent_for_repair"), entry(5, "repaired", { documentId: 901 }, { tsn: "5100:00", csn: 3050, tso: "0:00", cso: 0 })];
    expect(findContinuityIssues(facts(withShop))).toEqual([]);
  });
});

describe("no_certificate", () => {
  it("flags an installation with no certificate on file", () => {
    const thread = cleanTwoAircraft().slice(0, 2);
    thread[0] = received(1, undefined, null);
    expect(findContinuityIssues(facts(thread))).toEqual([
      {
        kind: "no_certificate",
        seq: 2,
        relatedSeqs: [1],
        message: "Installed on TL-AAA at seq 2 with no release certificate on file since the receipt at seq 1.",
      },
    ]);
  });

  it("accepts a certificate filed later against the receipt, or with no receipt seq", () => {
    const thread = cleanTwoAircraft().slice(0, 2);
    thread[0] = received(1, undefined, null);
    expect(findContinuityIssues(facts(thread, { certificates: [{ documentId: 950, partId: 7001, receivedSeq: 1 }] }))).toEqual([]);
    expect(findContinuityIssues(facts(thread, { certificates: [{ documentId: 950, partId: 7001 }] }))).toEqual([]);
  });

  it("flags a unit whose thread starts with an installation and has no certificate", () => {
    const thread = [installed(1, 1, 101, { ac: "15000:00", acc: 9000 })];
    expect(findContinuityIssues(facts(thread))).toEqual([
      { kind: "no_certificate", seq: 1, relatedSeqs: [], message: "Installed on TL-AAA at seq 1 with no release certificate on file." },
    ]);
    expect(findContinuityIssues(facts(thread, { certificates: [{ documentId: 950, partId: 7001 }] }))).toEqual([]);
  });

  it("needs a new certificate after a shop visit: the receipt's does not cover it", () => {
    const thread = [
      received(1),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000 }),
      removed(3, 1, 101, { ac: "15100:00", acc: 9050 }),
      entry(4, "sent_for_repair"),
      entry(5, "repaired"),
      installed(6, 2, 102, { ac: "30000:00", acc: 20000 }),
    ];
    expect(kindsOf(findContinuityIssues(facts(thread)))).toEqual([["no_certificate", 6]]);
    expect(findContinuityIssues(facts(thread))[0].message).toContain("since the shop visit at seq 5");
    expect(findContinuityIssues(facts(thread, { certificates: [{ documentId: 951, partId: 7001, receivedSeq: 5 }] }))).toEqual([]);
  });
});

describe("not_serviceable_at_install", () => {
  it("flags a removed unit fitted again without being returned serviceable", () => {
    const thread = cleanTwoAircraft().filter((e) => e.kind !== "returned");
    expect(findContinuityIssues(facts(thread))).toEqual([
      {
        kind: "not_serviceable_at_install",
        seq: 5,
        relatedSeqs: [3],
        message: "Installed on TL-BBB at seq 5 while unserviceable (since seq 3).",
      },
    ]);
  });

  it.each([
    ["quarantined", "quarantined"],
    ["sent_for_repair", "in repair"],
    ["scrapped", "scrapped"],
  ] as const)("flags installing a unit after %s", (kind, words) => {
    const thread = [received(1), entry(2, kind), installed(3, 1, 101, { ac: "15000:00", acc: 9000 })];
    const findings = findContinuityIssues(facts(thread));
    expect(kindsOf(findings)).toEqual([["not_serviceable_at_install", 3]]);
    expect(findings[0].message).toBe(`Installed on TL-AAA at seq 3 while ${words} (since seq 2).`);
  });

  it("accepts a quarantined unit once released", () => {
    const thread = [received(1), entry(2, "quarantined"), entry(3, "released"), installed(4, 1, 101, { ac: "15000:00", acc: 9000 })];
    expect(findContinuityIssues(facts(thread))).toEqual([]);
  });
});

describe("not_eligible", () => {
  it("flags an installation at a position where the part number is not eligible", () => {
    const thread = [received(1), installed(2, 1, 103, { ac: "15000:00", acc: 9000 })];
    expect(findContinuityIssues(facts(thread))).toEqual([
      { kind: "not_eligible", seq: 2, relatedSeqs: [], message: "Installed on TL-AAA at seq 2: P/N TL-4410-01 is not eligible at position 29-PUMP-1." },
    ]);
  });

  it("judges eligibility by the aircraft's type, not the position id alone", () => {
    // Position 201 belongs to type 20; TL-AAA is type 10.
    const thread = [received(1), installed(2, 1, 201, { ac: "15000:00", acc: 9000 })];
    expect(kindsOf(findContinuityIssues(facts(thread)))).toEqual([["not_eligible", 2]]);
  });

  it("uses the part number the unit carried at the entry", () => {
    const thread = [received(1), { ...installed(2, 1, 101, { ac: "15000:00", acc: 9000 }), partNumberAtEntry: "TL-4410-02" }];
    const findings = findContinuityIssues(facts(thread));
    expect(findings[0].message).toContain("P/N TL-4410-02 is not eligible");
    const withRow = facts(thread, { eligibility: [...ELIGIBILITY, { partNumber: "TL-4410-02", aircraftTypeId: 10, positionId: 101 }] });
    expect(findContinuityIssues(withRow)).toEqual([]);
  });

  it("flags an installation that records no position", () => {
    const thread = [received(1), installed(2, 1, null as never, { ac: "15000:00", acc: 9000 })];
    expect(findContinuityIssues(facts(thread))[0]).toMatchObject({ kind: "not_eligible", seq: 2 });
  });
});

describe("life_exceeded", () => {
  it("flags a cycle limit passed while fitted, at the removal", () => {
    const limits = { minutes: null, cycles: 1000, days: null };
    expect(findContinuityIssues(facts(cleanTwoAircraft(), {}, limits))).toEqual([
      {
        kind: "life_exceeded",
        seq: 6,
        relatedSeqs: [5],
        message: "At seq 6 on TL-BBB the unit's CSN is 1030, past its limit of 1000 by 30 while fitted since seq 5.",
      },
    ]);
  });

  it("does not flag flying exactly up to the limit", () => {
    const limits = { minutes: hm("1550:30"), cycles: 1030, days: null };
    expect(findContinuityIssues(facts(cleanTwoAircraft(), {}, limits))).toEqual([]);
  });

  it("flags installing a unit with no life left: at the limit counts as exceeded", () => {
    const limits = { minutes: hm("1450:30"), cycles: null, days: null };
    const findings = findContinuityIssues(facts(cleanTwoAircraft(), {}, limits));
    // Seq 3 reaches the limit exactly (allowed); seq 5 installs it with nothing left.
    expect(findings).toEqual([
      {
        kind: "life_exceeded",
        seq: 5,
        relatedSeqs: [],
        message: "Installed on TL-BBB at seq 5 with TSN 1450:30, at or past its limit of 1450:30: no life remains.",
      },
    ]);
  });

  it("uses the carry-over when the removal does not record TSN", () => {
    const thread = cleanTwoAircraft().slice(0, 3);
    thread[2] = removed(3, 1, 101, { ac: "15250:30", acc: 9180 });
    const findings = findContinuityIssues(facts(thread, {}, { minutes: hm("1400:00"), cycles: null, days: null }));
    expect(findings).toHaveLength(1);
    expect(findings[0].message).toBe("At seq 3 on TL-AAA the unit's TSN is 1450:30, past its limit of 1400:00 by 50:30 while fitted since seq 2.");
  });

  it("flags a calendar limit from the manufacture date and the entry's date", () => {
    // Manufactured 2019-06-14; installed 2026-01-03, removed 2026-01-04 (days 2395 and 2396).
    const thread = cleanTwoAircraft().slice(0, 3);
    expect(findContinuityIssues(facts(thread, {}, { minutes: null, cycles: null, days: 2396 }))).toEqual([]);
    const findings = findContinuityIssues(facts(thread, {}, { minutes: null, cycles: null, days: 2395 }));
    // Flagged once per fitted period: at the installation, not again at the removal.
    expect(kindsOf(findings)).toEqual([["life_exceeded", 2]]);
    expect(findings[0].message).toBe("Installed on TL-AAA at seq 2 with age 2395 days, at or past its limit of 2395 days: no life remains.");
  });

  it("flags a calendar limit passed while fitted, at the removal", () => {
    const thread = cleanTwoAircraft().slice(0, 3);
    thread[2] = { ...thread[2], occurredAt: "2026-02-01T08:00:00.000Z" }; // day 2424
    expect(findContinuityIssues(facts(thread, {}, { minutes: null, cycles: null, days: 2400 }))).toEqual([
      {
        kind: "life_exceeded",
        seq: 3,
        relatedSeqs: [2],
        message: "At seq 3 on TL-AAA the unit's age is 2424 days, past its limit of 2400 days by 24 days while fitted since seq 2.",
      },
    ]);
  });
});

describe("corrections", () => {
  it("computes findings on the corrected values", () => {
    const thread = cleanTwoAircraft();
    thread[2] = removed(3, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1460:30", csn: 980 });
    // 1460:30 at the removal is 10:00 more than flown, and the next installation's 1450:30 then reads as going back.
    expect(kindsOf(findContinuityIssues(facts(thread)))).toEqual([["gap", 3], ["time_regression", 5]]);
    // The correction restates entry 3 with the right TSN: the thread is clean again.
    const correction = { ...removed(7, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1450:30", csn: 980 }), kind: "corrected" as const, correctsSeq: 3 };
    expect(findContinuityIssues(facts([...thread, correction]))).toEqual([]);
  });

  it("notes a correction in a finding that rests on a corrected entry", () => {
    const thread = cleanTwoAircraft();
    const correction = { ...removed(7, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1460:30", csn: 980 }), kind: "corrected" as const, correctsSeq: 3 };
    const findings = findContinuityIssues(facts([...thread, correction]));
    expect(kindsOf(findings)).toEqual([["gap", 3], ["time_regression", 5]]);
    expect(findings[0].relatedSeqs).toEqual([2, 7]);
    expect(findings[0].message).toContain("(A correction applies: seq 3 as corrected by seq 7.)");
    expect(findings[1].relatedSeqs).toEqual([3, 7]);
  });

  it("applies a correction of a correction to the original entry", () => {
    const base = cleanTwoAircraft();
    const first = { ...entry(7, "corrected", { correctsSeq: 4 }), reason: "first try" };
    const second = { ...entry(8, "corrected", { correctsSeq: 7 }), reason: "second try" };
    const view = correctedView([...base, first, second]);
    expect(view).toHaveLength(6);
    expect(view[3]).toMatchObject({ seq: 4, kind: "returned", reason: "second try", correctedBy: [7, 8] });
  });

  it("refuses a correction naming an entry not earlier in the thread", () => {
    const bad = entry(7, "corrected", { correctsSeq: 42 });
    expect(() => findContinuityIssues(facts([...cleanTwoAircraft(), bad]))).toThrow(/seq 42/);
  });
});

describe("gap and overlap together", () => {
  it("gives exactly those two findings", () => {
    const thread = [
      received(1),
      installed(2, 1, 101, { ac: "15000:00", acc: 9000, tsn: "1200:00", csn: 800 }),
      removed(3, 1, 101, { ac: "15250:30", acc: 9180, tsn: "1450:30", csn: 980 }),
      entry(4, "returned"),
      // 49:30 appear from nowhere between the removal and this installation: a gap.
      installed(5, 2, 102, { ac: "30000:00", acc: 20000, tsn: "1500:00", csn: 980 }),
      // Fitted to TL-CCC while still on TL-BBB: an overlap.
      installed(6, 3, 201, { ac: "800:00", acc: 400, tsn: "1510:00", csn: 985 }),
      removed(7, 2, 102, { ac: "30050:00", acc: 20020, tsn: "1550:00", csn: 1000 }),
      removed(8, 3, 201, { ac: "860:00", acc: 430, tsn: "1570:00", csn: 1015 }),
    ];
    const findings = findContinuityIssues(facts(thread));
    expect(findings).toEqual([
      {
        kind: "gap",
        seq: 5,
        relatedSeqs: [3],
        message: "TSN rose from 1450:30 (seq 3) to 1500:00 at the installation on TL-BBB (seq 5) with no shop visit in between: 49:30 unaccounted for.",
      },
      {
        kind: "overlap",
        seq: 6,
        relatedSeqs: [5],
        message: "Installed on TL-CCC at seq 6 while still fitted on TL-BBB since seq 5, with no removal in between.",
      },
    ]);
  });
});

describe("status replay", () => {
  it.each([
    [null, "received", false, "serviceable"],
    ["unserviceable", "released", false, "serviceable"],
    ["unserviceable", "returned", false, "serviceable"],
    ["in_repair", "repaired", false, "serviceable"],
    ["serviceable", "installed", false, "installed"],
    ["installed", "removed", false, "unserviceable"],
    ["installed", "removed", true, "installed"],
    ["unserviceable", "sent_for_repair", false, "in_repair"],
    ["serviceable", "quarantined", false, "quarantined"],
    ["unserviceable", "scrapped", false, "scrapped"],
    ["serviceable", "issued", false, "serviceable"],
    [null, "issued", false, null],
  ] as const)("%s then %s (fitted elsewhere: %s) -> %s", (current, kind, elsewhere, next) => {
    expect(nextStatus(current, kind, elsewhere)).toBe(next);
  });
});

describe("bad input", () => {
  it("refuses entries out of seq order, of another part, or on an unknown aircraft", () => {
    const thread = cleanTwoAircraft();
    expect(() => findContinuityIssues(facts([thread[1], thread[0]]))).toThrow(DomainInputError);
    expect(() => findContinuityIssues(facts([{ ...thread[0], partId: 1 }]))).toThrow(/part 1/);
    expect(() => findContinuityIssues(facts(thread, { aircraft: AIRCRAFT.slice(0, 1) }))).toThrow(/Aircraft 2/);
    expect(() => findContinuityIssues(facts(thread, { certificates: [{ documentId: 1, partId: 2 }] }))).toThrow(/Certificate 1/);
  });
});
