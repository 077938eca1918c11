import { describe, expect, it } from "vitest";
import { dateInZone, daysUntil, licenceSigningProblem, licenceStatus } from "@/domain/licence";

// The 30-day warning is Threadline's own choice, not a published figure; the expiry date is read
// as the last day on which the licence or authorisation is valid.

describe("licenceStatus", () => {
  it.each([
    [null, "2026-12-01", "none"],
    ["2028-06-30", "2026-12-01", "valid"],
    ["2027-01-01", "2026-12-01", "valid"], // 31 days ahead: outside the warning window
    ["2026-12-31", "2026-12-01", "expiring"], // 30 days ahead: inside it
    ["2026-12-01", "2026-12-01", "expiring"], // the expiry day itself is still valid
    ["2026-11-30", "2026-12-01", "expired"],
    ["2024-02-29", "2024-03-01", "expired"],
  ] as const)("expires %s, today %s -> %s", (expiresOn, today, expected) => {
    expect(licenceStatus(expiresOn, today)).toBe(expected);
  });

  it("counts days across a leap day and a year end", () => {
    expect(daysUntil("2028-03-01", "2028-02-28")).toBe(2);
    expect(daysUntil("2027-01-01", "2026-12-31")).toBe(1);
    expect(daysUntil("2026-11-30", "2026-12-01")).toBe(-1);
  });

  it("refuses a value that is not an ISO date", () => {
    expect(() => licenceStatus("30/06/2028", "2026-12-01")).toThrow(RangeError);
  });
});

describe("dateInZone", () => {
  it("gives the local calendar date of an instant", () => {
    const instant = new Date("2026-11-30T23:30:00Z");
    expect(dateInZone(instant, "UTC")).toBe("2026-11-30");
    // The UTC shortcut and the time-zone formatter agree on the last and first millisecond of a day.
    for (const edge of ["2026-11-30T23:59:59.999Z", "2026-12-01T00:00:00.000Z", "2028-02-29T12:00:00.000Z"]) {
      expect(dateInZone(new Date(edge), "UTC")).toBe(dateInZone(new Date(edge), "Etc/UTC"));
    }
    expect(dateInZone(instant, "Europe/Helsinki")).toBe("2026-12-01"); // UTC+2 in winter
    expect(dateInZone(instant, "Europe/Lisbon")).toBe("2026-11-30"); // UTC+0 in winter
  });
});

describe("licenceSigningProblem", () => {
  const technician = { role: "technician", licenceNumber: "QL-B1-77001", licenceExpiresOn: "2026-11-30" };

  it("refuses an expired licence and names its expiry date", () => {
    const problem = licenceSigningProblem(technician, "2026-12-01");
    expect(problem?.code).toBe("licence_expired");
    expect(problem?.message).toContain("2026-11-30");
    expect(problem?.message).toContain("QL-B1-77001");
  });

  it("allows signing on the expiry day and before it", () => {
    expect(licenceSigningProblem(technician, "2026-11-30")).toBeNull();
    expect(licenceSigningProblem(technician, "2026-11-01")).toBeNull();
  });

  it("refuses a technician or inspector with no licence number on file", () => {
    expect(licenceSigningProblem({ role: "inspector", licenceNumber: null, licenceExpiresOn: null }, "2026-12-01")?.code).toBe(
      "licence_missing",
    );
  });

  it("does not ask other roles for a licence number, but still refuses an expired one", () => {
    expect(licenceSigningProblem({ role: "admin", licenceNumber: null, licenceExpiresOn: null }, "2026-12-01")).toBeNull();
    expect(
      licenceSigningProblem({ role: "admin", licenceNumber: "QA-AD-0009", licenceExpiresOn: "2026-01-31" }, "2026-12-01")?.code,
    ).toBe("licence_expired");
  });
});
