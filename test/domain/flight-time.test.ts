import { describe, expect, it } from "vitest";
import { DomainInputError } from "@/domain/errors";
import {
  formatFlightTime,
  minutesToDecimalHours,
  parseFlightTime,
  sumFlightTimes,
} from "@/domain/flight-time";

// Cases below come from common practice: logbooks and tech logs write flight time either as
// hh:mm or as decimal hours (tenths or hundredths). Which one is used is practice, not
// regulation (trade-facts.md section 5, marked [M] there); none of these values is a
// published check value. Threadline stores integer minutes and converts for display.

describe("parseFlightTime: H:MM", () => {
  it.each([
    ["0:00", 0],
    ["0:59", 59],
    ["1:01", 61],
    ["12:30", 750],
    ["1234:30", 74070],
    ["007:05", 425],
    [" 2:15 ", 135], // surrounding spaces from a pasted value are harmless
    ["150119987579016:31", Number.MAX_SAFE_INTEGER],
  ])("%s -> %i min", (text, minutes) => {
    expect(parseFlightTime(text)).toBe(minutes);
  });

  it.each([
    ["1:60", /00 to 59/],
    ["1:99", /00 to 59/],
    ["1:5", /exactly two digits/],
    ["1:005", /exactly two digits/],
    ["-1:30", /negative/],
    [":30", /neither/],
    ["1:", /neither/],
    ["1:30:00", /neither/],
    ["150119987579016:32", /too large/],
    ["99999999999999999999:00", /too large/],
  ])("refuses %s", (text, message) => {
    expect(() => parseFlightTime(text)).toThrow(message);
  });
});

describe("parseFlightTime: decimal hours", () => {
  it.each([
    [1234.5, 74070],
    ["1234.5", 74070],
    [0, 0],
    ["0", 0],
    [0.1, 6],
    ["0.1", 6],
    [".5", 30],
    [1.25, 75],
    ["2.75", 165],
    [12, 720],
    ["0.01", 1], // 0.6 min rounds to 1
    ["0.008", 0], // 0.48 min rounds to 0
    [1e-7, 0], // exponent form, far below half a minute
  ])("%s h -> %i min", (hours, minutes) => {
    expect(parseFlightTime(hours)).toBe(minutes);
  });

  it("rounds an exact half minute upwards, on the decimal digits rather than the float", () => {
    // 0.025 h = 1.5 min exactly; 0.0249 h = 1.494 min; 0.0251 h = 1.506 min.
    expect(parseFlightTime("0.025")).toBe(2);
    expect(parseFlightTime(0.025)).toBe(2);
    expect(parseFlightTime("0.0249")).toBe(1);
    expect(parseFlightTime("0.0251")).toBe(2);
    expect(parseFlightTime("100.025")).toBe(6002);
  });

  it.each([
    [-1, /negative/],
    [-0.5, /negative/],
    ["-0.5", /negative/],
    [Number.NaN, /finite/],
    [Number.POSITIVE_INFINITY, /finite/],
    [Number.NEGATIVE_INFINITY, /finite/],
    ["", /empty/],
    ["   ", /empty/],
    ["abc", /neither/],
    ["1.2.3", /neither/],
    ["1,5", /neither/],
    ["1e3", /neither/],
    ["+1", /neither/],
    ["12.", /neither/],
    ["NaN", /neither/],
    [1e21, /too large/],
    [Number.MAX_SAFE_INTEGER, /too large/],
  ])("refuses %s", (input, message) => {
    expect(() => parseFlightTime(input)).toThrow(message);
  });

  it("throws a DomainInputError naming the field", () => {
    try {
      parseFlightTime("1:60", "aircraftHours");
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(DomainInputError);
      expect((error as DomainInputError).field).toBe("aircraftHours");
      expect((error as Error).message).toContain('"1:60"');
    }
  });
});

describe("formatFlightTime", () => {
  it.each([
    [0, "0:00"],
    [1, "0:01"],
    [59, "0:59"],
    [60, "1:00"],
    [61, "1:01"],
    [74070, "1234:30"],
    [6_000_000_000, "100000000:00"],
    [Number.MAX_SAFE_INTEGER, "150119987579016:31"],
  ])("%i min -> %s", (minutes, text) => {
    expect(formatFlightTime(minutes)).toBe(text);
  });

  it("round-trips with parseFlightTime", () => {
    for (const minutes of [0, 1, 59, 60, 61, 599, 600, 74070, 123_456_789]) {
      expect(parseFlightTime(formatFlightTime(minutes))).toBe(minutes);
    }
  });

  it.each([-1, 1.5, Number.NaN, Number.MAX_SAFE_INTEGER + 1])("refuses %s", (minutes) => {
    expect(() => formatFlightTime(minutes)).toThrow(DomainInputError);
  });
});

describe("sumFlightTimes", () => {
  it("adds integer minutes", () => {
    expect(sumFlightTimes([])).toBe(0);
    expect(sumFlightTimes([59, 1, 120])).toBe(180);
    expect(sumFlightTimes(new Set([30, 45]))).toBe(75);
  });

  it("has no float drift: 0.1 h ten thousand times is exactly 60,000 min", () => {
    const tenthHour = parseFlightTime(0.1);
    const total = sumFlightTimes(Array.from({ length: 10_000 }, () => tenthHour));
    expect(total).toBe(60_000);
    expect(formatFlightTime(total)).toBe("1000:00");
    // The same sum in floating-point hours does not land on 1000.
    let floatHours = 0;
    for (let i = 0; i < 10_000; i++) floatHours += 0.1;
    expect(floatHours).not.toBe(1000);
  });

  it("refuses a bad item, naming its index, and a total past the safe range", () => {
    expect(() => sumFlightTimes([1, -2])).toThrow(/minutes\[1\]/);
    expect(() => sumFlightTimes([1, 0.5])).toThrow(DomainInputError);
    expect(() => sumFlightTimes([Number.MAX_SAFE_INTEGER, 1])).toThrow(/too large/);
  });
});

describe("minutesToDecimalHours", () => {
  it.each([
    [74070, 1, 1234.5],
    [0, 1, 0],
    [6, 1, 0.1],
    [59, 2, 0.98],
    [59, 1, 1],
    [3, 1, 0.1], // 0.05 h rounds half up to 0.1
    [2, 1, 0], // 0.0333 h
    [100, 0, 2], // 1.667 h
    [90, 0, 2], // 1.5 h, half up
    [1, 4, 0.0167],
  ])("%i min at %i places -> %s h", (minutes, places, hours) => {
    expect(minutesToDecimalHours(minutes, places)).toBe(hours);
  });

  it("defaults to one decimal place (tenths)", () => {
    expect(minutesToDecimalHours(75)).toBe(1.3);
  });

  it("refuses bad minutes or places", () => {
    expect(() => minutesToDecimalHours(-1)).toThrow(DomainInputError);
    expect(() => minutesToDecimalHours(10, -1)).toThrow(/places/);
    expect(() => minutesToDecimalHours(10, 1.5)).toThrow(/places/);
  });
});
