import { createRequire } from "node:module";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chiSquareCdf, chiSquareQuantile } from "@/domain/reliability";

// jstat (devDependency) is the independent reference. It ships no type
// declarations, so load it through require and type only the two calls used.
interface JStatChiSquare {
  chisquare: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
}
const jStat = createRequire(import.meta.url)("jstat") as JStatChiSquare;

const GRID_P = [0.005, 0.025, 0.05, 0.1, 0.5, 0.9, 0.95, 0.975, 0.995];
const GRID_DOF = Array.from({ length: 200 }, (_, i) => i + 1);

/** Same value once both are rounded to `decimals` places (allowing for a value that sits on a rounding edge). */
function expectRoundsTo(actual: number, tableValue: number, decimals: number): void {
  expect(Math.abs(actual - tableValue)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
}

describe("chiSquareQuantile against jstat", () => {
  it("agrees to relative error < 1e-6 over p ∈ {0.005 … 0.995} and dof 1–200", () => {
    let worst = 0;
    let worstAt = "";
    for (const p of GRID_P) {
      for (const dof of GRID_DOF) {
        const ours = chiSquareQuantile(p, dof);
        const reference = jStat.chisquare.inv(p, dof);
        const relativeError = Math.abs(ours - reference) / reference;
        if (relativeError > worst) {
          worst = relativeError;
          worstAt = `p = ${p}, dof = ${dof}`;
        }
      }
    }
    expect(worst, `worst at ${worstAt}`).toBeLessThan(1e-6);
  });

  it("chiSquareCdf agrees with jstat at the same grid of quantiles", () => {
    for (const p of GRID_P) {
      for (const dof of [1, 2, 3, 5, 10, 37, 100, 200]) {
        const x = jStat.chisquare.inv(p, dof);
        expect(Math.abs(chiSquareCdf(x, dof) - jStat.chisquare.cdf(x, dof))).toBeLessThan(1e-9);
      }
    }
  });
});

describe("chiSquareQuantile published and exact values", () => {
  it("χ²(0.90; 2) = 4.61, the zero-event MTBUR bound figure (ATA CSDD definition, trade-facts 4.2 [C]); exactly −2 ln 0.1", () => {
    expectRoundsTo(chiSquareQuantile(0.9, 2), 4.61, 2);
    expect(chiSquareQuantile(0.9, 2)).toBeCloseTo(-2 * Math.log(0.1), 12);
  });

  // From memory of the standard chi-square table (lower-tail probability p), 3 decimals.
  it.each([
    [0.95, 1, 3.841],
    [0.975, 1, 5.024],
    [0.99, 1, 6.635],
    [0.95, 2, 5.991],
    [0.05, 4, 0.711],
    [0.9, 4, 7.779],
    [0.9, 6, 10.645],
    [0.95, 6, 12.592],
    [0.05, 10, 3.94],
    [0.95, 10, 18.307],
    [0.99, 10, 23.209],
    [0.05, 30, 18.493],
    [0.95, 30, 43.773],
    [0.05, 100, 77.929],
    [0.95, 100, 124.342],
  ])("χ²(%s; %s) = %s (from memory of the standard chi-square table)", (p, dof, tableValue) => {
    expectRoundsTo(chiSquareQuantile(p, dof), tableValue, 3);
  });

  it("matches the closed form for 2 dof, x = −2 ln(1 − p), across the range", () => {
    for (const p of [1e-12, 1e-6, 0.001, 0.2, 0.5, 0.8, 0.999, 1 - 1e-9]) {
      const exact = -2 * Math.log1p(-p);
      expect(Math.abs(chiSquareQuantile(p, 2) - exact) / exact).toBeLessThan(1e-12);
    }
  });

  it("handles the ends: p = 0 → 0, p = 1 → Infinity", () => {
    expect(chiSquareQuantile(0, 5)).toBe(0);
    expect(chiSquareQuantile(1, 5)).toBe(Infinity);
  });

  it("inverts chiSquareCdf for arbitrary p and dof (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-8, max: 1 - 1e-8, noNaN: true }),
        fc.double({ min: 0.2, max: 2000, noNaN: true }),
        (p, dof) => {
          const x = chiSquareQuantile(p, dof);
          const back = chiSquareCdf(x, dof);
          // Compare on the smaller tail, where the relative error matters.
          return Math.abs(back - p) <= 1e-10 * Math.min(p, 1 - p) + 1e-15;
        },
      ),
    );
  });

  it("is accurate in the far left tail of 1 dof, where Wilson–Hilferty breaks down", () => {
    const x = chiSquareQuantile(0.005, 1);
    expect(x).toBeGreaterThan(0);
    expect(Math.abs(chiSquareCdf(x, 1) - 0.005) / 0.005).toBeLessThan(1e-10);
  });
});

describe("chiSquareCdf", () => {
  it("matches closed forms for 2 and 4 dof", () => {
    for (const x of [0.01, 0.5, 1, 3, 10, 40]) {
      expect(chiSquareCdf(x, 2)).toBeCloseTo(1 - Math.exp(-x / 2), 14);
      expect(chiSquareCdf(x, 4)).toBeCloseTo(1 - Math.exp(-x / 2) * (1 + x / 2), 14);
    }
  });

  it("is 0 at and below zero and 1 at Infinity", () => {
    expect(chiSquareCdf(0, 3)).toBe(0);
    expect(chiSquareCdf(-1, 3)).toBe(0);
    expect(chiSquareCdf(Infinity, 3)).toBe(1);
  });
});

describe("chi-square input checks", () => {
  it("rejects p outside [0, 1] and non-positive dof, naming the input", () => {
    expect(() => chiSquareQuantile(-0.1, 2)).toThrow(/chiSquareQuantile: p must not be negative/);
    expect(() => chiSquareQuantile(1.5, 2)).toThrow(/chiSquareQuantile: p must be between 0 and 1/);
    expect(() => chiSquareQuantile(Number.NaN, 2)).toThrow(/p must be a finite number/);
    expect(() => chiSquareQuantile(0.5, 0)).toThrow(/chiSquareQuantile: dof must be greater than zero/);
    expect(() => chiSquareQuantile(0.5, -3)).toThrow(/dof must not be negative/);
    expect(() => chiSquareCdf(1, 0)).toThrow(/chiSquareCdf: dof/);
    expect(() => chiSquareCdf(Number.NaN, 2)).toThrow(/chiSquareCdf: x must be a number/);
  });
});
