// The check the swap recording calls before a signature: unit-level, but through the server module
// it imports, so the 409 and its code are what the route wrapper will answer.
import { describe, expect, it } from "vitest";
import { assertLicenceValid, licenceProblem } from "../../src/server/licences";

const inspector = { role: "inspector", licenceNumber: "QL-B1-30988", licenceExpiresOn: "2026-11-30" };

describe("assertLicenceValid", () => {
  it("refuses with 409 licence_expired naming the expiry date once the day has passed", () => {
    const now = new Date("2026-12-01T08:00:00Z");
    expect(() => assertLicenceValid(inspector, now)).toThrowError(/expired on 2026-11-30/);
    try {
      assertLicenceValid(inspector, now);
    } catch (error) {
      expect(error).toMatchObject({ status: 409, code: "licence_expired" });
    }
  });

  it("reads 'today' in the signer's station zone when given", () => {
    const lateEvening = new Date("2026-11-30T22:30:00Z"); // already 1 December in Helsinki
    expect(licenceProblem(inspector, lateEvening, "Europe/Lisbon")).toBeNull();
    expect(licenceProblem(inspector, lateEvening, "Europe/Helsinki")?.code).toBe("licence_expired");
  });

  it("passes a valid licence", () => {
    expect(() => assertLicenceValid({ ...inspector, licenceExpiresOn: "2028-06-30" }, new Date("2026-12-01T08:00:00Z"))).not.toThrow();
  });
});
