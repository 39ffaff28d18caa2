// Min/max decimation for the plot: bounded size, time order kept, extremes kept.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeTrace, minMaxDecimate, squareWaveCsv } from "../../../lib/trace";

describe("min/max decimation", () => {
  it("keeps a one-sample spike among 200,000 points and stays within the limit", () => {
    const n = 200_000;
    const t = new Float64Array(n);
    const i = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      t[k] = k * 1e-4;
      i[k] = 1e-6 + 1e-7 * Math.sin(k / 50);
    }
    i[123_457] = 0.3;
    i[7] = -0.01;
    const p = minMaxDecimate(t, i, 1000);
    expect(p.t.length).toBeLessThanOrEqual(1000);
    expect(p.t.length).toBeGreaterThan(900);
    expect(p.i).toContain(0.3);
    expect(p.i).toContain(-0.01);
    expect(p.t[p.i.indexOf(0.3)]).toBe(t[123_457]);
    expect(p.t[0]).toBe(0);
    expect(p.t[p.t.length - 1]).toBe(t[n - 1]);
  });

  it("returns short series unchanged", () => {
    expect(minMaxDecimate([0, 1, 2], [5, 6, 7], 10)).toEqual({ t: [0, 1, 2], i: [5, 6, 7] });
  });

  it("keeps the extremes and the time order of any series", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 1, maxLength: 3000 }),
        fc.integer({ min: 4, max: 500 }),
        (values, maxPoints) => {
          const t = values.map((_, k) => k);
          const p = minMaxDecimate(t, values, maxPoints);
          expect(p.t.length).toBeLessThanOrEqual(maxPoints);
          expect(p.t.length).toBe(p.i.length);
          for (let k = 1; k < p.t.length; k++) expect(p.t[k]).toBeGreaterThan(p.t[k - 1]);
          expect(Math.max(...p.i)).toBe(Math.max(...values));
          expect(Math.min(...p.i)).toBe(Math.min(...values));
          for (let k = 0; k < p.t.length; k++) expect(p.i[k]).toBe(values[p.t[k]]);
        },
      ),
    );
  });

  it("the analysis's plot respects maxPlotPoints and keeps both levels", async () => {
    const csv = squareWaveCsv({ sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 0.001, period: 0.5, cycles: 20, sampleInterval: 0.0001 });
    const r = await analyzeTrace(csv, { maxPlotPoints: 500 });
    expect(r.rows).toBe(100_001);
    expect(r.plot.t.length).toBeLessThanOrEqual(500);
    // every 1 ms burst is narrower than a plot run (200 samples = 20 ms) and still shows
    const peaks = r.plot.i.filter((x) => x === 20e-3).length;
    expect(peaks).toBeGreaterThanOrEqual(20);
    expect(Math.min(...r.plot.i)).toBe(2e-6);
  });
});
