// For every mistake key: an answer produced by the wrong method (computed here, independently, from the
// circuit) is recognised with that key; the right answer is not.
import { describe, expect, it } from "vitest";
import { gradeAttempt, MISTAKE_KEYS, type MistakeKey, type Params, type TemplateKey } from "../../../lib/grader";

interface Case {
  key: MistakeKey;
  template: TemplateKey;
  params: Params;
  quantity: string;
  wrong: string | number;
  right: string | number;
}

const sb = { supplyVoltage: 1.8, loadResistance: 100, shuntResistance: 10 };
const sel = { maxCurrent: 3.3, maxBurden: 0.1, series: "E24" };
// the teaching meter: 300 µA on its 500 µA range (5·10³ V/A) gives 1.500 V, code ⌊1.5 × 16384 / 2.5⌋ = 9830
const rr = { current: 300e-6, fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 };
const duty = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 792, usableFraction: 0.8 };
const bid = { offsetVoltage: 1.65, sensitivity: 1e6, outputVoltage: (3000 * 3.3) / 4096, fullScaleVoltage: 3.3 };
const fn = { filterResistance: 10e3, filterCapacitance: 100e-9, shuntResistance: 10e3, temperature: 300 };
const unc = { reading: 1, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 1e-3, shuntResistance: 10, shuntTolerancePercent: 1, coverageFactor: 2 };
const k = 1.380649e-23;
const lg = { sourceVoltage: 10, insulationResistance: 1e11, measuredCurrent: 1e-9, biasCurrent: 5e-12, guardVoltage: 2e-3 };
const ot = { shuntResistance: 1e-3, current: 0.1, offsetVoltage: 10e-6, seebeckMicrovoltsPerKelvin: 5, junctionTemperatureDifference: 1 };
const sbp = { sampleRate: 1000, burstWidth: 5e-3, requiredSamples: 20, wakePeriod: 1.02, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6 };
const chain = { ...unc, reading: 50e-3, countSize: 0.1e-3, shuntResistance: 0.1, adcBits: 12, amplifierGain: 50, adcReference: 3.3 };

const cases: Case[] = [
  // 3.267 mA read as 3.267 A (PHYSICS.md §12.2: exactly 10^±3 off)
  { key: "prefix-slip", template: "shunt-burden", params: { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 }, quantity: "indicatedCurrent", wrong: "3.267 A", right: "3.267 mA" },
  { key: "prefix-slip", template: "filter-noise", params: fn, quantity: "thermalNoiseVoltage", wrong: "203.5 uV", right: "203.5 nV" },
  // 1.8 V / 100 Ω = 18 mA instead of 16.36 mA (PHYSICS.md §12.1)
  { key: "ignored-burden", template: "shunt-burden", params: sb, quantity: "indicatedCurrent", wrong: "18 mA", right: "16.36 mA" },
  { key: "ignored-burden", template: "shunt-burden", params: sb, quantity: "trueCurrent", wrong: "16.36 mA", right: "18.00 mA" },
  { key: "sign-flip", template: "shunt-burden", params: sb, quantity: "loadingErrorPercent", wrong: "9.091 %", right: "-9.091 %" },
  // 5b: −844.3 nA reported as +844.3 nA
  { key: "sign-flip", template: "bidirectional-offset", params: { ...bid, outputVoltage: (1000 * 3.3) / 4096 }, quantity: "signedCurrent", wrong: "844.3 nA", right: "-844.3 nA" },
  // 1g: nearest E24 value to 30.30 mΩ is 30 mΩ (floor) — use a case where nearest is above: 3.3 A, 0.107 V → 32.42 mΩ, nearest 33 mΩ
  { key: "nearest-not-floor", template: "shunt-selection", params: { ...sel, maxBurden: 0.107 }, quantity: "standardShunt", wrong: "33 mohm", right: "30 mohm" },
  { key: "nearest-not-floor", template: "shunt-selection", params: { ...sel, maxBurden: 0.107 }, quantity: "burdenAtFullScale", wrong: `${3.3 * 33} mV`, right: `${3.3 * 30} mV` },
  // 2 mA on the 1 mV/mA range gives 2 mV instead of 2 V
  // on the 50 mA range (50 V/A) the same current gives 15 mV, code ⌊0.015 × 6553.6⌋ = 98
  { key: "wrong-range", template: "range-resolution", params: rr, quantity: "outputVoltage", wrong: "15 mV", right: "1.5 V" },
  { key: "wrong-range", template: "range-resolution", params: rr, quantity: "bestRange", wrong: "50 mA", right: "500 µA" },
  { key: "wrong-range", template: "range-resolution", params: rr, quantity: "adcCode", wrong: 98, right: 9830 },
  // 5a: 2417 nA instead of 767.0 nA
  { key: "forgot-offset", template: "bidirectional-offset", params: bid, quantity: "signedCurrent", wrong: "2417 nA", right: "767.0 nA" },
  // 8a: 10.00 mA instead of 202.0 µA; life 17.6 h instead of 871.4 h (PHYSICS.md §12.5)
  { key: "unweighted-average", template: "duty-cycle", params: duty, quantity: "averageCurrent", wrong: "10.00 mA", right: "202.0 uA" },
  { key: "unweighted-average", template: "duty-cycle", params: duty, quantity: "batteryLife", wrong: "17.6 h", right: "871.4 h" },
  { key: "capacity-units", template: "duty-cycle", params: duty, quantity: "batteryLife", wrong: `${871.4 / 3.6} h`, right: "871.4 h" },
  { key: "capacity-units", template: "duty-cycle", params: duty, quantity: "batteryLife", wrong: `${871.4 * 3600} h`, right: "36.31 d" },
  // 6a: 1/(RC) = 1000 Hz instead of 159.2 Hz
  { key: "omitted-2pi", template: "filter-noise", params: fn, quantity: "cutoffFrequency", wrong: "1 kHz", right: "159.2 Hz" },
  { key: "cutoff-as-bandwidth", template: "filter-noise", params: fn, quantity: "noiseBandwidth", wrong: "159.2 Hz", right: "250 Hz" },
  { key: "cutoff-as-bandwidth", template: "filter-noise", params: fn, quantity: "thermalNoiseVoltage", wrong: `${Math.sqrt(4 * k * 300 * 10e3 * 159.155) * 1e9} nV`, right: "203.5 nV" },
  // 9e: linear sum of bounds 1.700 % → 1.700 mA instead of U = 1.409 mA
  { key: "linear-sum", template: "uncertainty", params: unc, quantity: "expandedUncertainty", wrong: "1.700 mA", right: "1.409 mA" },
  { key: "linear-sum", template: "uncertainty", params: unc, quantity: "relativeStandardUncertaintyPercent", wrong: `${0.4041 + 0.5774} %`, right: "0.7047 %" },
  // bounds as standard uncertainties: √(0.7² + 1²) = 1.221 %
  { key: "no-root-three", template: "uncertainty", params: unc, quantity: "relativeStandardUncertaintyPercent", wrong: "1.221 %", right: "0.7047 %" },
  { key: "no-root-three", template: "uncertainty", params: unc, quantity: "combinedStandardUncertainty", wrong: "1.221 mA", right: "0.7047 mA" },
  // 3.3 V/(4096·50) = 16.11 µV at the shunt; over √3 instead of √12, divided by 0.1 Ω: 93.03 µA instead of 46.52 µA (by hand)
  { key: "step-not-halved", template: "uncertainty", params: chain, quantity: "quantisationContribution", wrong: "93.03 uA", right: "46.52 uA" },
  // 10 V / 100 GΩ = 100 pA against 1 nA; 5 pA bias left out: 10 % instead of 10.5 % (Ohm's law, by hand)
  { key: "forgot-bias", template: "leakage-guard", params: lg, quantity: "unguardedErrorPercent", wrong: "10 %", right: "10.5 %" },
  { key: "forgot-bias", template: "leakage-guard", params: lg, quantity: "guardedErrorPercent", wrong: "0.002 %", right: "0.502 %" },
  // guard at the wrong node: the full 10 V stays across the insulation, 100 pA instead of 20 fA
  { key: "wrong-guard-node", template: "leakage-guard", params: lg, quantity: "guardedLeakage", wrong: "100 pA", right: "20 fA" },
  { key: "wrong-guard-node", template: "leakage-guard", params: lg, quantity: "guardedErrorPercent", wrong: "10.5 %", right: "0.502 %" },
  // (5 µV − 10 µV)/1 mΩ = −5 mA instead of (10 µV + 5 µV)/1 mΩ = 15 mA; reversed reading −115 µV instead of −85 µV
  { key: "offset-wrong-sign", template: "offset-thermal", params: ot, quantity: "apparentCurrent", wrong: "-5 mA", right: "15 mA" },
  { key: "offset-wrong-sign", template: "offset-thermal", params: ot, quantity: "reverseVoltage", wrong: "-115 uV", right: "-85 uV" },
  // (115 µV − (−85 µV))/1 mΩ = 200 mA instead of half of it
  { key: "unhalved-difference", template: "offset-thermal", params: ot, quantity: "reversedCurrent", wrong: "200 mA", right: "100 mA" },
  // 1.02 s × 1 kHz = 1020 samples instead of 5 ms × 1 kHz = 5; 20/1.02 s = 19.61 Hz instead of 4 kHz
  { key: "period-for-burst", template: "sampling-burst", params: sbp, quantity: "samplesPerBurst", wrong: 1020, right: 5 },
  { key: "period-for-burst", template: "sampling-burst", params: sbp, quantity: "minimumSampleRate", wrong: "19.61 Hz", right: "4 kHz" },
  // 1/1.02 s = 980.4 mHz reported; the 1 Hz logger shows |0.9804 − 1| Hz = 19.61 mHz
  { key: "ignored-aliasing", template: "sampling-burst", params: sbp, quantity: "apparentWakeFrequency", wrong: "980.4 mHz", right: "19.61 mHz" },
  // PHYSICS.md §9 9i [FORMULA: GUM 4.2.3]: s = 30 µV over n = 10 across 1 MΩ: 9.487 pA; s alone 30 pA
  {
    key: "no-root-n", template: "uncertainty",
    params: { reading: 5e-3, readingAccuracyPercent: 0.05, readingCounts: 2, countSize: 1e-6, shuntResistance: 1e6, shuntTolerancePercent: 0.1, coverageFactor: 2, repeatStdDev: 30e-6, repeatCount: 10 },
    quantity: "repeatabilityContribution", wrong: "30 pA", right: "9.487 pA",
  },
];

function grade(c: Case, answer: string | number) {
  return gradeAttempt({ template: c.template, params: c.params, questions: [{ quantity: c.quantity, kind: "prediction", points: 1 }], readings: [answer] }).results[0];
}

describe("recognised mistakes", () => {
  it("every key in lib/grader/README.md has a case", () => {
    expect(new Set(cases.map((c) => c.key))).toEqual(new Set(MISTAKE_KEYS));
    expect(MISTAKE_KEYS.length).toBe(20);
  });
  for (const c of cases) {
    it(`${c.key}: ${c.template}.${c.quantity} "${c.wrong}" is recognised; "${c.right}" is correct`, () => {
      const wrong = grade(c, c.wrong);
      expect(wrong.verdict).toBe("mistake");
      expect(wrong.mistake).toBe(c.key);
      expect(wrong.points).toBe(0);
      expect(wrong.feedback.length).toBeGreaterThan(40);
      const right = grade(c, c.right);
      expect(right.verdict).toBe("correct");
      expect(right.mistake).toBeUndefined();
      expect(right.points).toBe(1);
    });
  }
  it("a candidate is not used when the right answer is also inside its band", () => {
    // 10 Ω in 100 kΩ: V_s/R_L and V_s/(R_L+R_sh) differ by 0.01 %, so 33.00 µA is simply correct
    const r = gradeAttempt({
      template: "shunt-burden",
      params: { supplyVoltage: 3.3, loadResistance: 100e3, shuntResistance: 10 },
      questions: [{ quantity: "indicatedCurrent", kind: "prediction", points: 1 }],
      readings: ["33.00 uA"],
    }).results[0];
    expect(r.verdict).toBe("correct");
  });
});
