import { describe, expect, it, vi } from "vitest";
import fc from "fast-check";
import { nearestStandard, seriesValues, SERIES_NAMES } from "../../../lib/grader";

// thousands of generated cases: allow for a busy machine
vi.setConfig({ testTimeout: 60_000 });

describe("IEC 60063 tables", () => {
  it("have the right lengths and increase strictly", () => {
    const lengths: Record<string, number> = { E6: 6, E12: 12, E24: 24, E48: 48, E96: 96, E192: 192 };
    for (const s of SERIES_NAMES) {
      const v = seriesValues(s);
      expect(v.length).toBe(lengths[s]);
      for (let i = 1; i < v.length; i++) expect(v[i]).toBeGreaterThan(v[i - 1]);
      expect(v[0]).toBe(1);
      expect(v[v.length - 1]).toBeLessThan(10);
    }
  });
  it("E6, E12 and E24 are the published lists", () => {
    expect(seriesValues("E6")).toEqual([1.0, 1.5, 2.2, 3.3, 4.7, 6.8]);
    expect(seriesValues("E12")).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
    // prettier-ignore
    expect(seriesValues("E24")).toEqual([1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1]);
  });
  it("nest: E6 ⊂ E12 ⊂ E24, E48 = every other E96, E96 = every other E192", () => {
    const e96 = seriesValues("E96");
    const e192 = seriesValues("E192");
    expect(seriesValues("E48")).toEqual(e96.filter((_, i) => i % 2 === 0));
    expect(e96).toEqual(e192.filter((_, i) => i % 2 === 0));
    expect(seriesValues("E12").filter((_, i) => i % 2 === 0)).toEqual(seriesValues("E6"));
    expect(seriesValues("E24").filter((_, i) => i % 2 === 0)).toEqual(seriesValues("E12"));
  });
  it("differ from the generator 10^(i/n) only at the documented exceptions", () => {
    const exceptions = (s: "E24" | "E96" | "E192", n: number, digits: number) =>
      seriesValues(s).filter((v, i) => Number((10 ** (i / n)).toPrecision(digits)) !== v);
    // E24: 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2 replace 2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6 and 8.3
    expect(exceptions("E24", 24, 2)).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
    // E96 has no exceptions
    expect(exceptions("E96", 96, 3)).toEqual([]);
    // E192: 9.20 replaces the computed 9.19
    expect(exceptions("E192", 192, 3)).toEqual([9.2]);
    expect(seriesValues("E192")[185]).toBe(9.2);
    expect(Number((10 ** (185 / 192)).toPrecision(3))).toBe(9.19);
  });
  it("largest ratio between neighbours: E12 1.250, E24 1.154, E96 1.030", () => {
    const maxRatio = (s: "E12" | "E24" | "E96") => {
      const v = [...seriesValues(s), 10];
      let m = 0;
      for (let i = 1; i < v.length; i++) m = Math.max(m, v[i] / v[i - 1]);
      return m;
    };
    expect(maxRatio("E12")).toBeCloseTo(1.25, 3);
    expect(maxRatio("E24")).toBeCloseTo(1.154, 3);
    expect(maxRatio("E96")).toBeCloseTo(1.030, 3);
  });
});

describe("nearestStandard", () => {
  it("handles decade edges and values that are already standard", () => {
    expect(nearestStandard(9.6, "E24", "nearest")).toBe(10); // √(9.1·10) = 9.54
    expect(nearestStandard(9.5, "E24", "nearest")).toBe(9.1);
    expect(nearestStandard(0.95, "E24", "floor")).toBe(0.91);
    expect(nearestStandard(9.5, "E24", "ceil")).toBe(10);
    expect(nearestStandard(0.1 / 0.01, "E24", "floor")).toBe(10);
    expect(nearestStandard(4700, "E12", "ceil")).toBe(4700);
    expect(nearestStandard(0.0301, "E96", "floor")).toBe(0.0301);
    expect(nearestStandard(-1, "E24")).toBeNaN();
    expect(nearestStandard(0, "E24")).toBeNaN();
  });
  it("floor ≤ value ≤ ceil, nearest is one of them and nearest in ratio", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 1e8, noNaN: true }), fc.constantFrom(...SERIES_NAMES), (x, s) => {
        const lo = nearestStandard(x, s, "floor");
        const hi = nearestStandard(x, s, "ceil");
        const n = nearestStandard(x, s, "nearest");
        expect(lo).toBeLessThanOrEqual(x * (1 + 1e-9));
        expect(hi).toBeGreaterThanOrEqual(x * (1 - 1e-9));
        expect([lo, hi]).toContain(n);
        const other = n === lo ? hi : lo;
        expect(Math.abs(Math.log(x / n))).toBeLessThanOrEqual(Math.abs(Math.log(x / other)) + 1e-12);
      }),
      { numRuns: 2000 },
    );
  });
});
