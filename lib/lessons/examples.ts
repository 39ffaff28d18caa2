// Worked examples quoted in the lessons. Lesson text never types these numbers: it renders them from
// here through the grader (<V/> and <Eq/> in components/lesson). The `checks` are the lib/grader/PHYSICS.md check
// values, with their source tags; tests/unit/lessons/examples.test.ts recomputes each one through
// lib/grader (relative 5e-4), so a number in the text and the grader cannot drift apart.

import type { TeachingFn } from "./teaching";

export type ExampleParams = Record<string, number | string>;

export type ExampleCheck = {
  quantity: string;
  expected: number | string;
  /** lib/grader/PHYSICS.md section and source tag of the expected value. */
  source: string;
};

/**
 * `cite`: phrases that the "Sources" section of every lesson showing the example must contain, naming where
 * the example comes from (a standard, a law, "worked here from the formula", "common practice, no source").
 */
export type Example =
  | { id: string; kind: "template"; cite: readonly string[]; template: string; params: ExampleParams; checks: ExampleCheck[] }
  | { id: string; kind: "teaching"; cite: readonly string[]; fn: TeachingFn; params: Record<string, number>; checks: ExampleCheck[] }
  | {
      id: string;
      kind: "standard";
      cite: readonly string[];
      params: { value: number; series: "E6" | "E12" | "E24" | "E48" | "E96" | "E192"; mode: "nearest" | "floor" | "ceil" };
      checks: ExampleCheck[];
    };

const mAh = 3.6; // coulombs per milliampere-hour
const LSB = 2.5 / 16384; // the teaching meter's converter step (14 bit, 2.5 V reference), lib/instruments/library.ts
const meter = { fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 };

/** Each checked quantity's value; a value with its own source is written [value, source]. */
type Checks = Record<string, number | string | readonly [number | string, string]>;

/** The checks of one example; `source` is the source of every value that does not name its own. */
function checksOf(source: string, checks: Checks): ExampleCheck[] {
  return Object.entries(checks).map(([quantity, v]) =>
    typeof v === "object" ? { quantity, expected: v[0], source: v[1] } : { quantity, expected: v, source },
  );
}

/** A worked example of a grader template. */
function template(id: string, template: string, cite: readonly string[], params: ExampleParams, source: string, checks: Checks): Example {
  return { id, kind: "template", cite, template, params, checks: checksOf(source, checks) };
}

/** A worked example of a teaching helper (lib/lessons/teaching.ts) that the grader has no template for. */
function teaching(id: string, fn: TeachingFn, cite: readonly string[], params: Record<string, number>, source: string, checks: Checks): Example {
  return { id, kind: "teaching", cite, fn, params, checks: checksOf(source, checks) };
}

/** A standard-series lookup (lib/grader/eseries.ts). */
function standard(id: string, cite: readonly string[], params: Extract<Example, { kind: "standard" }>["params"], source: string, checks: Checks): Example {
  return { id, kind: "standard", cite, params, checks: checksOf(source, checks) };
}

export const examples: readonly Example[] = [
  // ---- Lesson 2: burden voltage ----
  template("burden-node", "shunt-burden", ["Ohm's law", "Kirchhoff's voltage law"], { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 }, "PHYSICS.md §2 2b [FORMULA]", {
    trueCurrent: 3.3e-3, indicatedCurrent: 3.267e-3, loadingErrorPercent: -0.9901, burdenVoltage: 32.67e-3,
  }),
  template("burden-low-rail", "shunt-burden", ["Ohm's law", "Kirchhoff's voltage law"], { supplyVoltage: 1.8, loadResistance: 100, shuntResistance: 10 }, "PHYSICS.md §2 2c [FORMULA]", {
    trueCurrent: 18.0e-3, indicatedCurrent: 16.36e-3, loadingErrorPercent: -9.091,
    burdenVoltage: [0.1636, "PHYSICS.md §12.1 (164 mV) [FORMULA]"],
  }),
  template("burden-motor", "shunt-burden", ["Ohm's law", "Kirchhoff's voltage law"], { supplyVoltage: 3.0, loadResistance: 8, shuntResistance: 1.8 }, "PHYSICS.md §2 2d [FORMULA]", {
    trueCurrent: 0.375, indicatedCurrent: 0.3061, loadingErrorPercent: -18.37, burdenVoltage: 0.551,
  }),

  // ---- Lesson 3 (and 1): choosing a shunt ----
  template("shunt-amp-e24", "shunt-selection", ["Ohm's law", "IEC 60063:2015"], { maxCurrent: 3.3, maxBurden: 0.1, series: "E24" }, "PHYSICS.md §1 1g [FORMULA]", {
    idealShunt: 30.3e-3, standardShunt: 30e-3, burdenAtFullScale: [99.0e-3, "PHYSICS.md §1 1h [FORMULA]"],
    shuntPower: [0.3267, "PHYSICS.md §1 1h [FORMULA]"],
  }),
  template("shunt-amp-e96", "shunt-selection", ["Ohm's law", "IEC 60063:2015"], { maxCurrent: 3.3, maxBurden: 0.1, series: "E96" }, "PHYSICS.md §1 1g [FORMULA]", {
    standardShunt: 30.1e-3,
  }),
  template("shunt-amp-e12", "shunt-selection", ["Ohm's law", "IEC 60063:2015"], { maxCurrent: 3.3, maxBurden: 0.1, series: "E12" }, "PHYSICS.md §1 1g [FORMULA]", {
    standardShunt: 27e-3,
  }),
  template("shunt-micro-e24", "shunt-selection", ["Ohm's law", "IEC 60063:2015"], { maxCurrent: 3.3e-6, maxBurden: 10e-3, series: "E24" }, "PHYSICS.md §1 1i [FORMULA]", {
    idealShunt: 3030, standardShunt: 3000, burdenAtFullScale: 9.9e-3,
  }),
  template("shunt-micro-e96", "shunt-selection", ["Ohm's law", "IEC 60063:2015"], { maxCurrent: 3.3e-6, maxBurden: 10e-3, series: "E96" }, "PHYSICS.md §1 1i [FORMULA]", {
    standardShunt: 3010, burdenAtFullScale: 9.933e-3,
  }),
  // the teaching meter's own shunts (lib/instruments/library.ts): 10 kΩ on the 5 µA range, 1 Ω on the 50 mA range
  template("shunt-5uA-range", "shunt-selection", ["Ohm's law", "IEC 60063:2015"], { maxCurrent: 5e-6, maxBurden: 55e-3, series: "E12" }, "PHYSICS.md §1 1k [FORMULA]", {
    idealShunt: 11e3, standardShunt: 10e3, burdenAtFullScale: 50.0e-3, shuntPower: 250e-9,
  }),
  template("shunt-50mA-range", "shunt-selection", ["Ohm's law", "IEC 60063:2015"], { maxCurrent: 50e-3, maxBurden: 55e-3, series: "E12" }, "PHYSICS.md §1 1k [FORMULA]", {
    idealShunt: 1.1, standardShunt: 1.0, shuntPower: 2.5e-3,
  }),
  standard("e24-log-nearest", ["IEC 60063:2015"], { value: 2848, series: "E24", mode: "nearest" }, "PHYSICS.md §1 1e [FORMULA: IEC 60063 list]", {
    value: 3000,
  }),
  standard("e24-319", ["IEC 60063:2015"], { value: 319, series: "E24", mode: "nearest" }, "PHYSICS.md §1 1b [FORMULA: IEC 60063:2015 E24 list]", {
    value: 330,
  }),

  // ---- Lessons 4-6: ranges, auto-ranging, resolution ----
  // the teaching meter: ranges 5 µA (5·10⁵ V/A), 500 µA (5·10³ V/A), 50 mA (50 V/A), 1 A (2.5 V/A); 14 bit on 2.5 V
  template("range-sleep", "range-resolution", ["Ohm's law", "IEEE Std 1241-2010"], { current: 500e-9, ...meter }, "PHYSICS.md §3 3g [FORMULA]", {
    bestRange: "5 µA", outputVoltage: 0.25, adcCode: [1638, "PHYSICS.md §3 3g (truncating) [FORMULA]"],
    currentResolution: [305.18e-12, "PHYSICS.md §3 3g [FORMULA: IEEE Std 1241 Q = V_ref/2^N]"],
  }),
  template("range-radio", "range-resolution", ["Ohm's law", "IEEE Std 1241-2010"], { current: 2e-3, ...meter }, "PHYSICS.md §3 3h [FORMULA]", {
    bestRange: "50 mA", outputVoltage: 0.1, adcCode: 655, currentResolution: [3.0518e-6, "PHYSICS.md §3 3h [FORMULA: IEEE Std 1241]"],
  }),
  template("range-edge", "range-resolution", ["Ohm's law", "IEEE Std 1241-2010"], { current: 5e-6, ...meter }, "PHYSICS.md §3 3i [FORMULA]", {
    bestRange: "500 µA", outputVoltage: 25e-3, adcCode: 163, currentResolution: 30.518e-9,
  }),
  template("range-gap", "range-resolution", ["Ohm's law", "IEEE Std 1241-2010"], { current: 0.6e-3, ...meter }, "PHYSICS.md §3 3j [FORMULA]", {
    bestRange: "50 mA", outputVoltage: 30e-3, adcCode: 196, currentResolution: 3.0518e-6,
  }),
  template("range-1A", "range-resolution", ["Ohm's law", "IEEE Std 1241-2010"], { current: 0.2, ...meter }, "PHYSICS.md §3 3k [FORMULA]", {
    bestRange: "1 A", outputVoltage: 0.5, adcCode: 3276, currentResolution: 61.035e-6,
  }),

  // ---- Lesson 8: currents in both directions ----
  // the 220 mAh cell charging at about 0.45 C, read on the 1 A range (2.5 V/A) around the 1.25 V offset: code 9830
  template("bidir-charge", "bidirectional-offset", ["worked here from the formula", "IEEE Std 1241-2010"], { offsetVoltage: 1.25, sensitivity: 2.5, outputVoltage: 9830 * LSB, fullScaleVoltage: 2.5 }, "PHYSICS.md §5 5g (±0.5 A) [FORMULA]", {
    signedCurrent: [99.976e-3, "PHYSICS.md §5 5g [FORMULA]"], maxPositiveCurrent: 0.5, maxNegativeCurrent: -0.5,
  }),
  // the node asleep, drawing from the cell, read on the 5 µA range (5·10⁵ V/A): code 6000
  template("bidir-sleep", "bidirectional-offset", ["worked here from the formula", "IEEE Std 1241-2010"], { offsetVoltage: 1.25, sensitivity: 5e5, outputVoltage: 6000 * LSB, fullScaleVoltage: 2.5 }, "PHYSICS.md §5 5h (±2.5 µA) [FORMULA]", {
    signedCurrent: [-668.95e-9, "PHYSICS.md §5 5h [FORMULA]"], maxPositiveCurrent: 2.5e-6, maxNegativeCurrent: -2.5e-6,
  }),
  template("bidir-mid", "bidirectional-offset", ["worked here from the formula", "IEEE Std 1241-2010"], { offsetVoltage: 1.25, sensitivity: 5e5, outputVoltage: 8192 * LSB, fullScaleVoltage: 2.5 }, "PHYSICS.md §5 5h (code 8192 = 1.25 V) [FORMULA]", {
    signedCurrent: 0,
  }),

  // ---- Lessons 7 and 10: filtering, settling, noise ----
  template("filter-node", "filter-noise", ["worked here from the formula"], { filterResistance: 10e3, filterCapacitance: 100e-9, shuntResistance: 10e3, temperature: 300 }, "PHYSICS.md §6 6a [FORMULA]", {
    timeConstant: 1.0e-3, cutoffFrequency: 159.2, settlingTime1pct: [4.605e-3, "PHYSICS.md §6 6a [FORMULA; MEM]"],
    noiseBandwidth: [250.0, "PHYSICS.md §6 6a, 6f [FORMULA]"],
    thermalNoiseVoltage: [203.5e-9, "PHYSICS.md §7 7e [FORMULA]"], thermalNoiseCurrent: [20.35e-12, "PHYSICS.md §7 7e [FORMULA]"],
  }),

  // ---- Lesson 9: duty-cycled loads ----
  template("duty-node", "duty-cycle", ["worked here from the definition of the average"], { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 220 * mAh, usableFraction: 0.8 }, "PHYSICS.md §8 8a [FORMULA]", {
    averageCurrent: 202.0e-6, chargePerWake: 200.0e-6, batteryLife: [871.4 * 3600, "PHYSICS.md §8 8b (871.4 h) [FORMULA]"],
  }),
  template("duty-slow", "duty-cycle", ["worked here from the definition of the average"], { sleepCurrent: 3e-6, activeCurrent: 25e-3, activeTime: 5e-3, period: 10, batteryCapacity: 220 * mAh, usableFraction: 0.8 }, "PHYSICS.md §8 8c [FORMULA]", {
    averageCurrent: 15.5e-6, batteryLife: [1.136e4 * 3600, "PHYSICS.md §8 8c (1.136e4 h) [FORMULA]"],
  }),

  // ---- Lesson 11: uncertainty ----
  template("unc-bench", "uncertainty", ["JCGM 100:2008"], { reading: 1.0, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 1e-3, shuntResistance: 10, shuntTolerancePercent: 1, coverageFactor: 2 }, "PHYSICS.md §9 9b [FORMULA]", {
    current: [100.0e-3, "PHYSICS.md §9 9b [FORMULA: GUM 4.3.7, 5.1.6, 6.2]"], relativeStandardUncertaintyPercent: 0.7047,
    combinedStandardUncertainty: 0.7047e-3, expandedUncertainty: 1.409e-3,
  }),
  template("unc-amp", "uncertainty", ["JCGM 100:2008"], { reading: 50.0e-3, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 0.1e-3, shuntResistance: 0.1, shuntTolerancePercent: 1, coverageFactor: 2 }, "PHYSICS.md §9 9d [FORMULA]", {
    current: 500.0e-3, relativeStandardUncertaintyPercent: 0.7767, expandedUncertainty: 7.767e-3,
  }),

  // the amp-range reading again, now through the teaching meter's own chain: ×50 into a 14-bit converter on 2.5 V
  template("unc-chain", "uncertainty", ["JCGM 100:2008"], { reading: 50.0e-3, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 0.1e-3, shuntResistance: 0.1, shuntTolerancePercent: 1, coverageFactor: 2, shuntTempcoPpm: 50, temperatureChange: 10, gainErrorPercent: 0.2, referenceTolerancePercent: 0.1, amplifierGain: 50, adcBits: 14, adcReference: 2.5 }, "PHYSICS.md §9 9g [FORMULA: GUM 4.3.7]", {
    current: [0.5, "Ohm's law [FORMULA]"], readingContribution: [0, "PHYSICS.md §9 9g (the converter's rows replace the voltmeter) [FORMULA]"],
    shuntToleranceContribution: 2.887e-3, tempcoContribution: [144.3e-6, "PHYSICS.md §9 9g [FORMULA: GUM 4.3.7, ΔR/R = αΔT]"],
    gainContribution: 577.4e-6, referenceContribution: 288.7e-6, repeatabilityContribution: [0, "PHYSICS.md §9 9g (term off) [FORMULA]"], offsetContribution: [0, "PHYSICS.md §9 9g (term off) [FORMULA]"],
    biasContribution: [0, "PHYSICS.md §9 9g (term off) [FORMULA]"], leakageContribution: [0, "PHYSICS.md §9 9g (term off) [FORMULA]"],
    quantisationContribution: [8.8097e-6, "PHYSICS.md §9 9g (2.5 V/2^14/50/0.1 Ω/√12) [FORMULA: GUM F.2.2.1, q/√12]"],
    relativeStandardUncertaintyPercent: [0.59233, "PHYSICS.md §9 9g (14 bit on 2.5 V) [FORMULA]"],
    combinedStandardUncertainty: [2.9617e-3, "PHYSICS.md §9 9g (14 bit on 2.5 V) [FORMULA: GUM 5.1.2]"],
    sensitivityReading: [10, "PHYSICS.md §9 9g (c_V = 1/R) [FORMULA: GUM 5.1.3]"],
    sensitivityShunt: [-5, "PHYSICS.md §9 9g (c_R = −I/R) [FORMULA: GUM 5.1.3]"],
    expandedUncertainty: [5.9233e-3, "PHYSICS.md §9 9g (14 bit on 2.5 V) [FORMULA: GUM 6.2, k = 2]"],
    dominantContribution: ["shunt tolerance", "PHYSICS.md §9 9g [FORMULA]"],
  }),
  // a nanoamp reading through a 1 MΩ shunt: Type A, offset, bias current and leakage rows
  template("unc-nano", "uncertainty", ["JCGM 100:2008"], { reading: 5e-3, readingAccuracyPercent: 0.05, readingCounts: 2, countSize: 1e-6, shuntResistance: 1e6, shuntTolerancePercent: 0.1, coverageFactor: 2, repeatStdDev: 30e-6, repeatCount: 10, offsetBound: 20e-6, biasCurrentBound: 10e-12, leakageBound: 5e-12 }, "PHYSICS.md §9 9i [FORMULA: GUM 4.2.3, 4.3.7, 5.1.2]", {
    current: 5e-9, readingContribution: 2.598e-12, shuntToleranceContribution: 2.887e-12, relativeStandardUncertaintyPercent: 0.3347, repeatabilityContribution: 9.487e-12, offsetContribution: 11.55e-12, biasContribution: 5.774e-12,
    leakageContribution: 2.887e-12, tempcoContribution: 0, gainContribution: 0, referenceContribution: 0, quantisationContribution: 0, combinedStandardUncertainty: 16.74e-12, expandedUncertainty: 33.47e-12, dominantContribution: "offset",
  }),

  // ---- Lesson 12: leakage and guarding ----
  template("leak-node", "leakage-guard", ["Ohm's law"], { sourceVoltage: 10, insulationResistance: 1e11, measuredCurrent: 1e-9, biasCurrent: 5e-12, guardVoltage: 2e-3 }, "PHYSICS.md §14 14b [FORMULA]", {
    leakageCurrent: [100e-12, "PHYSICS.md §14 14b [FORMULA: Ohm's law]"], leakageErrorPercent: 10, biasErrorPercent: 0.5,
    unguardedErrorPercent: 10.5, guardedLeakage: [20e-15, "PHYSICS.md §14 14b [FORMULA: Ohm's law]"], guardedErrorPercent: 0.502,
  }),
  template("leak-hv", "leakage-guard", ["Ohm's law"], { sourceVoltage: 5000, insulationResistance: 5e12, measuredCurrent: 100e-9, biasCurrent: 5e-12, guardVoltage: 1 }, "PHYSICS.md §14 14a [FORMULA: Ohm's law]", {
    leakageCurrent: 1e-9,
  }),

  // ---- Lesson 13: offsets and thermoelectric voltages ----
  template("thermal-solder", "offset-thermal", ["worked here from the formula", "from memory"], { shuntResistance: 1e-3, current: 0.1, offsetVoltage: 10e-6, seebeckMicrovoltsPerKelvin: 5, junctionTemperatureDifference: 1 }, "PHYSICS.md §15 15c [FORMULA]", {
    thermalEmf: [5e-6, "PHYSICS.md §15 15c [MEM: copper to tin-lead solder ≈ 5 µV/K; FORMULA: V = S·ΔT]"],
    apparentCurrent: [15e-3, "PHYSICS.md §15 15c [FORMULA: Ohm's law]"], offsetErrorPercent: 15, forwardVoltage: 115e-6,
    reverseVoltage: -85e-6, reversedCurrent: 100e-3,
  }),
  template("thermal-copper", "offset-thermal", ["worked here from the formula", "from memory"], { shuntResistance: 1e-3, current: 0.1, offsetVoltage: 0, seebeckMicrovoltsPerKelvin: 0.2, junctionTemperatureDifference: 5 }, "PHYSICS.md §15 15a [MEM: copper to copper ≤ 0.2 µV/K; FORMULA: V = S·ΔT]", {
    thermalEmf: 1e-6,
  }),

  // ---- Lesson 14: sampling short bursts ----
  template("burst-node", "sampling-burst", ["worked here from the formula"], { sampleRate: 1000, burstWidth: 5e-3, requiredSamples: 20, wakePeriod: 1.02, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6 }, "PHYSICS.md §16 16c [FORMULA]", {
    samplesPerBurst: 5, minimumSampleRate: 4000, apparentWakeFrequency: 0.019608, worstCaseAverageError: 19.606e-6,
    worstCaseErrorPercent: 19.6,
  }),
  template("alias-3200", "sampling-burst", ["worked here from the formula"], { sampleRate: 100e3, burstWidth: 0.1e-3, requiredSamples: 5, wakePeriod: 1 / 3200, logRate: 1000, activeCurrent: 20e-3, sleepCurrent: 2e-6 }, "PHYSICS.md §16 16a [FORMULA: f_a = |f − n·f_s|]", {
    apparentWakeFrequency: 200,
  }),

  // ---- Lesson 15: the feedback ammeter (its R_f C_f through the filter-noise template, R_f as the noisy resistor) ----
  template("fb-gigaohm", "filter-noise", ["worked here from the formula", "Physical Review"], { filterResistance: 1e9, filterCapacitance: 10e-12, shuntResistance: 1e9, temperature: 300 }, "PHYSICS.md §21 21a [FORMULA]", {
    timeConstant: 10.0e-3, settlingTime1pct: 46.05e-3, noiseBandwidth: 25.0, thermalNoiseCurrent: 20.35e-15,
  }),

  // ---- Teaching helpers that lib/grader has no template for (lib/lessons/teaching.ts) ----
  teaching("autorange-thresholds", "autorange", ["common practice, no single source", "IEEE Std 1241-2010"], { upFraction: 0.9, downFraction: 0.8, fullScaleVoltage: 2.5, sensitivityLow: 5e5, sensitivityHigh: 5e3, adcBits: 14 }, "PHYSICS.md §3 3l [CP; FORMULA]", {
    upCurrent: 4.5e-6, downCurrent: 4.0e-6, downVoltageOnHigh: [20.0e-3, "PHYSICS.md §3 3l (h_down·V_FS/100) [FORMULA]"],
    downLsbOnHigh: [131.07, "PHYSICS.md §3 3l (20 mV / 152.59 µV) [FORMULA]"],
  }),
  teaching("pulse-fast-filter", "pulsePeak", ["worked here from the formula"], { pulseCurrent: 20e-3, pulseWidth: 1e-3, timeConstant: 1e-3 }, "PHYSICS.md §6 6e [FORMULA]", {
    peak: 12.64e-3, peakPercent: 63.21, charge: 20.0e-6,
  }),
  teaching("pulse-slow-filter", "pulsePeak", ["worked here from the formula"], { pulseCurrent: 20e-3, pulseWidth: 1e-3, timeConstant: 10e-3 }, "PHYSICS.md §6 6e [FORMULA]", {
    peak: 1.903e-3, peakPercent: 9.516, charge: 20.0e-6,
  }),
  teaching("shot-1uA", "shotNoise", ["worked here from the formula", "Annalen der Physik"], { current: 1e-6, bandwidth: 1 }, "PHYSICS.md §7 7f [FORMULA: exact q]", {
    noiseCurrent: 0.5661e-12,
  }),
  teaching("shot-1nA", "shotNoise", ["worked here from the formula", "Annalen der Physik"], { current: 1e-9, bandwidth: 1 }, "PHYSICS.md §7 7f [FORMULA: exact q]", {
    noiseCurrent: 17.9e-15,
  }),
  teaching("burst-hits-narrow", "burstHits", ["worked here from the formula"], { wakePeriod: 1.02, logRate: 1, burstWidth: 5e-3 }, "PHYSICS.md §16 16e [FORMULA]", {
    alias: 19.61e-3, aliasPeriod: 51.0, stepPerSample: 20.0e-3, samplesPerPass: 0.25, meanTimeBetweenHits: 204.0,
  }),
  teaching("burst-hits-wide", "burstHits", ["worked here from the formula"], { wakePeriod: 1.002, logRate: 1, burstWidth: 5e-3 }, "PHYSICS.md §16 16f [FORMULA]", {
    alias: 1.996e-3, aliasPeriod: 501.0, stepPerSample: 2.0e-3, samplesPerPass: 2.5, meanTimeBetweenHits: 501.0,
  }),
  teaching("unweighted-mean", "unweightedMean", ["worked here from the definition of the average"], { a: 20e-3, b: 2e-6 }, "PHYSICS.md §12.5 (wrong method) [FORMULA]", {
    mean: 10.0e-3,
  }),
];

const byId = new Map<string, Example>(examples.map((e) => [e.id, e]));

export function getExample(id: string): Example {
  const e = byId.get(id);
  if (!e) throw new Error(`unknown lesson example "${id}"`);
  return e;
}
