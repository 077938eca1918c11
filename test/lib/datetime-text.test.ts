import { describe, expect, it } from "vitest";
import { isoFromDatetime } from "../../src/lib/datetime-text";

describe("isoFromDatetime", () => {
  it("rewrites DATETIME(3) text as the same UTC instant a Date would give", () => {
    for (const text of ["2024-01-01 00:00:00.000", "2026-02-28 23:59:59.999", "2025-07-15 06:05:04.321"]) {
      expect(isoFromDatetime(text)).toBe(new Date(`${text.replace(" ", "T")}Z`).toISOString());
    }
  });

  it("takes a Date as it is, and other text through Date as UTC", () => {
    expect(isoFromDatetime(new Date("2026-12-01T10:00:00.000Z"))).toBe("2026-12-01T10:00:00.000Z");
    expect(isoFromDatetime("2026-12-01 10:00:00")).toBe("2026-12-01T10:00:00.000Z");
  });
});
