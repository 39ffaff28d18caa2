// The hidden-case check over drawn labs, for every template and both kinds of question (issue "Physics that
// an expert would sign", Done means): the exact answer is accepted, an answer rounded by 0.5 % either way is
// accepted, ten times and one tenth of the answer earn nothing, and a careful student at the bench, whose
// parts are within their ±1 % and whose meter reads within ±0.4 % (the lab states ±0.5 %), is accepted.
// Where a band cannot refuse one tenth (a meter that cannot resolve the value, a floor near zero), the lab
// builder warns the instructor (bandWarnings); the list of such questions is written out below with the
// physics that makes it so. Sources: PHYSICS.md §17 (bench bands, JCGM 100:2008 §5.1.2 with a worst-case
// sum) and §16; the student model is the bench itself: readings taken on the actual circuit, worked out with
// the lab's given values.
import { describe, expect, it, vi } from "vitest";
import {
  TEMPLATE_KEYS,
  bandWarnings,
  componentTolerancesFromSpec,
  defaultVariantSpec,
  drawVariant,
  gradeAttempt,
  seededRandom,
  templates,
  type GradePolicy,
  type Params,
  type Question,
  type TemplateKey,
} from "../../../lib/grader";

vi.setConfig({ testTimeout: 120_000 });

const DRAWS = 200;
const seed = (i: number) => `band-check-${i}`; // the seeds bandWarnings draws with

/** What a careful student reads at the bench: actual parts within ±tol, a meter within ±0.4 % on each reading. */
function benchStudent(key: TemplateKey, params: Params, quantity: string, tolerances: Record<string, number>, rng: () => number): number | string {
  const t = templates[key];
  const actual: Params = { ...params };
  for (const [k, tol] of Object.entries(tolerances)) {
    if (typeof params[k] !== "number") continue;
    // corners half the time: the worst case a first-order band has to hold
    const u = rng() < 0.5 ? (rng() < 0.5 ? -1 : 1) : 2 * rng() - 1;
    actual[k] = (params[k] as number) * (1 + (u * tol) / 100);
  }
  const meter = () => 1 + 0.004 * (rng() < 0.5 ? (rng() < 0.5 ? -1 : 1) : 2 * rng() - 1);
  const spec = t.quantities.find((q) => q.key === quantity)!;
  const value = t.compute(actual)[quantity];
  if (spec.kind === "category") return value;
  if (spec.counted) return rng() < 0.5 ? Math.floor(value as number) : Math.ceil(value as number);
  const read = t.instrumentReadings?.(actual, quantity);
  if (read) {
    const worked = t.instrumentReadings!(params, quantity)!; // the formula with the lab's given values
    const readings: Record<string, number> = {};
    for (const [n, r] of Object.entries(read.values)) readings[n] = r * meter();
    return worked.formula(readings);
  }
  const bench = t.benchValue?.(params, actual, quantity);
  return (bench !== undefined ? bench : (value as number)) * meter();
}

/**
 * Questions whose band cannot refuse one tenth on the default labs, and why (the builder warns for them).
 * key: `template/quantity/kind`.
 */
const CANNOT_REFUSE: Record<string, string> = {
  // a loading error of a fraction of a percent is the difference of two current readings, each ±0.5 %:
  // the band is about ±1 point (PHYSICS.md §17 17a)
  "shunt-burden/loadingErrorPercent/bench": "difference of two readings",
  // an error against the set current from one reading of ±0.5 %: ±0.5 points, wider than a guarded error
  // of half a percent (PHYSICS.md §17 17g, 17n)
  "leakage-guard/guardedErrorPercent/bench": "one reading against the set current",
  "leakage-guard/unguardedErrorPercent/bench": "one reading against the set current",
  // V₋ = −I·R + V_os + V_th sits near zero when the offsets nearly equal I·R; the shunt's ±1 % moves it by
  // 1 % of I·R, far more than V₋ itself (PHYSICS.md §15)
  "offset-thermal/reverseVoltage/bench": "a small difference moved by the shunt's tolerance",
  // an alias near zero (T within 0.2 % of a whole number of logger intervals) has the 1 mHz floor that
  // four-figure working needs (PHYSICS.md §17 17i, 17l)
  "sampling-burst/apparentWakeFrequency/prediction": "floor near zero",
  "sampling-burst/apparentWakeFrequency/bench": "floor near zero",
  // a burst of two or three samples: either whole count is right, and a tenth of one sample lies within
  // twice that band (PHYSICS.md §17 17m)
  "sampling-burst/samplesPerBurst/bench": "a count of a few samples",
};

describe("hidden cases over drawn labs", () => {
  const refusalFailures = new Set<string>();
  for (const key of TEMPLATE_KEYS) {
    it(`${key}: exact and 0.5 % rounding accepted, ×10 and ×0.1 refused, a careful bench student accepted`, () => {
      const spec = defaultVariantSpec(key);
      const tolerances = componentTolerancesFromSpec(spec);
      const policy: GradePolicy = { componentTolerances: tolerances, instrumentAccuracyPercent: 0.5 };
      const t = templates[key];
      const rng = seededRandom(`hidden-${key}`);
      for (let i = 0; i < DRAWS; i++) {
        const params = drawVariant(spec, seed(i));
        const values = t.compute(params);
        for (const kind of ["prediction", "bench"] as const) {
          for (const q of t.quantities) {
            const question: Question = { quantity: q.key, kind, points: 1 };
            const one = (answer: number | string) => gradeAttempt({ template: key, params, questions: [question], readings: [answer], policy }).results[0];
            const where = `${key}/${q.key}/${kind} draw ${i}`;
            const expected = values[q.key];
            expect(one(expected).verdict, `${where}: exact`).toBe("correct");
            if (kind === "bench") {
              const s = benchStudent(key, params, q.key, tolerances, rng);
              const r = one(s);
              expect(r.verdict, `${where}: careful bench student answered ${s} against ${String(expected)}, band ${JSON.stringify(r.band)}`).toBe("correct");
            }
            if (q.kind === "category" || typeof expected !== "number" || expected === 0) continue;
            // a code or a standard value is given exactly, not rounded
            if (!q.discrete) {
              for (const f of [1.005, 0.995]) expect(one(expected * f).verdict, `${where}: rounded ×${f}`).toBe("correct");
            }
            for (const f of [10, 0.1]) {
              const r = one(expected * f);
              if (r.verdict === "correct" || r.verdict === "close") refusalFailures.add(`${key}/${q.key}/${kind}`);
            }
          }
        }
      }
      const mine = [...refusalFailures].filter((k) => k.startsWith(`${key}/`)).sort();
      expect(mine, "questions that cannot refuse ×10 or ×0.1").toEqual(Object.keys(CANNOT_REFUSE).filter((k) => k.startsWith(`${key}/`)).sort());
      // and the builder warns for exactly those
      const questions: Question[] = t.quantities.flatMap((q) => (["prediction", "bench"] as const).map((kind) => ({ quantity: q.key, kind, points: 1 })));
      const warned = bandWarnings(spec, questions, { instrumentAccuracyPercent: 0.5 }, DRAWS).map((w) => `${key}/${w.quantity}/${w.kind}`).sort();
      expect(warned).toEqual(mine);
    });
  }
});
