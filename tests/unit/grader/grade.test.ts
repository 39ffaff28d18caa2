import { describe, expect, it } from "vitest";
import { readFileSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import katex from "katex";
import {
  TEMPLATE_KEYS,
  defaultParams,
  defaultVariantSpec,
  drawVariant,
  gradeAttempt,
  gradePolicySchema,
  graderVersion,
  questionSchema,
  readingProblem,
  templates,
  variantSpecSchema,
} from "../../../lib/grader";

const sb = { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 };
const q1 = (quantity: string, kind: "prediction" | "bench" = "prediction", points = 1) => ({ quantity, kind, points });

describe("answers that are never graded, and the capital-M slip", () => {
  it("an unreadable, ambiguous or wrong-kind answer, or a category not offered, is a problem to fix before grading", () => {
    expect(readingProblem("shunt-burden", "indicatedCurrent", "3,267 uA")).toMatch(/two ways/);
    expect(readingProblem("shunt-burden", "indicatedCurrent", "3.3 V")).toMatch(/voltage/);
    expect(readingProblem("shunt-burden", "indicatedCurrent", "abc")).toMatch(/Could not read/);
    expect(readingProblem("range-resolution", "bestRange", "banana")).toMatch(/Choose one of/);
    // blanks are "no answer", and readable answers are graded
    expect(readingProblem("shunt-burden", "indicatedCurrent", "")).toBeNull();
    expect(readingProblem("shunt-burden", "indicatedCurrent", "3 ma")).toBeNull();
  });
  it("3.267 MA for 3.267 mA is a prefix slip that names the capital M (a factor of 10⁹ = 10⁶ / 10⁻³)", () => {
    // 3.3 V / 1010 Ω = 3.267 mA (Ohm's law, by hand)
    const r = gradeAttempt({ template: "shunt-burden", params: sb, questions: [q1("indicatedCurrent")], readings: ["3.267 MA"] }).results[0];
    expect(r.verdict).toBe("mistake");
    expect(r.mistake).toBe("prefix-slip");
    expect(r.feedback).toMatch(/capital M/);
  });
});

describe("verdicts and points", () => {
  const one = (reading: string | number | null, policy = {}) =>
    gradeAttempt({ template: "shunt-burden", params: sb, questions: [q1("indicatedCurrent", "prediction", 4)], readings: [reading], policy }).results[0];

  it("correct within the 1 % band: full points, and the reading is echoed", () => {
    const r = one("3.28 mA"); // 3.2673 mA · 1.0039
    expect(r.verdict).toBe("correct");
    expect(r.points).toBe(4);
    expect(r.readAs).toBe("3.28 mA");
    expect(r.feedback).toMatch(/Read as 3\.28 mA/);
  });
  it("close within 2× the band: half points", () => {
    const r = one("3.31 mA"); // +1.3 %
    expect(r.verdict).toBe("close");
    expect(r.points).toBe(2);
  });
  it("lab settings change the close band and credit", () => {
    expect(one("3.36 mA").verdict).toBe("wrong"); // +2.8 %
    const r = one("3.36 mA", { closeMultiple: 3, closeCredit: 0.25 });
    expect(r.verdict).toBe("close");
    expect(r.points).toBe(1);
    expect(one("3.36 mA", { relativeTolerance: 0.05 }).verdict).toBe("correct");
  });
  it("wrong outside the close band", () => {
    const r = one("4.1 mA");
    expect(r.verdict).toBe("wrong");
    expect(r.points).toBe(0);
    expect(r.feedback).toMatch(/3\.267 mA/);
  });
  it("unit: a voltage for a current, or no unit at all", () => {
    const r = one("3.267 V");
    expect(r.verdict).toBe("unit");
    expect(r.feedback).toMatch(/voltage/);
    expect(one("3.267").verdict).toBe("unit");
  });
  it("missing: null, empty or blank", () => {
    for (const a of [null, "", "   "]) expect(one(a).verdict).toBe("missing");
  });
  it("a typo is wrong, with a message", () => {
    const r = one("3.2.6 mA");
    expect(r.verdict).toBe("wrong");
    expect(r.feedback).toMatch(/Could not read/);
  });
  it("numbers are taken as SI", () => {
    expect(one(3.267e-3).verdict).toBe("correct");
  });
  it("sums the score and stamps the grader version", () => {
    const g = gradeAttempt({
      template: "shunt-burden",
      params: sb,
      questions: [q1("trueCurrent", "prediction", 2), q1("indicatedCurrent", "prediction", 3), q1("burdenVoltage", "prediction", 5)],
      readings: ["3.3 mA", "3.31 mA", "1 V"],
    });
    expect(g.score).toBe(2 + 1.5);
    expect(g.maxScore).toBe(10);
    expect(g.graderVersion).toBe(graderVersion);
    expect(graderVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });
  it("readings can be keyed by question id or by quantity", () => {
    const g = gradeAttempt({
      template: "shunt-burden",
      params: sb,
      questions: [{ id: "p1", ...q1("indicatedCurrent") }, q1("trueCurrent")],
      readings: { p1: "3.267 mA", trueCurrent: "3.3 mA" },
    });
    expect(g.results.map((r) => r.verdict)).toEqual(["correct", "correct"]);
    expect(g.results[0].id).toBe("p1");
  });
  it("a question's own tolerance overrides the policy", () => {
    const g = gradeAttempt({ template: "shunt-burden", params: sb, questions: [{ ...q1("indicatedCurrent"), tolerancePercent: 3 }], readings: ["3.35 mA"] });
    expect(g.results[0].verdict).toBe("correct");
  });
});

describe("category answers", () => {
  // the teaching meter (lib/instruments/library.ts): 300 µA is best read on its 500 µA range
  const rr = { current: 300e-6, fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 };
  it("accepts µ (U+00B5), μ (U+03BC), u, any case", () => {
    for (const a of ["500 µA", "500 μA", "500 uA", "500 UA", " 500ua ", "500 µA range"]) {
      const r = gradeAttempt({ template: "range-resolution", params: rr, questions: [q1("bestRange")], readings: [a] }).results[0];
      expect(r.verdict, a).toBe("correct");
      expect(r.band).toBeNull();
    }
  });
  it("an unknown choice is wrong", () => {
    const r = gradeAttempt({ template: "range-resolution", params: rr, questions: [q1("bestRange")], readings: ["kA"] }).results[0];
    expect(r.verdict).toBe("wrong");
  });
  it("the ADC code is accepted ±1 code", () => {
    // 300 µA on the 500 µA range: 1.500 V → 1.500 · 16384 / 2.5 = 9830.4 → code 9830 (IEEE Std 1241, truncating)
    for (const [a, v] of [[9829, "correct"], [9830, "correct"], [9831, "correct"], [9832, "close"], [9838, "wrong"]] as const) {
      const r = gradeAttempt({ template: "range-resolution", params: rr, questions: [q1("adcCode")], readings: [String(a)] }).results[0];
      expect(r.verdict, String(a)).toBe(v);
    }
  });
});

describe("bench bands", () => {
  const policy = { componentTolerances: { loadResistance: 5, shuntResistance: 1 }, instrumentAccuracyPercent: 0.5 };
  it("propagate component tolerances and instrument accuracy worst-case, first order, and name the method", () => {
    const r = gradeAttempt({ template: "shunt-burden", params: sb, questions: [q1("indicatedCurrent", "bench")], readings: ["3.1 mA"], policy }).results[0];
    // ∂ln I/∂ln R_L = R_L/(R_L+R_sh), ∂ln I/∂ln R_sh = R_sh/(R_L+R_sh):
    // 1000/1010 · 5 % + 10/1010 · 1 % + 0.5 % = 5.4604 %
    const expected = 3.3 / 1010;
    const half = expected * (((1000 / 1010) * 5 + (10 / 1010) * 1 + 0.5) / 100);
    expect(Math.abs(r.band![1] - (expected + half)) / half).toBeLessThan(1e-5);
    expect(r.verdict).toBe("correct");
    expect(r.method).toBe("worst-case first-order propagation");
    expect(r.feedback).toMatch(/worst-case first-order propagation/);
  });
  it("a prediction keeps the lab tolerance", () => {
    const r = gradeAttempt({ template: "shunt-burden", params: sb, questions: [q1("indicatedCurrent", "prediction")], readings: ["3.1 mA"], policy }).results[0];
    expect(r.verdict).toBe("wrong");
    expect(r.method).toBe("lab tolerance");
  });
  it("the lab tolerance wins when it is wider", () => {
    const r = gradeAttempt({ template: "shunt-burden", params: sb, questions: [q1("indicatedCurrent", "bench")], readings: ["3.267 mA"], policy: { componentTolerances: { shuntResistance: 1 } } }).results[0];
    expect(r.band![1] - 3.3 / 1010).toBeCloseTo((3.3 / 1010) * 0.01, 12);
  });
  it("measured component values replace the nominal ones for bench questions only", () => {
    const g = gradeAttempt({
      template: "shunt-burden",
      params: sb,
      measuredParams: { loadResistance: 1020 },
      questions: [q1("indicatedCurrent", "bench"), q1("indicatedCurrent", "prediction")],
      readings: ["3.204 mA", "3.204 mA"],
      policy,
    });
    near(g.results[0].expected as number, 3.3 / 1030);
    // R_L is known now: only R_sh (10/1030 · 1 %) and the meter (0.5 %) remain, below the 1 % lab tolerance
    expect(Math.abs(g.results[0].band![1] / (3.3 / 1030) - 1.01)).toBeLessThan(1e-9);
    expect(g.results[0].verdict).toBe("correct");
    expect(g.results[0].feedback).toMatch(/measured/);
    near(g.results[1].expected as number, 3.3 / 1010);
    expect(g.results[1].verdict).toBe("close"); // 3.204 vs 3.267: −1.9 %
  });
});

function near(a: number, b: number) {
  expect(Math.abs(a / b - 1)).toBeLessThan(1e-12);
}

describe("worked solutions", () => {
  it("every template and quantity gives KaTeX-valid steps with the student's numbers", () => {
    for (const key of TEMPLATE_KEYS) {
      for (let i = 0; i < 8; i++) {
        const params = i === 0 ? defaultParams(key) : drawVariant(defaultVariantSpec(key), `sol-${i}`);
        const questions = templates[key].quantities.map((q) => q1(q.key));
        const values = templates[key].compute(params);
        const readings = i % 2 === 0 ? questions.map((q) => values[q.quantity]) : questions.map((q) => (typeof values[q.quantity] === "string" ? "µA" : `${values[q.quantity]} kg`));
        const g = gradeAttempt({ template: key, params, questions, readings });
        for (const r of g.results) {
          expect(r.solution.length, `${key}.${r.quantity}`).toBeGreaterThan(0);
          for (const step of r.solution) expect(() => katex.renderToString(step, { throwOnError: true, strict: "error" }), step).not.toThrow();
        }
      }
    }
  }, 60_000);
  it("uses the student's own values", () => {
    const g = gradeAttempt({ template: "shunt-burden", params: { supplyVoltage: 1.8, loadResistance: 100, shuntResistance: 10 }, questions: [q1("indicatedCurrent")], readings: ["16.4 mA"] });
    const text = g.results[0].solution.join(" ");
    expect(text).toContain("1.80\\,\\mathrm{V}");
    expect(text).toContain("100\\,\\Omega");
    expect(text).toContain("16.36\\,\\mathrm{mA}");
    expect(text).toContain("your answer");
  });
});

describe("public contract", () => {
  it("has the ten templates with the quantity names of lib/grader/README.md", () => {
    const names: Record<string, string[]> = {
      "shunt-burden": ["trueCurrent", "indicatedCurrent", "burdenVoltage", "loadingErrorPercent"],
      "shunt-selection": ["idealShunt", "standardShunt", "burdenAtFullScale", "shuntPower"],
      "range-resolution": ["bestRange", "outputVoltage", "adcCode", "currentResolution"],
      "duty-cycle": ["averageCurrent", "chargePerWake", "batteryLife"],
      "bidirectional-offset": ["signedCurrent", "maxPositiveCurrent", "maxNegativeCurrent"],
      "filter-noise": ["timeConstant", "cutoffFrequency", "settlingTime1pct", "noiseBandwidth", "thermalNoiseVoltage", "thermalNoiseCurrent"],
      uncertainty: [
        "current",
        "relativeStandardUncertaintyPercent",
        "combinedStandardUncertainty",
        "expandedUncertainty",
        "sensitivityReading",
        "sensitivityShunt",
        "readingContribution",
        "shuntToleranceContribution",
        "tempcoContribution",
        "gainContribution",
        "referenceContribution",
        "quantisationContribution",
        "repeatabilityContribution",
        "offsetContribution",
        "biasContribution",
        "leakageContribution",
        "dominantContribution",
      ],
      "leakage-guard": ["leakageCurrent", "leakageErrorPercent", "biasErrorPercent", "unguardedErrorPercent", "guardedLeakage", "guardedErrorPercent"],
      "offset-thermal": ["thermalEmf", "apparentCurrent", "offsetErrorPercent", "forwardVoltage", "reverseVoltage", "reversedCurrent"],
      "sampling-burst": ["samplesPerBurst", "minimumSampleRate", "apparentWakeFrequency", "worstCaseAverageError", "worstCaseErrorPercent"],
    };
    const params: Record<string, string[]> = {
      "shunt-burden": ["supplyVoltage", "loadResistance", "shuntResistance"],
      "shunt-selection": ["maxCurrent", "maxBurden", "series"],
      "range-resolution": ["current", "fullScaleVoltage", "adcBits", "adcReference"],
      "duty-cycle": ["sleepCurrent", "activeCurrent", "activeTime", "period", "batteryCapacity", "usableFraction"],
      "bidirectional-offset": ["offsetVoltage", "sensitivity", "outputVoltage", "fullScaleVoltage"],
      "filter-noise": ["filterResistance", "filterCapacitance", "shuntResistance", "temperature"],
      uncertainty: [
        "reading",
        "readingAccuracyPercent",
        "readingCounts",
        "countSize",
        "shuntResistance",
        "shuntTolerancePercent",
        "coverageFactor",
        "shuntTempcoPpm",
        "temperatureChange",
        "gainErrorPercent",
        "referenceTolerancePercent",
        "amplifierGain",
        "adcBits",
        "adcReference",
        "repeatStdDev",
        "repeatCount",
        "offsetBound",
        "biasCurrentBound",
        "leakageBound",
      ],
      "leakage-guard": ["sourceVoltage", "insulationResistance", "measuredCurrent", "biasCurrent", "guardVoltage"],
      "offset-thermal": ["shuntResistance", "current", "offsetVoltage", "seebeckMicrovoltsPerKelvin", "junctionTemperatureDifference", "inputRange"],
      "sampling-burst": ["sampleRate", "burstWidth", "requiredSamples", "wakePeriod", "logRate", "activeCurrent", "sleepCurrent"],
    };
    expect(Object.keys(templates).sort()).toEqual(Object.keys(names).sort());
    for (const key of TEMPLATE_KEYS) {
      expect(templates[key].quantities.map((q) => q.key)).toEqual(names[key]);
      expect(templates[key].parameters.map((p) => p.key)).toEqual(params[key]);
      for (const p of templates[key].parameters) {
        expect(p.label.length).toBeGreaterThan(2);
        expect(["number", "resistor", "integer", "category"]).toContain(p.kind);
        if (p.kind === "category") expect(p.choices?.length).toBeGreaterThan(0);
        else {
          expect(p.min, `${key}.${p.key}`).toBeLessThanOrEqual(p.default as number);
          expect(p.max, `${key}.${p.key}`).toBeGreaterThanOrEqual(p.default as number);
          if (p.suggestedRange) {
            expect(p.suggestedRange[0]).toBeGreaterThanOrEqual(p.min!);
            expect(p.suggestedRange[1]).toBeLessThanOrEqual(p.max!);
          }
        }
        expect(p.displayUnit).toBeTypeOf("string");
        expect(p.symbol.length).toBeGreaterThan(0);
      }
      expect(templates[key].check(defaultParams(key))).toBeNull();
    }
    // defaults from lib/grader/README.md
    expect(defaultParams("range-resolution")).toMatchObject({ fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 });
    expect(defaultParams("duty-cycle")).toMatchObject({ usableFraction: 0.8 });
    expect(defaultParams("bidirectional-offset")).toMatchObject({ offsetVoltage: 1.25, fullScaleVoltage: 2.5 });
    expect(defaultParams("uncertainty")).toMatchObject({ coverageFactor: 2 });
  });
  it("zod schemas accept good input and reject bad input", () => {
    expect(variantSpecSchema.safeParse(defaultVariantSpec("shunt-burden")).success).toBe(true);
    expect(variantSpecSchema.safeParse({ template: "nope", parameters: {} }).success).toBe(false);
    expect(variantSpecSchema.safeParse({ template: "shunt-burden", parameters: { loadResistance: { mode: "range", min: 10, max: 1 } } }).success).toBe(false);
    expect(questionSchema.safeParse({ quantity: "trueCurrent", kind: "bench", points: 2 }).success).toBe(true);
    expect(questionSchema.safeParse({ quantity: "trueCurrent", kind: "guess", points: 2 }).success).toBe(false);
    expect(gradePolicySchema.parse({})).toEqual({ relativeTolerance: 0.01, closeMultiple: 2, closeCredit: 0.5 });
  });
  it("lib/grader imports nothing but mathjs, zod and its own files", () => {
    const dir = path.join(import.meta.dirname, "../../../lib/grader");
    const files: string[] = [];
    const walk = (d: string) => {
      for (const f of readdirSync(d)) {
        const p = path.join(d, f);
        if (statSync(p).isDirectory()) walk(p);
        else if (p.endsWith(".ts")) files.push(p);
      }
    };
    walk(dir);
    expect(files.length).toBeGreaterThan(10);
    for (const f of files) {
      const src = readFileSync(f, "utf8");
      for (const m of src.matchAll(/from\s+"([^"]+)"/g)) expect(["mathjs", "zod"].includes(m[1]) || m[1].startsWith("."), `${f}: ${m[1]}`).toBe(true);
    }
  });
});

describe("saturation", () => {
  it("a saturated ADC code is flagged in the feedback", () => {
    // 8 µA on the 5 µA range clips at code 16383 (PHYSICS.md §12.3); the best range is 500 µA
    const r = gradeAttempt({
      template: "range-resolution",
      params: { current: 8e-6, fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 },
      questions: [q1("adcCode")],
      readings: ["16383"],
    }).results[0];
    expect(r.verdict).toBe("mistake");
    expect(r.mistake).toBe("wrong-range");
    expect(r.feedback).toMatch(/saturated/);
  });
});

describe("bad input", () => {
  it("measured values that cannot be computed are ignored, with a note", () => {
    const r = gradeAttempt({
      template: "shunt-burden",
      params: sb,
      measuredParams: { loadResistance: -5 },
      questions: [q1("indicatedCurrent", "bench")],
      readings: ["3.267 mA"],
    }).results[0];
    expect(r.verdict).toBe("correct");
    expect(r.feedback).toMatch(/measured component values were not used/);
  });
  it("a lab configuration error throws a clear error", () => {
    expect(() => gradeAttempt({ template: "shunt-burden", params: { ...sb, loadResistance: 0 }, questions: [q1("trueCurrent")], readings: ["1 mA"] })).toThrow(/cannot grade/);
    expect(() => gradeAttempt({ template: "shunt-burden", params: sb, questions: [q1("noSuchQuantity")], readings: ["1 mA"] })).toThrow(/no quantity/);
  });
});
