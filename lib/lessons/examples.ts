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
const LSB12 = 3.3 / 4096; // the course meter's ADC step (12 bit, 3.3 V reference)

export const examples = [
  // ---- Lesson 2: burden voltage ----
  {
    id: "burden-node",
    kind: "template",
    cite: ["Ohm's law", "Kirchhoff's voltage law"],
    template: "shunt-burden",
    params: { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 },
    checks: [
      { quantity: "trueCurrent", expected: 3.3e-3, source: "PHYSICS.md §2 2b [FORMULA]" }, // [FORMULA]
      { quantity: "indicatedCurrent", expected: 3.267e-3, source: "PHYSICS.md §2 2b [FORMULA]" }, // [FORMULA]
      { quantity: "loadingErrorPercent", expected: -0.9901, source: "PHYSICS.md §2 2b [FORMULA]" }, // [FORMULA]
      { quantity: "burdenVoltage", expected: 32.67e-3, source: "PHYSICS.md §2 2b [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "burden-low-rail",
    kind: "template",
    cite: ["Ohm's law", "Kirchhoff's voltage law"],
    template: "shunt-burden",
    params: { supplyVoltage: 1.8, loadResistance: 100, shuntResistance: 10 },
    checks: [
      { quantity: "trueCurrent", expected: 18.0e-3, source: "PHYSICS.md §2 2c [FORMULA]" }, // [FORMULA]
      { quantity: "indicatedCurrent", expected: 16.36e-3, source: "PHYSICS.md §2 2c [FORMULA]" }, // [FORMULA]
      { quantity: "loadingErrorPercent", expected: -9.091, source: "PHYSICS.md §2 2c [FORMULA]" }, // [FORMULA]
      { quantity: "burdenVoltage", expected: 0.1636, source: "PHYSICS.md §12.1 (164 mV) [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "burden-motor",
    kind: "template",
    cite: ["Ohm's law", "Kirchhoff's voltage law"],
    template: "shunt-burden",
    params: { supplyVoltage: 3.0, loadResistance: 8, shuntResistance: 1.8 },
    checks: [
      { quantity: "trueCurrent", expected: 0.375, source: "PHYSICS.md §2 2d [FORMULA]" }, // [FORMULA]
      { quantity: "indicatedCurrent", expected: 0.3061, source: "PHYSICS.md §2 2d [FORMULA]" }, // [FORMULA]
      { quantity: "loadingErrorPercent", expected: -18.37, source: "PHYSICS.md §2 2d [FORMULA]" }, // [FORMULA]
      { quantity: "burdenVoltage", expected: 0.551, source: "PHYSICS.md §2 2d [FORMULA]" }, // [FORMULA]
    ],
  },

  // ---- Lesson 3 (and 1): choosing a shunt ----
  {
    id: "shunt-amp-e24",
    kind: "template",
    cite: ["Ohm's law", "IEC 60063:2015"],
    template: "shunt-selection",
    params: { maxCurrent: 3.3, maxBurden: 0.1, series: "E24" },
    checks: [
      { quantity: "idealShunt", expected: 30.3e-3, source: "PHYSICS.md §1 1g [FORMULA]" }, // [FORMULA]
      { quantity: "standardShunt", expected: 30e-3, source: "PHYSICS.md §1 1g [FORMULA]" }, // [FORMULA]
      { quantity: "burdenAtFullScale", expected: 99.0e-3, source: "PHYSICS.md §1 1h [FORMULA]" }, // [FORMULA]
      { quantity: "shuntPower", expected: 0.3267, source: "PHYSICS.md §1 1h [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "shunt-amp-e96",
    kind: "template",
    cite: ["Ohm's law", "IEC 60063:2015"],
    template: "shunt-selection",
    params: { maxCurrent: 3.3, maxBurden: 0.1, series: "E96" },
    checks: [{ quantity: "standardShunt", expected: 30.1e-3, source: "PHYSICS.md §1 1g [FORMULA]" }], // [FORMULA]
  },
  {
    id: "shunt-amp-e12",
    kind: "template",
    cite: ["Ohm's law", "IEC 60063:2015"],
    template: "shunt-selection",
    params: { maxCurrent: 3.3, maxBurden: 0.1, series: "E12" },
    checks: [{ quantity: "standardShunt", expected: 27e-3, source: "PHYSICS.md §1 1g [FORMULA]" }], // [FORMULA]
  },
  {
    id: "shunt-micro-e24",
    kind: "template",
    cite: ["Ohm's law", "IEC 60063:2015"],
    template: "shunt-selection",
    params: { maxCurrent: 3.3e-6, maxBurden: 10e-3, series: "E24" },
    checks: [
      { quantity: "idealShunt", expected: 3030, source: "PHYSICS.md §1 1i [FORMULA]" }, // [FORMULA]
      { quantity: "standardShunt", expected: 3000, source: "PHYSICS.md §1 1i [FORMULA]" }, // [FORMULA]
      { quantity: "burdenAtFullScale", expected: 9.9e-3, source: "PHYSICS.md §1 1i [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "shunt-micro-e96",
    kind: "template",
    cite: ["Ohm's law", "IEC 60063:2015"],
    template: "shunt-selection",
    params: { maxCurrent: 3.3e-6, maxBurden: 10e-3, series: "E96" },
    checks: [
      { quantity: "standardShunt", expected: 3010, source: "PHYSICS.md §1 1i [FORMULA]" }, // [FORMULA]
      { quantity: "burdenAtFullScale", expected: 9.933e-3, source: "PHYSICS.md §1 1i [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "shunt-nA-range",
    kind: "template",
    cite: ["Ohm's law", "IEC 60063:2015"],
    template: "shunt-selection",
    params: { maxCurrent: 3.3e-6, maxBurden: 35e-3, series: "E12" },
    checks: [
      { quantity: "standardShunt", expected: 10e3, source: "PHYSICS.md §1 1j [CP design; FORMULA]" }, // [CP; FORMULA]
      { quantity: "burdenAtFullScale", expected: 33.0e-3, source: "PHYSICS.md §1 1j [FORMULA]" }, // [FORMULA]
      { quantity: "shuntPower", expected: 108.9e-9, source: "PHYSICS.md §1 1j [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "shunt-mA-range",
    kind: "template",
    cite: ["Ohm's law", "IEC 60063:2015"],
    template: "shunt-selection",
    params: { maxCurrent: 3.3, maxBurden: 35e-3, series: "E12" },
    checks: [
      { quantity: "standardShunt", expected: 10e-3, source: "PHYSICS.md §1 1j [CP design; FORMULA]" }, // [CP; FORMULA]
      { quantity: "shuntPower", expected: 108.9e-3, source: "PHYSICS.md §1 1j [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "e24-log-nearest",
    kind: "standard",
    cite: ["IEC 60063:2015"],
    params: { value: 2848, series: "E24", mode: "nearest" },
    checks: [{ quantity: "value", expected: 3000, source: "PHYSICS.md §1 1e [FORMULA: IEC 60063 list]" }], // [FORMULA]
  },
  {
    id: "e24-319",
    kind: "standard",
    cite: ["IEC 60063:2015"],
    params: { value: 319, series: "E24", mode: "nearest" },
    checks: [{ quantity: "value", expected: 330, source: "PHYSICS.md §1 1b [FORMULA: IEC 60063:2015 E24 list]" }], // [FORMULA]
  },

  // ---- Lessons 4-6: ranges, auto-ranging, resolution ----
  {
    id: "range-sleep",
    kind: "template",
    cite: ["Ohm's law", "IEEE Std 1241-2010"],
    template: "range-resolution",
    params: { current: 500e-9, fullScaleVoltage: 3.3, adcBits: 12, adcReference: 3.3 },
    checks: [
      { quantity: "bestRange", expected: "nA", source: "PHYSICS.md §3 3a [FORMULA]" }, // [FORMULA]
      { quantity: "outputVoltage", expected: 0.5, source: "PHYSICS.md §3 3a [FORMULA]" }, // [FORMULA]
      { quantity: "adcCode", expected: 620, source: "PHYSICS.md §4 4e (truncating) [FORMULA]" }, // [FORMULA]
      { quantity: "currentResolution", expected: 0.8057e-9, source: "PHYSICS.md §4 4b [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "range-radio",
    kind: "template",
    cite: ["Ohm's law", "IEEE Std 1241-2010"],
    template: "range-resolution",
    params: { current: 2e-3, fullScaleVoltage: 3.3, adcBits: 12, adcReference: 3.3 },
    checks: [
      { quantity: "bestRange", expected: "uA", source: "PHYSICS.md §3 3b [FORMULA]" }, // [FORMULA]
      { quantity: "outputVoltage", expected: 2.0, source: "PHYSICS.md §3 3b [FORMULA]" }, // [FORMULA]
      { quantity: "currentResolution", expected: 0.8057e-6, source: "PHYSICS.md §4 4b [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "range-edge",
    kind: "template",
    cite: ["Ohm's law", "IEEE Std 1241-2010"],
    template: "range-resolution",
    params: { current: 3.3e-6, fullScaleVoltage: 3.3, adcBits: 12, adcReference: 3.3 },
    checks: [
      { quantity: "bestRange", expected: "uA", source: "PHYSICS.md §3 3c [FORMULA]" }, // [FORMULA]
      { quantity: "outputVoltage", expected: 3.3e-3, source: "PHYSICS.md §3 3c [FORMULA]" }, // [FORMULA]
      { quantity: "adcCode", expected: 4, source: "PHYSICS.md §3 3c (≈4 codes) [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "range-gap",
    kind: "template",
    cite: ["Ohm's law", "IEEE Std 1241-2010"],
    template: "range-resolution",
    params: { current: 3.4e-3, fullScaleVoltage: 3.3, adcBits: 12, adcReference: 3.3 },
    checks: [
      { quantity: "bestRange", expected: "mA", source: "PHYSICS.md §3 3f [FORMULA]" }, // [FORMULA]
      { quantity: "outputVoltage", expected: 3.4e-3, source: "PHYSICS.md §3 3f [FORMULA]" }, // [FORMULA]
      { quantity: "adcCode", expected: 4, source: "PHYSICS.md §3 3f [FORMULA]" }, // [FORMULA]
      { quantity: "currentResolution", expected: 0.8057e-3, source: "PHYSICS.md §4 4b [FORMULA]" }, // [FORMULA]
    ],
  },

  // ---- Lesson 8: currents in both directions ----
  {
    id: "bidir-charge",
    kind: "template",
    cite: ["worked here from the formula", "IEEE Std 1241-2010"],
    template: "bidirectional-offset",
    // the 220 mAh cell charging at about 0.45 C, read on the mA range (1 V/A): code 2172
    params: { offsetVoltage: 1.65, sensitivity: 1, outputVoltage: 2172 * LSB12, fullScaleVoltage: 3.3 },
    checks: [
      { quantity: "signedCurrent", expected: 99.90e-3, source: "PHYSICS.md §5 5f [FORMULA]" }, // [FORMULA]
      { quantity: "maxPositiveCurrent", expected: 1.65, source: "PHYSICS.md §5 5f (±1.650 A) [FORMULA]" }, // [FORMULA]
      { quantity: "maxNegativeCurrent", expected: -1.65, source: "PHYSICS.md §5 5f (±1.650 A) [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "bidir-sleep",
    kind: "template",
    cite: ["worked here from the formula", "IEEE Std 1241-2010"],
    template: "bidirectional-offset",
    // the node asleep, drawing from the cell, read on the nA range (10⁶ V/A): code 1000
    params: { offsetVoltage: 1.65, sensitivity: 1e6, outputVoltage: 1000 * LSB12, fullScaleVoltage: 3.3 },
    checks: [
      { quantity: "signedCurrent", expected: -844.3e-9, source: "PHYSICS.md §5 5b [FORMULA]" }, // [FORMULA]
      { quantity: "maxPositiveCurrent", expected: 1.65e-6, source: "PHYSICS.md §5 (±1.65 µA) [FORMULA]" }, // [FORMULA]
      { quantity: "maxNegativeCurrent", expected: -1.65e-6, source: "PHYSICS.md §5 (±1.65 µA) [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "bidir-mid",
    kind: "template",
    cite: ["worked here from the formula", "IEEE Std 1241-2010"],
    template: "bidirectional-offset",
    params: { offsetVoltage: 1.65, sensitivity: 1e6, outputVoltage: 2048 * LSB12, fullScaleVoltage: 3.3 },
    checks: [{ quantity: "signedCurrent", expected: 0, source: "PHYSICS.md §5 5c [FORMULA]" }], // [FORMULA]
  },

  // ---- Lessons 7 and 10: filtering, settling, noise ----
  {
    id: "filter-node",
    kind: "template",
    cite: ["Analog and Digital Filter Design"],
    template: "filter-noise",
    params: { filterResistance: 10e3, filterCapacitance: 100e-9, shuntResistance: 10e3, temperature: 300 },
    checks: [
      { quantity: "timeConstant", expected: 1.0e-3, source: "PHYSICS.md §6 6a [FORMULA]" }, // [FORMULA]
      { quantity: "cutoffFrequency", expected: 159.2, source: "PHYSICS.md §6 6a [FORMULA]" }, // [FORMULA]
      { quantity: "settlingTime1pct", expected: 4.605e-3, source: "PHYSICS.md §6 6a [FORMULA; MEM]" }, // [FORMULA; MEM]
      { quantity: "noiseBandwidth", expected: 250.0, source: "PHYSICS.md §6 6a, 6f [PUB: Winder]" }, // [FORMULA; PUB]
      { quantity: "thermalNoiseVoltage", expected: 203.5e-9, source: "PHYSICS.md §7 7e [FORMULA]" }, // [FORMULA]
      { quantity: "thermalNoiseCurrent", expected: 20.35e-12, source: "PHYSICS.md §7 7e [FORMULA]" }, // [FORMULA]
    ],
  },

  // ---- Lesson 9: duty-cycled loads ----
  {
    id: "duty-node",
    kind: "template",
    cite: ["worked here from the definition of the average"],
    template: "duty-cycle",
    params: { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 220 * mAh, usableFraction: 0.8 },
    checks: [
      { quantity: "averageCurrent", expected: 202.0e-6, source: "PHYSICS.md §8 8a [FORMULA]" }, // [FORMULA]
      { quantity: "chargePerWake", expected: 200.0e-6, source: "PHYSICS.md §8 8a [FORMULA]" }, // [FORMULA]
      { quantity: "batteryLife", expected: 871.4 * 3600, source: "PHYSICS.md §8 8b (871.4 h) [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "duty-slow",
    kind: "template",
    cite: ["worked here from the definition of the average"],
    template: "duty-cycle",
    params: { sleepCurrent: 3e-6, activeCurrent: 25e-3, activeTime: 5e-3, period: 10, batteryCapacity: 220 * mAh, usableFraction: 0.8 },
    checks: [
      { quantity: "averageCurrent", expected: 15.5e-6, source: "PHYSICS.md §8 8c [FORMULA]" }, // [FORMULA]
      { quantity: "batteryLife", expected: 1.136e4 * 3600, source: "PHYSICS.md §8 8c (1.136e4 h) [FORMULA]" }, // [FORMULA]
    ],
  },

  // ---- Lesson 11: uncertainty ----
  {
    id: "unc-bench",
    kind: "template",
    cite: ["JCGM 100:2008"],
    template: "uncertainty",
    params: {
      reading: 1.0,
      readingAccuracyPercent: 0.5,
      readingCounts: 2,
      countSize: 1e-3,
      shuntResistance: 10,
      shuntTolerancePercent: 1,
      coverageFactor: 2,
    },
    checks: [
      { quantity: "current", expected: 100.0e-3, source: "PHYSICS.md §9 9b [FORMULA: GUM 4.3.7, 5.1.6, 6.2]" }, // [FORMULA]
      { quantity: "relativeStandardUncertaintyPercent", expected: 0.7047, source: "PHYSICS.md §9 9b [FORMULA]" }, // [FORMULA]
      { quantity: "combinedStandardUncertainty", expected: 0.7047e-3, source: "PHYSICS.md §9 9b [FORMULA]" }, // [FORMULA]
      { quantity: "expandedUncertainty", expected: 1.409e-3, source: "PHYSICS.md §9 9b [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "unc-amp",
    kind: "template",
    cite: ["JCGM 100:2008"],
    template: "uncertainty",
    params: {
      reading: 50.0e-3,
      readingAccuracyPercent: 0.5,
      readingCounts: 2,
      countSize: 0.1e-3,
      shuntResistance: 0.1,
      shuntTolerancePercent: 1,
      coverageFactor: 2,
    },
    checks: [
      { quantity: "current", expected: 500.0e-3, source: "PHYSICS.md §9 9d [FORMULA]" }, // [FORMULA]
      { quantity: "relativeStandardUncertaintyPercent", expected: 0.7767, source: "PHYSICS.md §9 9d [FORMULA]" }, // [FORMULA]
      { quantity: "expandedUncertainty", expected: 7.767e-3, source: "PHYSICS.md §9 9d [FORMULA]" }, // [FORMULA]
    ],
  },

  {
    id: "unc-chain",
    kind: "template",
    cite: ["JCGM 100:2008"],
    template: "uncertainty",
    // the amp-range reading again, now through the course meter's own chain: ×50 into a 12-bit, 3.3 V converter
    params: {
      reading: 50.0e-3,
      readingAccuracyPercent: 0.5,
      readingCounts: 2,
      countSize: 0.1e-3,
      shuntResistance: 0.1,
      shuntTolerancePercent: 1,
      coverageFactor: 2,
      shuntTempcoPpm: 50,
      temperatureChange: 10,
      gainErrorPercent: 0.2,
      referenceTolerancePercent: 0.1,
      amplifierGain: 50,
      adcBits: 12,
      adcReference: 3.3,
    },
    checks: [
      { quantity: "current", expected: 0.5, source: "Ohm's law [FORMULA]" }, // [FORMULA]
      { quantity: "readingContribution", expected: 2.598e-3, source: "PHYSICS.md §9 9g [FORMULA: GUM 4.3.7, 5.1.2]" }, // [FORMULA]
      { quantity: "shuntToleranceContribution", expected: 2.887e-3, source: "PHYSICS.md §9 9g [FORMULA: GUM 4.3.7]" }, // [FORMULA]
      { quantity: "tempcoContribution", expected: 144.3e-6, source: "PHYSICS.md §9 9g [FORMULA: GUM 4.3.7, ΔR/R = αΔT]" }, // [FORMULA]
      { quantity: "gainContribution", expected: 577.4e-6, source: "PHYSICS.md §9 9g [FORMULA: GUM 4.3.7]" }, // [FORMULA]
      { quantity: "referenceContribution", expected: 288.7e-6, source: "PHYSICS.md §9 9g [FORMULA: GUM 4.3.7]" }, // [FORMULA]
      { quantity: "quantisationContribution", expected: 46.52e-6, source: "PHYSICS.md §9 9g [FORMULA: GUM F.2.2.1, q/√12]" }, // [FORMULA]
      { quantity: "relativeStandardUncertaintyPercent", expected: 0.788, source: "PHYSICS.md §9 9g [FORMULA]" }, // [FORMULA]
      { quantity: "combinedStandardUncertainty", expected: 3.940e-3, source: "PHYSICS.md §9 9g [FORMULA: GUM 5.1.2]" }, // [FORMULA]
      { quantity: "sensitivityReading", expected: 10, source: "PHYSICS.md §9 9g (c_V = 1/R) [FORMULA: GUM 5.1.3]" }, // [FORMULA]
      { quantity: "sensitivityShunt", expected: -5, source: "PHYSICS.md §9 9g (c_R = −I/R) [FORMULA: GUM 5.1.3]" }, // [FORMULA]
      { quantity: "expandedUncertainty", expected: 7.880e-3, source: "PHYSICS.md §9 9g [FORMULA: GUM 6.2, k = 2]" }, // [FORMULA]
      { quantity: "dominantContribution", expected: "shunt tolerance", source: "PHYSICS.md §9 9g [FORMULA]" },
    ],
  },

  // ---- Lesson 12: leakage and guarding ----
  {
    id: "leak-node",
    kind: "template",
    cite: ["Ohm's law"],
    template: "leakage-guard",
    params: { sourceVoltage: 10, insulationResistance: 1e11, measuredCurrent: 1e-9, biasCurrent: 5e-12, guardVoltage: 2e-3 },
    checks: [
      { quantity: "leakageCurrent", expected: 100e-12, source: "PHYSICS.md §14 14b [FORMULA: Ohm's law]" }, // [FORMULA]
      { quantity: "leakageErrorPercent", expected: 10, source: "PHYSICS.md §14 14b [FORMULA]" }, // [FORMULA]
      { quantity: "biasErrorPercent", expected: 0.5, source: "PHYSICS.md §14 14b [FORMULA]" }, // [FORMULA]
      { quantity: "unguardedErrorPercent", expected: 10.5, source: "PHYSICS.md §14 14b [FORMULA]" }, // [FORMULA]
      { quantity: "guardedLeakage", expected: 20e-15, source: "PHYSICS.md §14 14b [FORMULA: Ohm's law]" }, // [FORMULA]
      { quantity: "guardedErrorPercent", expected: 0.502, source: "PHYSICS.md §14 14b [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "leak-hv",
    kind: "template",
    cite: ["Ohm's law"],
    template: "leakage-guard",
    params: { sourceVoltage: 5000, insulationResistance: 5e12, measuredCurrent: 100e-9, biasCurrent: 5e-12, guardVoltage: 1 },
    checks: [{ quantity: "leakageCurrent", expected: 1e-9, source: "PHYSICS.md §14 14a [FORMULA: Ohm's law]" }], // [FORMULA]
  },

  // ---- Lesson 13: offsets and thermoelectric voltages ----
  {
    id: "thermal-solder",
    kind: "template",
    cite: ["worked here from the formula", "from memory"],
    template: "offset-thermal",
    params: { shuntResistance: 1e-3, current: 0.1, offsetVoltage: 10e-6, seebeckMicrovoltsPerKelvin: 5, junctionTemperatureDifference: 1 },
    checks: [
      { quantity: "thermalEmf", expected: 5e-6, source: "PHYSICS.md §15 15c [MEM: copper to tin-lead solder ≈ 5 µV/K; FORMULA: V = S·ΔT]" }, // [MEM; FORMULA]
      { quantity: "apparentCurrent", expected: 15e-3, source: "PHYSICS.md §15 15c [FORMULA: Ohm's law]" }, // [FORMULA]
      { quantity: "offsetErrorPercent", expected: 15, source: "PHYSICS.md §15 15c [FORMULA]" }, // [FORMULA]
      { quantity: "forwardVoltage", expected: 115e-6, source: "PHYSICS.md §15 15c [FORMULA]" }, // [FORMULA]
      { quantity: "reverseVoltage", expected: -85e-6, source: "PHYSICS.md §15 15c [FORMULA]" }, // [FORMULA]
      { quantity: "reversedCurrent", expected: 100e-3, source: "PHYSICS.md §15 15c [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "thermal-copper",
    kind: "template",
    cite: ["worked here from the formula", "from memory"],
    template: "offset-thermal",
    params: { shuntResistance: 1e-3, current: 0.1, offsetVoltage: 0, seebeckMicrovoltsPerKelvin: 0.2, junctionTemperatureDifference: 5 },
    checks: [{ quantity: "thermalEmf", expected: 1e-6, source: "PHYSICS.md §15 15a [MEM: copper to copper ≤ 0.2 µV/K; FORMULA: V = S·ΔT]" }], // [MEM; FORMULA]
  },

  // ---- Lesson 14: sampling short bursts ----
  {
    id: "burst-node",
    kind: "template",
    cite: ["worked here from the formula"],
    template: "sampling-burst",
    params: { sampleRate: 1000, burstWidth: 5e-3, requiredSamples: 20, wakePeriod: 1.02, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6 },
    checks: [
      { quantity: "samplesPerBurst", expected: 5, source: "PHYSICS.md §16 16c [FORMULA]" }, // [FORMULA]
      { quantity: "minimumSampleRate", expected: 4000, source: "PHYSICS.md §16 16c [FORMULA]" }, // [FORMULA]
      { quantity: "apparentWakeFrequency", expected: 0.019608, source: "PHYSICS.md §16 16c [FORMULA]" }, // [FORMULA]
      { quantity: "worstCaseAverageError", expected: 19.606e-6, source: "PHYSICS.md §16 16c [FORMULA]" }, // [FORMULA]
      { quantity: "worstCaseErrorPercent", expected: 19.6, source: "PHYSICS.md §16 16c [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "alias-3200",
    kind: "template",
    cite: ["worked here from the formula"],
    template: "sampling-burst",
    params: { sampleRate: 100e3, burstWidth: 0.1e-3, requiredSamples: 5, wakePeriod: 1 / 3200, logRate: 1000, activeCurrent: 20e-3, sleepCurrent: 2e-6 },
    checks: [{ quantity: "apparentWakeFrequency", expected: 200, source: "PHYSICS.md §16 16a [FORMULA: f_a = |f − n·f_s|]" }], // [FORMULA]
  },

  // ---- Teaching helpers that lib/grader has no template for (lib/lessons/teaching.ts) ----
  {
    id: "autorange-thresholds",
    kind: "teaching",
    cite: ["common practice, no single source", "IEEE Std 1241-2010"],
    fn: "autorange",
    params: { upFraction: 0.9, downFraction: 0.8, fullScaleVoltage: 3.3, sensitivityLow: 1e6, sensitivityHigh: 1e3 },
    checks: [
      { quantity: "upCurrent", expected: 2.97e-6, source: "PHYSICS.md §3 3d [CP; FORMULA]" }, // [CP; FORMULA]
      { quantity: "downCurrent", expected: 2.64e-6, source: "PHYSICS.md §3 3d [CP; FORMULA]" }, // [CP; FORMULA]
      { quantity: "downVoltageOnHigh", expected: 2.64e-3, source: "PHYSICS.md §3 (hdown·VFS/1000) [FORMULA]" }, // [FORMULA]
      { quantity: "downLsbOnHigh", expected: 3.277, source: "PHYSICS.md §3 (2.64 µA = 3.277 LSB) [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "pulse-fast-filter",
    kind: "teaching",
    cite: ["worked here from the formula"],
    fn: "pulsePeak",
    params: { pulseCurrent: 20e-3, pulseWidth: 1e-3, timeConstant: 1e-3 },
    checks: [
      { quantity: "peak", expected: 12.64e-3, source: "PHYSICS.md §6 6e [FORMULA]" }, // [FORMULA]
      { quantity: "peakPercent", expected: 63.21, source: "PHYSICS.md §6 6e [FORMULA]" }, // [FORMULA]
      { quantity: "charge", expected: 20.0e-6, source: "PHYSICS.md §6 6e [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "pulse-slow-filter",
    kind: "teaching",
    cite: ["worked here from the formula"],
    fn: "pulsePeak",
    params: { pulseCurrent: 20e-3, pulseWidth: 1e-3, timeConstant: 10e-3 },
    checks: [
      { quantity: "peak", expected: 1.903e-3, source: "PHYSICS.md §6 6e [FORMULA]" }, // [FORMULA]
      { quantity: "peakPercent", expected: 9.516, source: "PHYSICS.md §6 6e [FORMULA]" }, // [FORMULA]
      { quantity: "charge", expected: 20.0e-6, source: "PHYSICS.md §6 6e [FORMULA]" }, // [FORMULA]
    ],
  },
  {
    id: "shot-1uA",
    kind: "teaching",
    cite: ["worked here from the formula", "Annalen der Physik"],
    fn: "shotNoise",
    params: { current: 1e-6, bandwidth: 1 },
    checks: [{ quantity: "noiseCurrent", expected: 0.5661e-12, source: "PHYSICS.md §7 7f [FORMULA: exact q]" }], // [FORMULA]
  },
  {
    id: "shot-1nA",
    kind: "teaching",
    cite: ["worked here from the formula", "Annalen der Physik"],
    fn: "shotNoise",
    params: { current: 1e-9, bandwidth: 1 },
    checks: [{ quantity: "noiseCurrent", expected: 17.9e-15, source: "PHYSICS.md §7 7f [FORMULA: exact q]" }], // [FORMULA]
  },
  {
    id: "unweighted-mean",
    kind: "teaching",
    cite: ["worked here from the definition of the average"],
    fn: "unweightedMean",
    params: { a: 20e-3, b: 2e-6 },
    checks: [{ quantity: "mean", expected: 10.0e-3, source: "PHYSICS.md §12.5 (wrong method) [FORMULA]" }], // [FORMULA]
  },
] as const satisfies readonly Example[];

export type ExampleId = (typeof examples)[number]["id"];

const byId = new Map<string, Example>(examples.map((e) => [e.id, e as Example]));

export function getExample(id: string): Example {
  const e = byId.get(id);
  if (!e) throw new Error(`unknown lesson example "${id}"`);
  return e;
}
