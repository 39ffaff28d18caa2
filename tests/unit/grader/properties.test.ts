import { describe, expect, it, vi } from "vitest";
import fc from "fast-check";
import {
  TEMPLATE_KEYS,
  componentTolerancesFromSpec,
  defaultVariantSpec,
  drawVariant,
  formatQuantity,
  gradeAttempt,
  isComputable,
  nearestStandard,
  templates,
  type Question,
  type TemplateKey,
  type VariantSpec,
} from "../../../lib/grader";

// thousands of generated cases: allow for a busy machine
vi.setConfig({ testTimeout: 60_000 });

function allQuestions(key: TemplateKey, kind: "prediction" | "bench"): Question[] {
  return templates[key].quantities.map((q) => ({ quantity: q.key, kind, points: 1 }));
}

describe("bands and verdicts on drawn variants", () => {
  for (const key of TEMPLATE_KEYS) {
    it(`${key}: the expected value lies inside its band, and the right answer (typed or in band) is never a mistake`, () => {
      const spec = defaultVariantSpec(key);
      const policy = { componentTolerances: componentTolerancesFromSpec(spec), instrumentAccuracyPercent: 0.5 };
      fc.assert(
        fc.property(fc.string({ minLength: 1, maxLength: 12 }), fc.double({ min: -1, max: 1, noNaN: true }), (seed, where) => {
          const params = drawVariant(spec, seed);
          const values = templates[key].compute(params);
          for (const kind of ["prediction", "bench"] as const) {
            const questions = allQuestions(key, kind);
            // the exact expected value, as a number
            const exact = gradeAttempt({ template: key, params, questions, readings: questions.map((q) => values[q.quantity] as number), policy });
            for (const r of exact.results) {
              expect(r.verdict, `${r.quantity} ${kind}`).toBe("correct");
              if (r.band) {
                expect(r.band[0]).toBeLessThanOrEqual(r.expected as number);
                expect(r.band[1]).toBeGreaterThanOrEqual(r.expected as number);
              }
            }
            // the answer as a student would type it from a 4-figure calculation
            const typed = templates[key].quantities.map((q) =>
              q.kind === "category" ? String(values[q.key]) : formatQuantity(values[q.key] as number, q.unit),
            );
            for (const r of gradeAttempt({ template: key, params, questions, readings: typed, policy }).results) {
              expect(r.verdict, `${r.quantity} ${kind} typed`).toBe("correct");
            }
            // any point inside the band
            const inBand = exact.results.map((r) => (r.band ? r.expected as number + where * 0.999 * (r.band[1] - (r.expected as number)) : r.expected));
            for (const r of gradeAttempt({ template: key, params, questions, readings: inBand as (number | string)[], policy }).results) {
              expect(r.verdict).toBe("correct");
              expect(r.mistake).toBeUndefined();
            }
          }
        }),
        { numRuns: 400 },
      );
    });
  }

  it("a reported mistake is never inside the correct band, and a mistake's own value is recognised unless it is also right", () => {
    let recognised = 0;
    for (const key of TEMPLATE_KEYS) {
      const spec = defaultVariantSpec(key);
      for (let i = 0; i < 150; i++) {
        const params = drawVariant(spec, `mistake-${i}`);
        for (const q of templates[key].quantities) {
          const questions: Question[] = [{ quantity: q.key, kind: "prediction", points: 1 }];
          for (const m of templates[key].mistakes(params, q.key)) {
            const r = gradeAttempt({ template: key, params, questions, readings: [m.value] }).results[0];
            if (r.verdict === "mistake") {
              recognised++;
              if (r.band) {
                const a = r.answer as number;
                expect(a < r.band[0] || a > r.band[1]).toBe(true);
              }
            } else {
              expect(["correct", "close", "mistake"]).toContain(r.verdict);
            }
          }
        }
      }
    }
    expect(recognised).toBeGreaterThan(2000);
  });
});

describe("scaling laws", () => {
  it("doubling the supply doubles the current in shunt-burden", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 30, noNaN: true }),
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e4, noNaN: true }),
        (vs, rl, rsh) => {
          const a = templates["shunt-burden"].compute({ supplyVoltage: vs, loadResistance: rl, shuntResistance: rsh });
          const b = templates["shunt-burden"].compute({ supplyVoltage: 2 * vs, loadResistance: rl, shuntResistance: rsh });
          for (const q of ["trueCurrent", "indicatedCurrent", "burdenVoltage"])
            expect(Math.abs((b[q] as number) / (2 * (a[q] as number)) - 1)).toBeLessThan(1e-12);
          // the loading error does not depend on the supply
          expect(Math.abs((b.loadingErrorPercent as number) - (a.loadingErrorPercent as number))).toBeLessThan(1e-9);
        },
      ),
    );
  });
  it("doubling R halves the cut-off; noise voltage grows as √R of the shunt", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-12, max: 1e-3, noNaN: true }),
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        (r, c, rsh) => {
          const p = { filterResistance: r, filterCapacitance: c, shuntResistance: rsh, temperature: 300 };
          const a = templates["filter-noise"].compute(p);
          const b = templates["filter-noise"].compute({ ...p, filterResistance: 2 * r });
          const n = templates["filter-noise"].compute({ ...p, shuntResistance: 4 * rsh });
          expect(Math.abs((b.cutoffFrequency as number) / ((a.cutoffFrequency as number) / 2) - 1)).toBeLessThan(1e-12);
          expect(Math.abs((b.timeConstant as number) / (2 * (a.timeConstant as number)) - 1)).toBeLessThan(1e-12);
          expect(Math.abs((n.thermalNoiseVoltage as number) / (2 * (a.thermalNoiseVoltage as number)) - 1)).toBeLessThan(1e-12);
        },
      ),
    );
  });
  it("battery life is inversely proportional to the average current", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-7, max: 1e-4, noNaN: true }), fc.double({ min: 1e-3, max: 0.1, noNaN: true }), (is, ia) => {
        const p = { sleepCurrent: is, activeCurrent: ia, activeTime: 0.01, period: 1, batteryCapacity: 792, usableFraction: 0.8 };
        const a = templates["duty-cycle"].compute(p);
        const b = templates["duty-cycle"].compute({ ...p, sleepCurrent: 2 * is, activeCurrent: 2 * ia });
        expect(Math.abs((b.averageCurrent as number) / (2 * (a.averageCurrent as number)) - 1)).toBeLessThan(1e-12);
        expect(Math.abs((b.batteryLife as number) / ((a.batteryLife as number) / 2) - 1)).toBeLessThan(1e-12);
      }),
    );
  });
});

describe("drawVariant", () => {
  const custom: VariantSpec = {
    template: "shunt-burden",
    parameters: {
      supplyVoltage: { mode: "list", values: [1.8, 3.3, 5] },
      loadResistance: { mode: "range", min: 120, max: 4700, series: "E12", tolerancePercent: 5 },
      shuntResistance: { mode: "range", min: 1, max: 10, series: "E96", tolerancePercent: 1 },
    },
  };
  it("is deterministic: the same seed gives the same circuit", () => {
    fc.assert(
      fc.property(fc.constantFrom(...TEMPLATE_KEYS), fc.string(), (key, seed) => {
        const spec = defaultVariantSpec(key);
        expect(drawVariant(spec, seed)).toEqual(drawVariant(spec, seed));
      }),
      { numRuns: 300 },
    );
    // a fixed seed gives a fixed circuit on every machine (values checked by hand against the series)
    const a = drawVariant(custom, "lab-7:student-42");
    expect(drawVariant(custom, "lab-7:student-42")).toEqual(a);
  });
  it("stays within the spec's ranges, snaps resistors to their series and always gives a computable circuit", () => {
    fc.assert(
      fc.property(fc.string(), (seed) => {
        const p = drawVariant(custom, seed);
        expect([1.8, 3.3, 5]).toContain(p.supplyVoltage);
        const rl = p.loadResistance as number;
        const rsh = p.shuntResistance as number;
        expect(rl).toBeGreaterThanOrEqual(120);
        expect(rl).toBeLessThanOrEqual(4700);
        expect(nearestStandard(rl, "E12", "nearest")).toBe(rl);
        expect(rsh).toBeGreaterThanOrEqual(1);
        expect(rsh).toBeLessThanOrEqual(10);
        expect(nearestStandard(rsh, "E96", "nearest")).toBe(rsh);
        expect(isComputable(templates["shunt-burden"], p)).toBe(true);
      }),
      { numRuns: 1000 },
    );
    for (const key of TEMPLATE_KEYS) {
      const spec = defaultVariantSpec(key);
      for (let i = 0; i < 300; i++) {
        const p = drawVariant(spec, `s${i}`);
        expect(templates[key].check(p)).toBeNull();
        for (const ps of templates[key].parameters) {
          const d = spec.parameters[ps.key];
          if (d.mode === "range") {
            expect(p[ps.key] as number).toBeGreaterThanOrEqual(d.min);
            expect(p[ps.key] as number).toBeLessThanOrEqual(d.max);
          }
          if (ps.kind === "resistor") expect(nearestStandard(p[ps.key] as number, d.series ?? "E24", "nearest")).toBe(p[ps.key]);
        }
      }
    }
  });
  it("different seeds give different circuits", () => {
    const seen = new Set<string>();
    for (let i = 0; i < 50; i++) seen.add(JSON.stringify(drawVariant(defaultVariantSpec("filter-noise"), `student-${i}`)));
    expect(seen.size).toBeGreaterThan(40);
  });
  it("redraws a circuit the template cannot compute (range-resolution never saturates every range)", () => {
    const spec: VariantSpec = {
      template: "range-resolution",
      parameters: { current: { mode: "range", min: 1e-10, max: 10 } },
    };
    for (let i = 0; i < 300; i++) {
      const p = drawVariant(spec, `r${i}`);
      expect(p.current as number).toBeLessThan(0.99985); // the teaching meter's 1 A range tops out at code 16383
      expect(p.current as number).toBeGreaterThan(0.3e-9); // one code on the 5 µA range: 2.5 V / 2^14 / 5·10⁵ V/A = 305 pA
      expect(templates["range-resolution"].compute(p).bestRange).not.toBe("");
    }
  });
  it("throws a clear error for a spec that can never work", () => {
    expect(() => drawVariant({ template: "duty-cycle", parameters: { activeTime: { mode: "fixed", value: 5 }, period: { mode: "fixed", value: 1 } } }, "x")).toThrow(/never/);
  });
});
