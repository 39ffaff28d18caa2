// Properties of the analysis over arbitrary traces (written to CSV and read back, so parsing is covered).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeTrace } from "../../../lib/trace";

const traceArb = fc
  .array(
    fc.record({
      dt: fc.double({ min: 1e-6, max: 10, noNaN: true }),
      // below 1 fA a current means nothing; sub-normal doubles would underflow when multiplied by dt
      i: fc.double({ min: -1, max: 1, noNaN: true }).map((x) => (Math.abs(x) < 1e-15 ? 0 : x)),
    }),
    { minLength: 2, maxLength: 300 },
  )
  .map((rows) => {
    let t = 0;
    return rows.map((r) => ({ t: (t += r.dt), i: r.i }));
  });

function csv(rows: { t: number; i: number }[], k = 1): string {
  // String(x) round-trips a double exactly
  return "time (s),current (A)\n" + rows.map((r) => `${r.t},${r.i * k}`).join("\n");
}

describe("trace properties", () => {
  it("the average lies between the minimum and the maximum (both integrations)", async () => {
    await fc.assert(
      fc.asyncProperty(traceArb, async (rows) => {
        const r = await analyzeTrace(csv(rows));
        const min = Math.min(...rows.map((x) => x.i));
        const max = Math.max(...rows.map((x) => x.i));
        expect(r.minCurrent).toBe(min);
        expect(r.maxCurrent).toBe(max);
        const slack = 1e-12 * Math.max(Math.abs(min), Math.abs(max));
        expect(r.averageCurrent).toBeGreaterThanOrEqual(min - slack);
        expect(r.averageCurrent).toBeLessThanOrEqual(max + slack);
        expect(r.averageCurrentTrapezoid).toBeGreaterThanOrEqual(min - slack);
        expect(r.averageCurrentTrapezoid).toBeLessThanOrEqual(max + slack);
      }),
      { numRuns: 150 },
    );
  });

  it("scaling every current by k scales the average, levels and charge by k", async () => {
    await fc.assert(
      fc.asyncProperty(traceArb, fc.double({ min: 1e-4, max: 1e4, noNaN: true }), async (rows, k) => {
        const a = await analyzeTrace(csv(rows));
        const b = await analyzeTrace(csv(rows, k));
        const size = k * Math.max(...rows.map((x) => Math.abs(x.i)));
        const tol = 1e-9 * size + 1e-300;
        expect(Math.abs(b.averageCurrent - k * a.averageCurrent)).toBeLessThanOrEqual(tol);
        expect(Math.abs(b.totalCharge - k * a.totalCharge)).toBeLessThanOrEqual(tol * a.duration);
        expect(Math.abs(b.maxCurrent - k * a.maxCurrent)).toBeLessThanOrEqual(tol);
      }),
      { numRuns: 150 },
    );
  });

  it("on two-level traces Ī = D·I_a + (1 − D)·I_s and the duty cycle is a fraction", async () => {
    const squareish = fc
      .record({
        sleep: fc.double({ min: 0, max: 1e-4, noNaN: true }),
        active: fc.double({ min: 1e-3, max: 0.5, noNaN: true }),
        pattern: fc.array(fc.boolean(), { minLength: 4, maxLength: 200 }),
        dts: fc.array(fc.double({ min: 1e-5, max: 1, noNaN: true }), { minLength: 200, maxLength: 200 }),
      })
      .filter((p) => p.pattern.slice(0, -1).some((x) => x) && p.pattern.slice(0, -1).some((x) => !x));
    await fc.assert(
      fc.asyncProperty(squareish, async (p) => {
        let t = 0;
        const rows = p.pattern.map((on, k) => ({ t: (t += p.dts[k]), i: on ? p.active : p.sleep }));
        const r = await analyzeTrace(csv(rows));
        expect(r.twoLevel).toBe(true);
        const D = r.dutyCycle!;
        expect(D).toBeGreaterThan(0);
        expect(D).toBeLessThan(1);
        // expected duty cycle from the pattern itself: each sample holds until the next one
        let activeTime = 0;
        for (let k = 0; k < rows.length - 1; k++) if (p.pattern[k]) activeTime += rows[k + 1].t - rows[k].t;
        expect(Math.abs(D - activeTime / (rows[rows.length - 1].t - rows[0].t))).toBeLessThan(1e-9);
        expect(Math.abs(r.sleepLevel - p.sleep)).toBeLessThanOrEqual(1e-9 * p.active);
        expect(Math.abs(r.activeLevel! - p.active)).toBeLessThanOrEqual(1e-9 * p.active);
        expect(Math.abs(r.averageCurrent - (D * r.activeLevel! + (1 - D) * r.sleepLevel))).toBeLessThanOrEqual(1e-9 * p.active);
      }),
      { numRuns: 150 },
    );
  });
});
