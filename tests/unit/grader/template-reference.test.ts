// One graded worked example per lab template, worked by hand. Each expected value is a lib/grader/PHYSICS.md
// check value (its section and source tag beside it); each band is worked by hand in the comment from the
// formula (PHYSICS.md §17). Nothing here is produced by running the grader: the grader's answer is compared
// with the hand value.
//
// Tolerances stated once: computed values agree to a relative 5e-4 (PHYSICS.md §0, four significant figures);
// band half-widths to a relative 1e-3 (the grader differentiates numerically with a relative step of 1e-6,
// and the hand values are rounded to four figures).
import { describe, expect, it } from "vitest";
import { gradeAttempt, templates, type GradePolicy, type Params, type TemplateKey } from "../../../lib/grader";
import { near } from "./helpers";

type Q = { quantity: string; kind: "prediction" | "bench"; points?: number };

/** Grade one answer to one question, as a lab would. */
function grade(template: TemplateKey, params: Params, q: Q, answer: string, policy: GradePolicy = {}) {
  return gradeAttempt({ template, params, questions: [{ points: 1, ...q }], readings: [answer], policy }).results[0];
}
const half = (r: { band: [number, number] | null }) => (r.band![1] - r.band![0]) / 2;
const centre = (r: { band: [number, number] | null }) => (r.band![1] + r.band![0]) / 2;
/** Bench readings with an instrument of ±0.5 % of reading and a lab tolerance narrow enough not to hide it. */
const meter: GradePolicy = { relativeTolerance: 0.001, instrumentAccuracyPercent: 0.5 };

it("covers every template of lib/grader", () => {
  expect(Object.keys(templates).sort()).toEqual(
    [
      "bidirectional-offset",
      "duty-cycle",
      "filter-noise",
      "leakage-guard",
      "offset-thermal",
      "range-resolution",
      "sampling-burst",
      "shunt-burden",
      "shunt-selection",
      "uncertainty",
    ].sort(),
  );
});

describe("shunt-burden", () => {
  // PHYSICS.md §2 2b [FORMULA: Ohm's law, Kirchhoff's voltage law]: 3.3 V, R_L = 1 kΩ, R_sh = 10 Ω.
  const p = { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 };
  it("indicated current 3.267 mA, band from the shunt ±1 %, the load ±1 % and the meter ±0.5 %: ±49.01 µA", () => {
    // I_meas = V_s/(R_L + R_sh) = 3.3/1010 = 3.267327 mA
    // ∂I/∂R_L·ΔR_L = I·R_L/(R_L + R_sh)·0.01 and ∂I/∂R_sh·ΔR_sh = I·R_sh/(R_L + R_sh)·0.01: together 0.01·I
    // the meter reads I_meas itself: 0.005·I.  Half-width 0.015 × 3.267327 mA = 49.01 µA (PHYSICS.md §17 17a)
    const r = grade("shunt-burden", p, { quantity: "indicatedCurrent", kind: "bench" }, "3.27 mA", {
      ...meter,
      componentTolerances: { shuntResistance: 1, loadResistance: 1 },
    });
    near(r.expected, 3.267e-3);
    near(half(r), 49.01e-6, 1e-3);
    expect(r.verdict).toBe("correct");
    expect(grade("shunt-burden", p, { quantity: "indicatedCurrent", kind: "bench" }, "3.20 mA", { ...meter, componentTolerances: { shuntResistance: 1, loadResistance: 1 } }).verdict).not.toBe("correct");
  });
});

describe("shunt-selection", () => {
  // PHYSICS.md §1 1g, 1h [FORMULA: Ohm's law; IEC 60063:2015 E24 list]: 3.3 A, 100 mV.
  const p = { maxCurrent: 3.3, maxBurden: 0.1, series: "E24" };
  it("R_max 30.30 mΩ, floor to E24 30 mΩ, 99.00 mV and 326.7 mW at full scale", () => {
    // R_max = 0.1 V / 3.3 A = 30.30 mΩ; the largest E24 value not above it is 3.0 × 10⁻² Ω = 30 mΩ
    // V_b = 3.3 A × 30 mΩ = 99.00 mV; P = 3.3² × 0.030 = 10.89 × 0.030 = 326.7 mW
    near(grade("shunt-selection", p, { quantity: "idealShunt", kind: "prediction" }, "30.3 mΩ").expected, 30.30e-3);
    const std = grade("shunt-selection", p, { quantity: "standardShunt", kind: "prediction" }, "30 mΩ");
    expect(std.verdict).toBe("correct");
    near(std.expected, 30e-3);
    near(grade("shunt-selection", p, { quantity: "shuntPower", kind: "prediction" }, "326.7 mW").expected, 326.7e-3);
  });
  it("burden at full scale read on the bench: ±0.5 % of 99.00 mV = ±0.4950 mV", () => {
    // read directly, so the meter's ±0.5 % applies to the quantity itself (PHYSICS.md §17 17b)
    const r = grade("shunt-selection", p, { quantity: "burdenAtFullScale", kind: "bench" }, "99.3 mV", meter);
    near(r.expected, 99.0e-3);
    near(half(r), 0.495e-3, 1e-3);
    expect(r.verdict).toBe("correct");
  });
  it("E12 rounds to 27 mΩ (floor); 33 mΩ, the log-nearest value, breaks the burden limit and is named", () => {
    // PHYSICS.md §1 1g: floor E12 27 mΩ. ln(30.30/27) = 0.1154 > ln(33/30.30) = 0.0854, so nearest is 33 mΩ
    const e12 = { ...p, series: "E12" };
    near(grade("shunt-selection", e12, { quantity: "standardShunt", kind: "prediction" }, "27 mΩ").expected, 27e-3);
    const r = grade("shunt-selection", e12, { quantity: "standardShunt", kind: "prediction" }, "33 mΩ");
    expect(r.verdict).toBe("mistake");
    expect(r.mistake).toBe("nearest-not-floor");
  });
});

describe("range-resolution", () => {
  // PHYSICS.md §3 3m [FORMULA; LSB = V_ref/2^N, IEEE Std 1241 convention]: 300 µA on the teaching meter, 14 bit on 2.5 V.
  const p = { current: 300e-6, fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 };
  it("500 µA range, 1.500 V, one code = 2.5 V/16384/(5·10³ V/A) = 30.52 nA", () => {
    // the 5 µA range would give 300 µA × 5·10⁵ V/A = 150 V (saturated); the 500 µA range 300 µA × 5·10³ V/A = 1.500 V
    // LSB = 2.5/16384 = 152.59 µV; in current 152.59 µV / 5·10³ V/A = 30.52 nA
    expect(grade("range-resolution", p, { quantity: "bestRange", kind: "prediction" }, "500 uA").verdict).toBe("correct");
    near(grade("range-resolution", p, { quantity: "currentResolution", kind: "prediction" }, "30.5 nA").expected, 30.518e-9);
  });
  it("output read on the bench: ±0.5 % of 1.500 V = ±7.500 mV; the code 9830 is predicted ±1 code, read ±0.5 %", () => {
    // PHYSICS.md §17 17c. Code: 1.500 V / 152.59 µV = 9830.4, truncated to 9830 (PHYSICS.md §0: accept ±1 code)
    const v = grade("range-resolution", p, { quantity: "outputVoltage", kind: "bench" }, "1.504 V", meter);
    near(v.expected, 1.5);
    near(half(v), 7.5e-3, 1e-3);
    expect(v.verdict).toBe("correct");
    const predicted = grade("range-resolution", p, { quantity: "adcCode", kind: "prediction" }, "9831");
    expect(predicted.expected).toBe(9830);
    expect(predicted.band).toEqual([9829, 9831]);
    expect(predicted.verdict).toBe("correct");
    // a code read off the bench is itself the reading: 0.005 × 9830 = 49.15 codes, wider than ±1 code
    const read = grade("range-resolution", p, { quantity: "adcCode", kind: "bench" }, "9870", meter);
    near(half(read), 49.15, 1e-3);
    expect(read.verdict).toBe("correct");
  });
});

describe("duty-cycle", () => {
  // PHYSICS.md §8 8a, 8b [FORMULA: time-weighted mean; t = η·C/Ī]: 20 mA for 10 ms every 1 s, 2 µA asleep; 220 mAh, η = 0.8.
  const p = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 220 * 3.6, usableFraction: 0.8 };
  it("average 202.0 µA read from the log: ±0.5 % = ±1.010 µA", () => {
    // Ī = (20 mA × 0.010 s + 2 µA × 0.990 s)/1 s = (200 µC + 1.98 µC)/1 s = 201.98 µA ≈ 202.0 µA
    // read directly (the logger's average), so ±0.005 × 202.0 µA = 1.010 µA (PHYSICS.md §17 17d)
    const r = grade("duty-cycle", p, { quantity: "averageCurrent", kind: "bench" }, "202.5 µA", meter);
    near(r.expected, 202.0e-6);
    near(half(r), 1.01e-6, 1e-3);
    expect(r.verdict).toBe("correct");
  });
  it("battery life 871.4 h; the unweighted mean of 10.00 mA is named as a mistake", () => {
    // t = 0.8 × 220 mAh / 0.20198 mA = 176 mAh / 0.20198 mA = 871.4 h
    const life = grade("duty-cycle", p, { quantity: "batteryLife", kind: "prediction" }, "871 h");
    near(life.expected, 871.4 * 3600);
    expect(life.verdict).toBe("correct");
    // PHYSICS.md §12.5: (20 mA + 2 µA)/2 = 10.00 mA
    const wrong = grade("duty-cycle", p, { quantity: "averageCurrent", kind: "prediction" }, "10 mA");
    expect(wrong.verdict).toBe("mistake");
    expect(wrong.mistake).toBe("unweighted-average");
  });
});

describe("bidirectional-offset", () => {
  // PHYSICS.md §5 5b [FORMULA]: nA range (10⁶ V/A), code 1000 of 4096 at 3.3 V, zero at 1.650 V.
  const p = { offsetVoltage: 1.65, sensitivity: 1e6, outputVoltage: (1000 * 3.3) / 4096, fullScaleVoltage: 3.3 };
  it("−844.3 nA from 0.8057 V; the band comes from the output read ±0.5 %: ±4.028 nA", () => {
    // I = (0.80566 V − 1.65 V)/10⁶ V/A = −844.3 nA; ΔI = 0.005 × 0.80566 V / 10⁶ V/A = 4.028 nA (PHYSICS.md §17 17e)
    const r = grade("bidirectional-offset", p, { quantity: "signedCurrent", kind: "bench" }, "-842 nA", meter);
    near(r.expected, -844.3e-9);
    near(half(r), 4.028e-9, 1e-3);
    expect(r.verdict).toBe("correct");
    expect(grade("bidirectional-offset", p, { quantity: "signedCurrent", kind: "bench" }, "844 nA", meter).verdict).toBe("mistake");
  });
  it("a charging cell on the mA range: code 2172 is +99.90 mA, limits ±1.650 A", () => {
    // PHYSICS.md §5 5f [FORMULA]: 2172 × 3.3/4096 = 7167.6/4096 = 1.74990 V; (1.74990 − 1.65) V / 1 V/A = 99.90 mA;
    // (3.3 − 1.65)/1 = +1.650 A and −1.65/1 = −1.650 A
    const q = { offsetVoltage: 1.65, sensitivity: 1, outputVoltage: (2172 * 3.3) / 4096, fullScaleVoltage: 3.3 };
    const r = grade("bidirectional-offset", q, { quantity: "signedCurrent", kind: "prediction" }, "99.9 mA");
    near(r.expected, 99.90e-3);
    // the band's floor, a tenth of the 1 % tolerance applied to the offset's worth of current (common practice,
    // no source): 0.1 × 0.01 × 1.65 V / 1 V/A = 1.650 mA, wider than 1 % of 99.90 mA = 0.999 mA, and said so
    near(half(r), 1.65e-3, 1e-3);
    expect(r.verdict).toBe("correct");
    expect(r.feedback).toMatch(/\(±1\.65 mA floor near zero, wider than the ±1 % lab tolerance\)/);
    near(grade("bidirectional-offset", q, { quantity: "maxPositiveCurrent", kind: "prediction" }, "1.65 A").expected, 1.65);
    near(grade("bidirectional-offset", q, { quantity: "maxNegativeCurrent", kind: "prediction" }, "-1.65 A").expected, -1.65);
  });
});

describe("filter-noise", () => {
  // PHYSICS.md §6 6a [FORMULA; MEM: t = τ ln 100], 6f [FORMULA: B_n = (π/2)·f_c, the integral summed in reference.test.ts], §7 7e [FORMULA: SI 2019 k]:
  // R_f = 10 kΩ, C_f = 100 nF, 10 kΩ shunt at 300 K.
  const p = { filterResistance: 10e3, filterCapacitance: 100e-9, shuntResistance: 10e3, temperature: 300 };
  it("f_c = 1/(2π × 1 ms) = 159.2 Hz, B_n = 1/(4 × 1 ms) = 250.0 Hz, v_n = √(4kTRB_n) = 203.5 nV", () => {
    // τ = 10 kΩ × 100 nF = 1.000 ms; f_c = 1/(2π·1 ms) = 159.15 Hz; B_n = (π/2)·159.15 Hz = 250.0 Hz
    // v_n = √(4 × 1.380649e-23 × 300 × 10⁴ × 250) = √(4.142e-14) V = 203.5 nV
    expect(grade("filter-noise", p, { quantity: "cutoffFrequency", kind: "prediction" }, "159 Hz").verdict).toBe("correct");
    near(grade("filter-noise", p, { quantity: "cutoffFrequency", kind: "prediction" }, "159 Hz").expected, 159.2);
    near(grade("filter-noise", p, { quantity: "noiseBandwidth", kind: "prediction" }, "250 Hz").expected, 250.0);
    near(grade("filter-noise", p, { quantity: "thermalNoiseVoltage", kind: "prediction" }, "203.5 nV").expected, 203.5e-9);
    // giving f_c for the noise bandwidth is a named mistake (PHYSICS.md §12)
    expect(grade("filter-noise", p, { quantity: "noiseBandwidth", kind: "prediction" }, "159.2 Hz").mistake).toBe("cutoff-as-bandwidth");
  });
  it("1 % settling read on the bench with R ±1 %, C ±10 %: ±0.5296 ms around 4.605 ms", () => {
    // t = τ ln 100 = 1 ms × 4.6052 = 4.605 ms; ∂t/∂R·ΔR = 0.01 t, ∂t/∂C·ΔC = 0.10 t, the read time ±0.005 t
    // half-width (0.01 + 0.10 + 0.005) × 4.6052 ms = 0.5296 ms (PHYSICS.md §17 17f)
    const r = grade("filter-noise", p, { quantity: "settlingTime1pct", kind: "bench" }, "5.0 ms", {
      ...meter,
      componentTolerances: { filterResistance: 1, filterCapacitance: 10 },
    });
    near(r.expected, 4.605e-3);
    near(half(r), 0.5296e-3, 1e-3);
    expect(r.verdict).toBe("correct");
  });
});

describe("uncertainty", () => {
  // PHYSICS.md §9 9b [FORMULA: JCGM 100:2008 4.3.7 (a/√3), 5.1.6 (relative root-sum-square), 6.2 (U = k·u_c)]:
  // 1.000 V read ±(0.5 % + 2 counts of 1 mV) across 10.00 Ω ±1 %, k = 2.
  const p = { reading: 1.0, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 1e-3, shuntResistance: 10, shuntTolerancePercent: 1, coverageFactor: 2 };
  it("root-sum-square: u_c,r = 0.7047 %, U = 1.409 mA, accepted within the lab's 1 %", () => {
    // a_V = 0.005 × 1 V + 2 × 1 mV = 7.000 mV; u_r(V) = 7 mV/(√3 × 1 V) = 0.4041 %; u_r(R) = 1 %/√3 = 0.5774 %
    // u_c,r = √(0.4041² + 0.5774²) % = √(0.1633 + 0.3333) % = 0.7047 %; I = 100.0 mA; U = 2 × 0.7047 mA = 1.409 mA
    // band: the lab tolerance 1 % × 1.409 mA = 14.09 µA (PHYSICS.md §17 17j)
    const r = grade("uncertainty", p, { quantity: "expandedUncertainty", kind: "prediction" }, "1.41 mA");
    near(r.expected, 1.409e-3);
    near(half(r), 14.09e-6, 1e-3);
    expect(r.verdict).toBe("correct");
    near(grade("uncertainty", p, { quantity: "relativeStandardUncertaintyPercent", kind: "prediction" }, "0.705 %").expected, 0.7047);
  });
  it("adding the bounds linearly gives 1.700 mA and is named (PHYSICS.md §9 9e)", () => {
    // 0.7 % + 1 % = 1.700 % of 100.0 mA = 1.700 mA
    const r = grade("uncertainty", p, { quantity: "expandedUncertainty", kind: "prediction" }, "1.7 mA");
    expect(r.verdict).toBe("mistake");
    expect(r.mistake).toBe("linear-sum");
  });
});

describe("leakage-guard", () => {
  // PHYSICS.md §14 14b [FORMULA: Ohm's law]: 10 V across 100 GΩ, I = 1 nA set by the source, I_b = 5 pA, guard within 2 mV.
  const p = { sourceVoltage: 10, insulationResistance: 1e11, measuredCurrent: 1e-9, biasCurrent: 5e-12, guardVoltage: 2e-3 };
  it("errors 10.50 % and 0.5020 %, each from one reading ±0.5 %: bands ±0.5525 and ±0.5025 percentage points", () => {
    // unguarded: I_read = 1 nA + 10 V/100 GΩ + 5 pA = 1.105 nA; e = 100·(I_read − I)/I = 10.50 %
    //   ∂e/∂I_read = 100/I, so Δe = 100 × 0.005 × 1.105 nA / 1 nA = 0.5525 points (0.5 % of 10.50 would be 0.0525)
    // guarded: I_read = 1 nA + 2 mV/100 GΩ + 5 pA = 1.00502 nA; e = 0.5020 %; Δe = 0.5025 points (PHYSICS.md §17 17g)
    const u = grade("leakage-guard", p, { quantity: "unguardedErrorPercent", kind: "bench" }, "10.9 %", meter);
    near(u.expected, 10.5);
    near(half(u), 0.5525, 1e-3);
    expect(u.verdict).toBe("correct");
    expect(u.feedback).toMatch(/I_read/);
    const g = grade("leakage-guard", p, { quantity: "guardedErrorPercent", kind: "bench" }, "0.3 %", meter);
    near(g.expected, 0.502);
    near(half(g), 0.5025, 1e-3);
    expect(g.verdict).toBe("correct");
  });
});

describe("offset-thermal", () => {
  // PHYSICS.md §15 15c [FORMULA]: 1 mΩ, 100 mA, V_os = 10 µV, 5 µV/K over 1 K.
  const p = { shuntResistance: 1e-3, current: 0.1, offsetVoltage: 10e-6, seebeckMicrovoltsPerKelvin: 5, junctionTemperatureDifference: 1 };
  it("readings 115.0 µV and −85.00 µV give 100.0 mA; the meter's ±0.5 % on both readings gives ±0.5000 mA", () => {
    // V_th = 5 µV; V₊ = 100 µV + 15 µV = 115 µV; V₋ = −100 µV + 15 µV = −85 µV; I = (115 + 85) µV/(2 × 1 mΩ) = 100.0 mA
    // ΔI = 0.005 × (115 + 85) µV/(2 × 1 mΩ) = 0.5000 mA (PHYSICS.md §17 17h)
    const r = grade("offset-thermal", p, { quantity: "reversedCurrent", kind: "bench" }, "100.4 mA", meter);
    near(r.expected, 0.1);
    near(half(r), 0.5e-3, 1e-3);
    expect(r.verdict).toBe("correct");
    expect(r.feedback).toMatch(/V_plus, V_minus/);
    // the whole difference over R (not halved) is 200.0 mA, a named mistake (PHYSICS.md §15 15d)
    expect(grade("offset-thermal", p, { quantity: "reversedCurrent", kind: "bench" }, "200 mA", meter).mistake).toBe("unhalved-difference");
  });
  it("the forward reading itself is read: ±0.5 % of 115.0 µV = ±0.5750 µV", () => {
    const r = grade("offset-thermal", p, { quantity: "forwardVoltage", kind: "bench" }, "115.3 µV", meter);
    near(r.expected, 115e-6);
    near(half(r), 0.575e-6, 1e-3);
    expect(r.verdict).toBe("correct");
  });
});

describe("sampling-burst", () => {
  // PHYSICS.md §16 16c [FORMULA]: f_s = 1 kHz, 5 ms bursts, N = 20, T = 1.02 s, a 1 Hz logger, 20 mA / 2 µA.
  const p = { sampleRate: 1000, burstWidth: 5e-3, requiredSamples: 20, wakePeriod: 1.02, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6 };
  it("5 samples per burst, 4 kHz needed, the wakes seen at 19.61 mHz", () => {
    // n_b = 5 ms × 1 kHz = 5; f_s,min = 20/5 ms = 4 kHz; f_a = |1/1.02 s − 1 × 1 Hz| = |0.98039 − 1| Hz = 19.61 mHz
    near(grade("sampling-burst", p, { quantity: "samplesPerBurst", kind: "prediction" }, "5").expected, 5);
    near(grade("sampling-burst", p, { quantity: "minimumSampleRate", kind: "prediction" }, "4 kHz").expected, 4000);
    const r = grade("sampling-burst", p, { quantity: "apparentWakeFrequency", kind: "bench" }, "20.5 mHz", meter);
    near(r.expected, 19.61e-3);
    // the band's floor, a tenth of the tolerance applied to the logger's rate (common practice, no source):
    // 0.1 × 1 % × 1 Hz = 1.000 mHz, wider than the reading's 0.005 × 19.61 mHz = 0.098 mHz (PHYSICS.md §17 17i)
    const wide = grade("sampling-burst", p, { quantity: "apparentWakeFrequency", kind: "bench" }, "20.5 mHz", { instrumentAccuracyPercent: 0.5 });
    near(half(wide), 1.0e-3, 1e-3);
    near(centre(wide), 19.61e-3);
    expect(wide.verdict).toBe("correct");
    expect(r.verdict).not.toBe("correct");
  });
  it("worst-case error of the average: 19.61 µA, 19.60 % of 100.0 µA", () => {
    // ΔĪ = (20 mA − 2 µA)/(1000 Hz × 1.02 s) = 19.998 mA/1020 = 19.61 µA
    // Ī = (20 mA × 5 ms + 2 µA × 1.015 s)/1.02 s = (100 µC + 2.03 µC)/1.02 s = 100.03 µA; 19.61/100.03 = 19.60 %
    near(grade("sampling-burst", p, { quantity: "worstCaseAverageError", kind: "prediction" }, "19.6 µA").expected, 19.61e-6, 1e-3);
    near(grade("sampling-burst", p, { quantity: "worstCaseErrorPercent", kind: "prediction" }, "19.6 %").expected, 19.60, 1e-3);
  });
});
