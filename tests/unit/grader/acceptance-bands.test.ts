// The acceptance bands an expert would sign (issue: "Physics that an expert would sign", §1). Each case is
// worked by hand in its comment from the formula named beside it (PHYSICS.md §15–§17); the grader's verdict
// and band are compared with the hand value, never with its own output.
import { describe, expect, it } from "vitest";
import {
  bandWarnings,
  defaultVariantSpec,
  drawVariant,
  gradeAttempt,
  templates,
  type GradePolicy,
  type Params,
  type TemplateKey,
} from "../../../lib/grader";
import { near } from "./helpers";

type Q = { quantity: string; kind: "prediction" | "bench" };
function grade(template: TemplateKey, params: Params, q: Q, answer: string | number, policy: GradePolicy = {}) {
  return gradeAttempt({ template, params, questions: [{ points: 1, ...q }], readings: [answer], policy }).results[0];
}
const half = (r: { band: [number, number] | null }) => (r.band![1] - r.band![0]) / 2;

describe("reversal current at the bench: the shunt's tolerance is propagated", () => {
  // PHYSICS.md §15 15c and §17 17h [FORMULA]: R = 1 mΩ ± 1 %, I = 100 mA, V_os = 10 µV, S = 5 µV/K, ΔT = 1 K.
  // The readings come from the actual shunt, V± = ±I·R_actual + 15 µV, and the student divides by the given
  // 1 mΩ: I_rev = I·R_actual/R, so ±1 % of 100 mA = 1.000 mA; the meter's ±0.5 % on V₊ = 115 µV and
  // V₋ = −85 µV adds 0.005 × 200 µV/2 mΩ = 0.5000 mA. Half-width 1.500 mA: 98.50 to 101.5 mA.
  const p = { shuntResistance: 1e-3, current: 0.1, offsetVoltage: 10e-6, seebeckMicrovoltsPerKelvin: 5, junctionTemperatureDifference: 1 };
  const policy: GradePolicy = { instrumentAccuracyPercent: 0.5, componentTolerances: { shuntResistance: 1 } };
  it("the lesson's careful student reading 101.2 mA is correct, with a band of ±1.500 mA", () => {
    const r = grade("offset-thermal", p, { quantity: "reversedCurrent", kind: "bench" }, "101.2 mA", policy);
    near(half(r), 1.5e-3, 1e-3);
    expect(r.verdict).toBe("correct");
  });
  it("102.8 mA is outside it (close, within twice the band), and 200 mA is still the unhalved difference", () => {
    expect(grade("offset-thermal", p, { quantity: "reversedCurrent", kind: "bench" }, "102.8 mA", policy).verdict).toBe("close");
    expect(grade("offset-thermal", p, { quantity: "reversedCurrent", kind: "bench" }, "200 mA", policy).mistake).toBe("unhalved-difference");
  });
  it("a student who measured the shunt loses the shunt's share of the band (±0.5000 mA left, lab tolerance 0.1 %)", () => {
    const r = gradeAttempt({
      template: "offset-thermal",
      params: p,
      questions: [{ quantity: "reversedCurrent", kind: "bench", points: 1 }],
      readings: ["100.3 mA"],
      measuredParams: { shuntResistance: 1e-3 },
      policy: { ...policy, relativeTolerance: 0.001 },
    }).results[0];
    near(half(r), 0.5e-3, 1e-3);
  });
});

describe("offset-thermal draws an offset larger than the signal when the amplifier stays in range", () => {
  // PHYSICS.md §15 15e [FORMULA: V± = ±I·R + V_os + V_th]: R = 1 mΩ, I = 10 mA (I·R = 10 µV), V_os = 10 µV,
  // S = 5 µV/K, ΔT = 1 K: offsets 15.00 µV > I·R; V₊ = 25.00 µV, V₋ = 5.000 µV, I = (25 − 5) µV/2 mΩ = 10.00 mA.
  const p = { shuntResistance: 1e-3, current: 0.01, offsetVoltage: 10e-6, seebeckMicrovoltsPerKelvin: 5, junctionTemperatureDifference: 1, inputRange: 0.1 };
  it("is computable and the reversal gives the current back", () => {
    expect(templates["offset-thermal"].check(p)).toBeNull();
    const v = templates["offset-thermal"].compute(p);
    near(v.forwardVoltage, 25e-6);
    near(v.reverseVoltage, 5e-6);
    near(v.reversedCurrent, 10e-3);
  });
  it("is refused only when a reading leaves the amplifier's input range", () => {
    // V₊ = 25 µV against a ±20 µV range [FORMULA]
    expect(templates["offset-thermal"].check({ ...p, inputRange: 20e-6 })).toMatch(/input range/);
  });
  it("the default lab now draws such circuits", () => {
    const spec = defaultVariantSpec("offset-thermal");
    let larger = 0;
    for (let i = 0; i < 400; i++) {
      const d = drawVariant(spec, `big-offset-${i}`);
      const v = templates["offset-thermal"].compute(d);
      if (Math.abs((v.forwardVoltage as number) + (v.reverseVoltage as number)) / 2 >= (d.current as number) * (d.shuntResistance as number)) larger++;
    }
    expect(larger).toBeGreaterThan(0);
  });
});

describe("uncertainty: the floor only for a contribution the lab switches off", () => {
  // PHYSICS.md §17 17k [FORMULA: GUM F.2.2.1, q/√12]: V = 50 mV, 1 count 0.1 mV, ±(0.5 % + 2 counts),
  // R = 0.1 Ω ± 1 %, 16-bit converter, V_ref = 3.3 V, G = 50: q = 3.3/(65536·50) = 1.007 µV at the shunt,
  // u_q(I) = q/√12/R = 2.907 µA, beside u_c ≈ 3.9 mA. Its band is ±1 % of itself (29.07 nA), not ±0.1·1 %·u_c.
  const p = {
    reading: 0.05, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 1e-4, shuntResistance: 0.1, shuntTolerancePercent: 1, coverageFactor: 2,
    shuntTempcoPpm: 50, temperatureChange: 10, gainErrorPercent: 0.2, referenceTolerancePercent: 0.1, amplifierGain: 50, adcBits: 16, adcReference: 3.3,
  };
  it("a small non-zero contribution keeps its relative band and a tenfold slip is refused", () => {
    const r = grade("uncertainty", p, { quantity: "quantisationContribution", kind: "prediction" }, "2.907 µA");
    near(r.expected, 2.907e-6, 1e-3);
    near(half(r), 2.907e-8, 1e-3);
    expect(r.verdict).toBe("correct");
    expect(grade("uncertainty", p, { quantity: "quantisationContribution", kind: "prediction" }, "29.07 µA").verdict).toBe("wrong");
    expect(grade("uncertainty", p, { quantity: "quantisationContribution", kind: "prediction" }, "0.2907 µA").verdict).toBe("wrong");
    // q/√3 instead of q/√12: twice the value, 5.814 µA [FORMULA]
    expect(grade("uncertainty", p, { quantity: "quantisationContribution", kind: "prediction" }, "5.814 µA").mistake).toBe("step-not-halved");
  });
  it("a contribution switched off (no converter) still accepts a small answer near zero", () => {
    // u_c = 3.940 mA (PHYSICS.md §9 9g with the converter removed changes it by 0.01 %); floor 0.1 × 1 % × u_c ≈ 3.9 µA
    const off = { ...p, adcBits: 0 };
    const r = grade("uncertainty", off, { quantity: "quantisationContribution", kind: "prediction" }, "1 µA");
    expect(r.verdict).toBe("correct");
    near(half(r), 0.1 * 0.01 * 3.9397e-3, 2e-3);
  });
  it("with the builder's defaults, the step-not-halved slip is never accepted in 1,500 drawn labs", () => {
    const spec = defaultVariantSpec("uncertainty");
    let accepted = 0;
    for (let i = 0; i < 1500; i++) {
      const d = drawVariant(spec, `step-${i}`);
      const slip = templates.uncertainty.mistakes(d, "quantisationContribution").find((m) => m.key === "step-not-halved");
      if (!slip) continue;
      const r = grade("uncertainty", d, { quantity: "quantisationContribution", kind: "prediction" }, slip.value as number);
      if (r.verdict === "correct") accepted++;
    }
    expect(accepted).toBe(0);
  });
});

describe("naming a wrong method near zero uses the plain relative tolerance", () => {
  // PHYSICS.md §16 and §17 17l [FORMULA: f_a = |1/T − n·f_log|]: T = 0.999 s, f_log = 1 Hz: f_a = 1.001 mHz,
  // band ±1.000 mHz (floor 0.1 × 1 % × 1 Hz). An answer of 2.5 mHz lies within 2× the band: close. The
  // "aliasing ignored" value 1/T = 1.001 Hz is matched within ±1 % of itself, 10.01 mHz, far from 2.5 mHz.
  const p = { sampleRate: 1000, burstWidth: 5e-3, requiredSamples: 20, wakePeriod: 0.999, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6 };
  it("2.5 mHz is close, not aliasing ignored", () => {
    const r = grade("sampling-burst", p, { quantity: "apparentWakeFrequency", kind: "prediction" }, "2.5 mHz");
    near(r.expected, 1.001e-3, 1e-3);
    expect(r.mistake).toBeUndefined();
    expect(r.verdict).toBe("close");
  });
  it("the true wake rate, 1.001 Hz, is still named as aliasing ignored", () => {
    expect(grade("sampling-burst", p, { quantity: "apparentWakeFrequency", kind: "prediction" }, "1.001 Hz").mistake).toBe("ignored-aliasing");
  });
});

describe("counts at the bench: the whole number below and above", () => {
  // PHYSICS.md §16 and §17 17m [FORMULA: n_b = t_b·f_s]: t_b = 7.3 ms at 1 kHz: 7.300 samples; a burst
  // catches 7 or 8 samples, as its edges fall.
  const p = { sampleRate: 1000, burstWidth: 7.3e-3, requiredSamples: 20, wakePeriod: 1.02, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6 };
  const q: Q = { quantity: "samplesPerBurst", kind: "bench" };
  it("7 and 8 are correct at the bench; 6 and 9 are not", () => {
    expect(grade("sampling-burst", p, q, "7", { instrumentAccuracyPercent: 0.5 }).verdict).toBe("correct");
    expect(grade("sampling-burst", p, q, "8", { instrumentAccuracyPercent: 0.5 }).verdict).toBe("correct");
    expect(grade("sampling-burst", p, q, "6", { instrumentAccuracyPercent: 0.5 }).verdict).not.toBe("correct");
    expect(grade("sampling-burst", p, q, "9", { instrumentAccuracyPercent: 0.5 }).verdict).not.toBe("correct");
  });
  it("the prediction keeps ±1 % of 7.300", () => {
    expect(grade("sampling-burst", p, { quantity: "samplesPerBurst", kind: "prediction" }, "7").verdict).not.toBe("correct");
    expect(grade("sampling-burst", p, { quantity: "samplesPerBurst", kind: "prediction" }, "7.3").verdict).toBe("correct");
  });
  it("an exact whole count (5.000) accepts 5 only", () => {
    const five = { ...p, burstWidth: 5e-3 };
    expect(grade("sampling-burst", five, q, "5").verdict).toBe("correct");
    expect(grade("sampling-burst", five, q, "6").verdict).not.toBe("correct");
  });
});

describe("the builder warns where a bench meter cannot resolve the answer", () => {
  // PHYSICS.md §14 14b and §17 17g/17n [FORMULA]: the guarded error 0.5020 % read with a ±0.5 % meter has a
  // half-width of 0.5025 points, wider than the value: a tenth of it (0.0502 %) would be accepted.
  it("warns for the guarded error as a bench reading, not as a prediction", () => {
    const spec = defaultVariantSpec("leakage-guard");
    const policy: GradePolicy = { instrumentAccuracyPercent: 0.5 };
    const w = bandWarnings(spec, [
      { quantity: "guardedErrorPercent", kind: "bench", points: 1 },
      { quantity: "guardedErrorPercent", kind: "prediction", points: 1 },
      { quantity: "leakageCurrent", kind: "bench", points: 1 },
    ], policy);
    expect(w.map((x) => [x.index, x.kind])).toEqual([[0, "bench"]]);
    expect(w[0].message).toMatch(/instrument/);
    expect(w[0].message).toMatch(/prediction/);
  });
  it("the grader itself keeps the honest band: a careful reading is accepted", () => {
    const p = { sourceVoltage: 10, insulationResistance: 1e11, measuredCurrent: 1e-9, biasCurrent: 5e-12, guardVoltage: 2e-3 };
    // I_read = 1.00502 nA read 0.4 % high: 1.00904 nA → e = 0.904 % (within 0.5020 ± 0.5025)
    const r = grade("leakage-guard", p, { quantity: "guardedErrorPercent", kind: "bench" }, "0.904", { instrumentAccuracyPercent: 0.5 });
    near(half(r), 0.5025, 1e-3);
    expect(r.verdict).toBe("correct");
  });
});
