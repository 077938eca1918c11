import { describe, expect, it } from "vitest";
import { DomainInputError } from "@/domain/errors";
import { parseFlightTime as hm } from "@/domain/flight-time";
import {
  DEFAULT_NEAR_FRACTION,
  ageInDays,
  carryOver,
  currentTotals,
  limitState,
  onWingTime,
  remainingLife,
  resetAtOverhaul,
  totalsAtRemoval,
  worstStatus,
  type InstallSnapshot,
  type LifeLimits,
} from "@/domain/life";

// Hand-built cases with invented values. The carry-over formula
// (TSN at removal = TSN at installation + host total at removal - host total at installation,
// the same for cycles) is from memory / common practice: trade-facts.md section 5 marks it [M].

const install: InstallSnapshot = {
  part: { tsnMinutes: hm("1200:00"), csn: 800, tsoMinutes: hm("300:00"), cso: 150 },
  host: { minutes: hm("15000:00"), cycles: 9000 },
};

describe("onWingTime", () => {
  it("is the host's totals at removal minus at installation", () => {
    expect(onWingTime({ minutes: hm("15000:00"), cycles: 9000 }, { minutes: hm("15123:45"), cycles: 9071 })).toEqual({
      minutes: hm("123:45"),
      cycles: 71,
    });
  });

  it("is zero for a removal at the installation snapshot", () => {
    expect(onWingTime(install.host, install.host)).toEqual({ minutes: 0, cycles: 0 });
  });

  it("refuses a negative delta as a time regression, naming the field", () => {
    expect(() => onWingTime(install.host, { minutes: hm("14999:59"), cycles: 9000 })).toThrow(/Time regression: aircraft hours 14999:59 are lower than 15000:00/);
    try {
      onWingTime(install.host, { minutes: hm("15001:00"), cycles: 8999 });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(DomainInputError);
      expect((error as DomainInputError).field).toBe("aircraftCycles");
    }
  });

  it("refuses non-integer or negative totals", () => {
    expect(() => onWingTime({ minutes: 1.5, cycles: 0 }, { minutes: 2, cycles: 0 })).toThrow(/atInstall.minutes/);
    expect(() => onWingTime({ minutes: 0, cycles: -1 }, { minutes: 2, cycles: 0 })).toThrow(/atInstall.cycles/);
  });
});

describe("carry-over (from memory / common practice, trade-facts §5 [M])", () => {
  const removal = { minutes: hm("15250:30"), cycles: 9180 };

  it("adds the host's delta to TSN, CSN, TSO and CSO", () => {
    expect(totalsAtRemoval(install, removal)).toEqual({
      tsnMinutes: hm("1450:30"),
      csn: 980,
      tsoMinutes: hm("550:30"),
      cso: 330,
    });
  });

  it("keeps a null TSO/CSO null (never overhauled)", () => {
    const fresh: InstallSnapshot = { ...install, part: { tsnMinutes: 0, csn: 0, tsoMinutes: null, cso: null } };
    expect(carryOver(fresh, removal)).toEqual({ tsnMinutes: hm("250:30"), csn: 180, tsoMinutes: null, cso: null });
  });

  it("gives current totals of a fitted unit from the aircraft's latest snapshot", () => {
    expect(currentTotals(install, { minutes: hm("15000:59"), cycles: 9001 })).toMatchObject({ tsnMinutes: hm("1200:59"), csn: 801 });
  });

  it("follows one unit across two aircraft: its totals travel with the serial", () => {
    const offFirst = totalsAtRemoval(install, removal);
    const onSecond: InstallSnapshot = { part: offFirst, host: { minutes: hm("40000:00"), cycles: 30000 } };
    expect(totalsAtRemoval(onSecond, { minutes: hm("40010:15"), cycles: 30004 })).toMatchObject({ tsnMinutes: hm("1460:45"), csn: 984 });
  });

  it("refuses a removal snapshot below the installation snapshot", () => {
    expect(() => carryOver(install, { minutes: hm("14000:00"), cycles: 9500 })).toThrow(/Time regression/);
  });

  it("refuses bad part totals", () => {
    expect(() => carryOver({ ...install, part: { ...install.part, csn: -1 } }, removal)).toThrow(/install.part.csn/);
    expect(() => carryOver({ ...install, part: { ...install.part, tsoMinutes: 0.5 } }, removal)).toThrow(/tsoMinutes/);
  });
});

describe("resetAtOverhaul", () => {
  it("restarts TSO and CSO at zero and leaves TSN and CSN", () => {
    expect(resetAtOverhaul({ tsnMinutes: 90_000, csn: 4000, tsoMinutes: 30_000, cso: 1000 })).toEqual({ tsnMinutes: 90_000, csn: 4000, tsoMinutes: 0, cso: 0 });
    expect(resetAtOverhaul({ tsnMinutes: 90_000, csn: 4000, tsoMinutes: null, cso: null })).toEqual({ tsnMinutes: 90_000, csn: 4000, tsoMinutes: 0, cso: 0 });
  });
});

describe("ageInDays", () => {
  it.each([
    ["2020-01-01", "2020-01-01T00:00:00.000Z", 0],
    ["2020-01-01", "2020-01-01T23:59:59.999Z", 0],
    ["2020-01-01", "2020-01-02T00:00:00.000Z", 1],
    ["2020-01-01", "2021-01-01T00:00:00.000Z", 366], // 2020 is a leap year
    ["2021-01-01", "2022-01-01T00:00:00.000Z", 365],
    ["2026-03-01T10:15:00.000Z", "2026-03-02T10:14:59.999Z", 0],
    ["2026-03-01T10:15:00.000+02:00", "2026-03-02T08:15:00.000Z", 1],
  ])("%s to %s is %i days", (since, now, days) => {
    expect(ageInDays(since, now)).toBe(days);
  });

  it("takes the clock as a Date too", () => {
    expect(ageInDays("2026-01-01", new Date("2026-03-01T00:00:00.000Z"))).toBe(59);
  });

  it("refuses a now before the start, and unparseable dates", () => {
    expect(() => ageInDays("2026-03-02", "2026-03-01T00:00:00.000Z")).toThrow(/earlier/);
    expect(() => ageInDays("14/06/2019", "2026-03-01T00:00:00.000Z")).toThrow(/since/);
    expect(() => ageInDays("2019-02-30", "2026-03-01T00:00:00.000Z")).toThrow(DomainInputError);
    expect(() => ageInDays("2019-06-14", new Date(Number.NaN))).toThrow(/now/);
  });
});

describe("limitState", () => {
  it.each([
    [1000, 0, 1000, "ok"],
    [1000, 899, 101, "ok"],
    [1000, 900, 100, "near"], // exactly 10% left counts as near
    [1000, 999, 1, "near"],
    [1000, 1000, 0, "exceeded"], // reaching the limit leaves no life: exceeded
    [1000, 1200, -200, "exceeded"],
  ] as const)("limit %i, used %i -> remaining %i, %s", (limit, used, remaining, status) => {
    expect(limitState(limit, used)).toEqual({ limit, used, remaining, status });
  });

  it("takes another near fraction", () => {
    expect(limitState(1000, 700, 0.3).status).toBe("near");
    expect(limitState(1000, 699, 0.3).status).toBe("ok");
    expect(limitState(1000, 999, 0).status).toBe("ok");
  });

  it("refuses a zero or fractional limit, negative usage and a bad fraction", () => {
    expect(() => limitState(0, 0)).toThrow(/above zero/);
    expect(() => limitState(10.5, 0)).toThrow(DomainInputError);
    expect(() => limitState(10, -1)).toThrow(DomainInputError);
    expect(() => limitState(10, 1, 1.5)).toThrow(/nearFraction/);
    expect(() => limitState(10, 1, Number.NaN)).toThrow(/nearFraction/);
  });
});

describe("remainingLife", () => {
  const limits: LifeLimits = { minutes: hm("20000:00"), cycles: 15000, days: 3650 };

  it("defaults to a 10% near threshold (our own default)", () => {
    expect(DEFAULT_NEAR_FRACTION).toBe(0.1);
  });

  it("gives each limit and the worst status", () => {
    const life = remainingLife(limits, { tsnMinutes: hm("12000:00"), csn: 13600, ageDays: 4000 });
    expect(life.minutes).toEqual({ limit: hm("20000:00"), used: hm("12000:00"), remaining: hm("8000:00"), status: "ok" });
    expect(life.cycles).toEqual({ limit: 15000, used: 13600, remaining: 1400, status: "near" });
    expect(life.days).toEqual({ limit: 3650, used: 4000, remaining: -350, status: "exceeded" });
    expect(life.status).toBe("exceeded");
  });

  it("is ok with nothing to say when the part number has no limits", () => {
    expect(remainingLife({ minutes: null, cycles: null, days: null }, { tsnMinutes: 10 ** 9, csn: 10 ** 6, ageDays: null })).toEqual({
      minutes: null,
      cycles: null,
      days: null,
      status: "ok",
    });
  });

  it("counts exactly at the limit as exceeded", () => {
    expect(remainingLife({ minutes: null, cycles: 20000, days: null }, { tsnMinutes: 0, csn: 20000, ageDays: null }).status).toBe("exceeded");
    expect(remainingLife({ minutes: null, cycles: 20000, days: null }, { tsnMinutes: 0, csn: 19999, ageDays: null }).status).toBe("near");
  });

  it("takes a near threshold per call", () => {
    const usage = { tsnMinutes: hm("15000:00"), csn: 0, ageDays: 0 };
    expect(remainingLife(limits, usage).status).toBe("ok");
    expect(remainingLife(limits, usage, { nearFraction: 0.25 }).status).toBe("near");
  });

  it("refuses an unknown age against a calendar limit rather than passing it", () => {
    expect(() => remainingLife(limits, { tsnMinutes: 0, csn: 0, ageDays: null })).toThrow(/age is unknown/);
  });

  it("uses ageInDays with a passed-in clock", () => {
    const ageDays = ageInDays("2016-03-01", "2026-02-27T12:00:00.000Z");
    expect(ageDays).toBe(3650);
    expect(remainingLife({ minutes: null, cycles: null, days: 3650 }, { tsnMinutes: 0, csn: 0, ageDays }).days?.status).toBe("exceeded");
  });
});

describe("worstStatus", () => {
  it("orders ok < near < exceeded", () => {
    expect(worstStatus([])).toBe("ok");
    expect(worstStatus(["ok", "near", "ok"])).toBe("near");
    expect(worstStatus(["near", "exceeded", "ok"])).toBe("exceeded");
  });
});
