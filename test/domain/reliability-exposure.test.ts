import { describe, expect, it } from "vitest";
import {
  aircraftMinutesAt,
  flightMinutesBetween,
  monthOf,
  monthStart,
  monthWindows,
  startOfMonth,
  unitMinutesByWindow,
  type UtilizationPoint,
} from "@/domain/reliability";

const at = (iso: string) => Date.parse(iso);
const HOUR = 3_600_000;

// An aircraft that flies 10 hours a day, with a snapshot every midnight (figures invented).
const daily: UtilizationPoint[] = Array.from({ length: 120 }, (_, day) => ({ at: at("2026-01-01T00:00:00Z") + day * 24 * HOUR, minutes: 100_000 + day * 600 }));

describe("aircraftMinutesAt", () => {
  it("is exact at a snapshot and interpolates linearly between two", () => {
    expect(aircraftMinutesAt(daily, at("2026-01-02T00:00:00Z"))).toBe(100_600);
    expect(aircraftMinutesAt(daily, at("2026-01-02T12:00:00Z"))).toBe(100_900);
    expect(aircraftMinutesAt(daily, at("2026-01-02T06:00:00Z"))).toBe(100_750);
  });

  it("holds the first value before the first snapshot and the last after the last (no guessed flying)", () => {
    expect(aircraftMinutesAt(daily, at("2025-06-01T00:00:00Z"))).toBe(100_000);
    expect(aircraftMinutesAt(daily, at("2027-01-01T00:00:00Z"))).toBe(100_000 + 119 * 600);
    expect(aircraftMinutesAt([], at("2026-01-01T00:00:00Z"))).toBe(0);
  });

  it("copes with a single snapshot and with irregular gaps", () => {
    expect(aircraftMinutesAt([{ at: 10, minutes: 5 }], 0)).toBe(5);
    expect(aircraftMinutesAt([{ at: 10, minutes: 5 }], 20)).toBe(5);
    const gappy = [
      { at: 0, minutes: 0 },
      { at: 100, minutes: 1000 },
      { at: 1000, minutes: 1900 },
    ];
    expect(aircraftMinutesAt(gappy, 50)).toBe(500);
    expect(aircraftMinutesAt(gappy, 550)).toBe(1450);
  });
});

describe("month windows", () => {
  it("names months in UTC and finds their starts", () => {
    expect(monthOf(at("2026-09-30T23:59:59.999Z"))).toBe("2026-09");
    expect(monthOf(at("2026-10-01T00:00:00Z"))).toBe("2026-10");
    expect(monthStart(at("2026-09-17T10:00:00Z"))).toBe(at("2026-09-01T00:00:00Z"));
    expect(monthStart(at("2026-01-17T10:00:00Z"), -12)).toBe(at("2025-01-01T00:00:00Z"));
    expect(startOfMonth("2026-02")).toBe(at("2026-02-01T00:00:00Z"));
  });

  it("splits a period into calendar months, clipping the first and last", () => {
    const windows = monthWindows(at("2026-01-15T00:00:00Z"), at("2026-03-10T00:00:00Z"));
    expect(windows.map((w) => w.month)).toEqual(["2026-01", "2026-02", "2026-03"]);
    expect(windows[0].start).toBe(at("2026-01-15T00:00:00Z"));
    expect(windows[0].end).toBe(at("2026-02-01T00:00:00Z"));
    expect(windows[2].end).toBe(at("2026-03-10T00:00:00Z"));
  });

  it("refuses an empty or reversed period", () => {
    expect(() => monthWindows(at("2026-03-01T00:00:00Z"), at("2026-03-01T00:00:00Z"))).toThrow(/end after/);
  });
});

describe("unitMinutesByWindow", () => {
  const utilization = new Map([[1, daily]]);
  const windows = monthWindows(at("2026-01-01T00:00:00Z"), at("2026-04-01T00:00:00Z"));

  it("gives a unit fitted all along the aircraft's flying in each month", () => {
    const minutes = unitMinutesByWindow([{ aircraftId: 1, from: at("2025-12-01T00:00:00Z"), to: at("2026-12-01T00:00:00Z") }], utilization, windows);
    expect(minutes).toEqual([31 * 600, 28 * 600, 31 * 600]);
  });

  it("counts only the fitted part of a month, split at the removal", () => {
    const minutes = unitMinutesByWindow(
      [
        { aircraftId: 1, from: at("2026-01-11T00:00:00Z"), to: at("2026-02-06T12:00:00Z") },
        { aircraftId: 1, from: at("2026-02-06T12:00:00Z"), to: at("2026-03-02T00:00:00Z") },
      ],
      utilization,
      windows,
    );
    // Two units at one position, one after the other: together they flew exactly what the aircraft flew.
    expect(minutes[0]).toBe(21 * 600);
    expect(minutes[1]).toBe(28 * 600);
    expect(minutes[2]).toBe(1 * 600);
  });

  it("adds positions: two units fitted side by side give twice the aircraft's hours (QPA 2)", () => {
    const whole = { from: at("2025-01-01T00:00:00Z"), to: at("2027-01-01T00:00:00Z") };
    const minutes = unitMinutesByWindow([{ aircraftId: 1, ...whole }, { aircraftId: 1, ...whole }], utilization, windows);
    expect(minutes[1]).toBe(2 * 28 * 600);
  });

  it("adds nothing for an aircraft with no utilisation or an empty interval", () => {
    const minutes = unitMinutesByWindow(
      [
        { aircraftId: 2, from: at("2026-01-01T00:00:00Z"), to: at("2026-03-01T00:00:00Z") },
        { aircraftId: 1, from: at("2026-02-01T00:00:00Z"), to: at("2026-02-01T00:00:00Z") },
      ],
      utilization,
      windows,
    );
    expect(minutes).toEqual([0, 0, 0]);
  });
});

describe("flightMinutesBetween", () => {
  it("is the aircraft's flying between installation and a later instant", () => {
    expect(flightMinutesBetween(daily, at("2026-01-01T00:00:00Z"), at("2026-01-11T00:00:00Z"))).toBe(6000);
    expect(flightMinutesBetween(daily, at("2026-01-11T00:00:00Z"), at("2026-01-01T00:00:00Z"))).toBe(0);
  });
});
