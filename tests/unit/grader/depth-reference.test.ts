// Reference values of the three nanoamp/microvolt/sampling templates and of the uncertainty template's
// whole chain. Check values are typed in from the source named beside each (or worked by hand from the
// physical law named, "common practice"); mathjs evaluates the same laws with units as an outside oracle.
// The same values, with their tags, are lib/grader/PHYSICS.md §9 9f–9h, §14, §15 and §16.
import { describe, expect, it } from "vitest";
import { create, all } from "mathjs";
import { templates, gradeAttempt, defaultVariantSpec, drawVariant, isComputable } from "../../../lib/grader";
import { near } from "./helpers";

const math = create(all);
const ev = (expr: string, unit: string) => (math.evaluate(expr) as { toNumber(u: string): number }).toNumber(unit);
/** a dimensionless ratio: mathjs cancels the units and returns a plain number */
const ratio = (expr: string) => math.evaluate(expr) as number;

const lg = (p: Partial<Record<string, number>> = {}) =>
  templates["leakage-guard"].compute({ sourceVoltage: 10, insulationResistance: 1e11, measuredCurrent: 1e-9, biasCurrent: 5e-12, guardVoltage: 2e-3, ...p });
const ot = (p: Partial<Record<string, number>> = {}) =>
  templates["offset-thermal"].compute({ shuntResistance: 1e-3, current: 0.1, offsetVoltage: 10e-6, seebeckMicrovoltsPerKelvin: 5, junctionTemperatureDifference: 1, ...p });
const sb = (p: Partial<Record<string, number>> = {}) =>
  templates["sampling-burst"].compute({ sampleRate: 1000, burstWidth: 5e-3, requiredSamples: 20, wakePeriod: 1.02, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6, ...p });
const oldLab = { reading: 50e-3, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 0.1e-3, shuntResistance: 0.1, shuntTolerancePercent: 1, coverageFactor: 2 };
const chain = { ...oldLab, shuntTempcoPpm: 50, temperatureChange: 10, gainErrorPercent: 0.2, referenceTolerancePercent: 0.1, amplifierGain: 50, adcBits: 12, adcReference: 3.3 };
const unc = (p: Record<string, number>) => templates.uncertainty.compute(p);

describe("leakage-guard", () => {
  it("5 kV across 5 TΩ leaks about 1 nA", () => {
    // [PUB] an insulation tester's user manual, "Measurement above 100 GΩ": a 5 kV field "likely to cause at
    // least 1 nA of unwanted leakage current, representing a 5 TΩ resistance"
    near(lg({ sourceVoltage: 5000, insulationResistance: 5e12, measuredCurrent: 100e-9, guardVoltage: 1 }).leakageCurrent, 1e-9);
  });
  it("10 V across 100 GΩ against 1 nA: 100 pA, 10 %; 5 pA bias 0.5 %; guarded at 2 mV: 20 fA, 0.502 %", () => {
    // Ohm's law, worked by hand (common practice, no source)
    const v = lg();
    near(v.leakageCurrent, 100e-12);
    near(v.leakageErrorPercent, 10);
    near(v.biasErrorPercent, 0.5);
    near(v.unguardedErrorPercent, 10.5);
    near(v.guardedLeakage, 20e-15);
    near(v.guardedErrorPercent, 0.502);
  });
  it("mathjs agrees", () => {
    const v = lg();
    near(v.leakageCurrent, ev("10 V / 100 Gohm", "A"), 1e-12);
    near(v.guardedLeakage, ev("2 mV / 100 Gohm", "A"), 1e-12);
    near(v.guardedErrorPercent, ratio("(2 mV / 100 Gohm + 5 pA) / 1 nA") * 100, 1e-12);
  });
  it("a guard never removes the bias current: the guarded error stays above it", () => {
    const v = lg({ guardVoltage: 1e-6 });
    expect(v.guardedErrorPercent as number).toBeGreaterThan(v.biasErrorPercent as number);
  });
});

describe("offset-thermal", () => {
  it("thermoelectric voltage E = Q·ΔT: copper to copper at ≤0.2 µV/°C over 5 °C is about 1 µV", () => {
    // [PUB] a bench multimeter's user manual, appendix "Thermoelectric generation": E_T = Q_AB(T1 − T2), copper-to-copper
    // junctions "as high as 0.2 µV/°C", a several-degree difference gives microvolts
    near(ot({ seebeckMicrovoltsPerKelvin: 0.2, junctionTemperatureDifference: 5 }).thermalEmf, 1e-6);
  });
  it("copper to copper oxide at about 1000 µV/°C: 1 K gives 1 mV", () => {
    // [PUB] thermoelectric-voltage table in a bench multimeter's measurement tutorial ("Copper-Oxide 1000 µV/°C")
    near(ot({ seebeckMicrovoltsPerKelvin: 1000, junctionTemperatureDifference: 1, current: 10, offsetVoltage: 0 }).thermalEmf, 1e-3);
  });
  it("1 mΩ, 100 mA, 10 µV offset, tin-lead solder 5 µV/K over 1 K: 15 mA apparent, 15 %, readings 115 µV and −85 µV, reversal 100 mA", () => {
    // [PUB] 5 µV/°C copper to tin-lead solder, same table; the rest Ohm's law worked by hand (common practice, no source)
    const v = ot();
    near(v.thermalEmf, 5e-6);
    near(v.apparentCurrent, 15e-3);
    near(v.offsetErrorPercent, 15);
    near(v.forwardVoltage, 115e-6);
    near(v.reverseVoltage, -85e-6);
    near(v.reversedCurrent, 100e-3);
  });
  it("a negative offset can cancel part of the thermoelectric voltage", () => {
    // by hand: (−3 µV + 5 µV)/1 mΩ = 2 mA (common practice, no source)
    near(ot({ offsetVoltage: -3e-6 }).apparentCurrent, 2e-3);
  });
  it("mathjs agrees", () => {
    const v = ot();
    near(v.apparentCurrent, ev("(10 uV + 5 uV / K * 1 K) / 1 mohm", "A"), 1e-12);
    near(v.reversedCurrent, ev("((100 mA * 1 mohm + 15 uV) - (-100 mA * 1 mohm + 15 uV)) / (2 * 1 mohm)", "A"), 1e-12);
  });
});

describe("sampling-burst", () => {
  it("a 3200 Hz wake sampled at 1000 Hz appears at 200 Hz, and so does 2800 Hz", () => {
    // [PUB] a signal-processing question-and-answer page, "Alias frequency formula" (1000 Hz sampling, 3200 Hz and 2800 Hz signals)
    near(sb({ wakePeriod: 1 / 3200, logRate: 1000, burstWidth: 0.1e-3 }).apparentWakeFrequency, 200);
    near(sb({ wakePeriod: 1 / 2800, logRate: 1000, burstWidth: 0.1e-3 }).apparentWakeFrequency, 200);
  });
  it("100 Hz at 90 Hz appears at 10 Hz; 60 Hz at 90 Hz at 30 Hz; 16 Hz at 8 Hz at 0 Hz", () => {
    // [PUB] same page (90 Hz / 100 Hz example); a published homework solution on alias frequencies (60 Hz at 90 Hz, 16 Hz at 8 Hz)
    near(sb({ wakePeriod: 1 / 100, logRate: 90, burstWidth: 1e-3 }).apparentWakeFrequency, 10);
    near(sb({ wakePeriod: 1 / 60, logRate: 90, burstWidth: 1e-3 }).apparentWakeFrequency, 30);
    expect(sb({ wakePeriod: 1 / 16, logRate: 8, burstWidth: 1e-3 }).apparentWakeFrequency as number).toBeLessThan(1e-12);
  });
  it("5 ms burst at 1 kHz: 5 samples; 20 samples need 4 kHz; a 1.02 s wake on a 1 Hz logger drifts at 19.61 mHz", () => {
    // by hand (common practice, no source): 5 ms × 1 kHz; 20 / 5 ms; |1/1.02 − 1| Hz
    const v = sb();
    near(v.samplesPerBurst, 5);
    near(v.minimumSampleRate, 4000);
    near(v.apparentWakeFrequency, 0.019608);
  });
  it("worst-case error of the average: one sample interval of (I_a − I_s) per period, 19.61 µA or 19.60 % of 100.0 µA", () => {
    // by hand (common practice, no source): (20 mA − 2 µA) × 1 ms / 1.02 s; average (20 mA·5 ms + 2 µA·1.015 s)/1.02 s
    const v = sb();
    near(v.worstCaseAverageError, 19.606e-6);
    near(v.worstCaseErrorPercent, 19.60);
    near(v.worstCaseAverageError, ev("(20 mA - 2 uA) / (1 kHz * 1.02 s)", "A"), 1e-12);
  });
});

describe("uncertainty: the whole chain", () => {
  it("labs made before the chain keep every value (PHYSICS.md §9 9d: 0.7767 %, 7.767 mA)", () => {
    // [FORMULA] PHYSICS.md §9 9d, as in reference.test.ts
    const v = unc(oldLab);
    near(v.relativeStandardUncertaintyPercent, 0.7767);
    near(v.expandedUncertainty, 7.767e-3);
    // with the chain's terms written out as zero the values are identical
    const zero = unc({ ...oldLab, shuntTempcoPpm: 0, temperatureChange: 0, gainErrorPercent: 0, referenceTolerancePercent: 0, amplifierGain: 1, adcBits: 0, adcReference: 3.3 });
    for (const k of ["current", "relativeStandardUncertaintyPercent", "combinedStandardUncertainty", "expandedUncertainty"]) expect(zero[k]).toBe(v[k]);
  });
  it("quantisation: a 12-bit, 3.3 V step of 805.7 µV has a standard uncertainty of 232.6 µV (LSB/√12)", () => {
    // [PUB] PHYSICS.md §4 4a: quantisation-noise formula page, worked 12-bit/3.3 V example (0.806 mV, 0.233 mV)
    const v = unc({ reading: 1, readingAccuracyPercent: 0, readingCounts: 0, countSize: 1e-3, shuntResistance: 1, shuntTolerancePercent: 0, coverageFactor: 2, adcBits: 12, adcReference: 3.3, amplifierGain: 1 });
    near(v.quantisationContribution, 232.6e-6);
    expect(v.dominantContribution).toBe("quantisation");
  });
  it("50 mV across 0.1 Ω with 50 ppm/K over 10 K, 0.2 % gain, 0.1 % reference, ×50 into 12 bits: the budget", () => {
    // GUM 4.3.7 (a/√3), F.2.2.1 (q/√12), 5.1.2 (Σ (c_i u_i)²), 6.2 (U = k u_c): worked by hand from the formulas
    // (PHYSICS.md §9 9g). The converter reads the shunt: its gain, reference and step are the rows, and the
    // voltmeter's ±(0.5 % + 2 counts) is not counted beside them (it would count the same errors twice).
    const v = unc(chain);
    near(v.current, 0.5);
    near(v.sensitivityReading, 10); // 1/R in A/V
    near(v.sensitivityShunt, -5); // −I/R in A/Ω
    expect(v.readingContribution).toBe(0);
    near(v.shuntToleranceContribution, 2.887e-3); // 0.5 A × 1 %/√3
    near(v.tempcoContribution, 144.3e-6); // 0.5 A × 50e-6 K⁻¹ × 10 K/√3
    near(v.gainContribution, 577.4e-6); // 0.5 A × 0.2 %/√3
    near(v.referenceContribution, 288.7e-6); // 0.5 A × 0.1 %/√3
    near(v.quantisationContribution, 46.52e-6); // 3.3 V/(4096 × 50)/√12 / 0.1 Ω
    near(v.relativeStandardUncertaintyPercent, 0.5924);
    near(v.combinedStandardUncertainty, 2.962e-3);
    near(v.expandedUncertainty, 5.924e-3);
    expect(v.dominantContribution).toBe("shunt tolerance");
  });
  it("mathjs agrees on the combined uncertainty with units", () => {
    const v = unc(chain);
    const uc = ev(
      "sqrt((5 A/ohm * 0.01 * 0.1 ohm / sqrt(3))^2 + (0.5 A * 50e-6 / K * 10 K / sqrt(3))^2 + (0.5 A * 0.002 / sqrt(3))^2 + (0.5 A * 0.001 / sqrt(3))^2 + (10 A/V * 3.3 V / (4096 * 50) / sqrt(12))^2)",
      "A",
    );
    near(v.combinedStandardUncertainty, uc, 1e-12);
  });
  it("the dominant contribution moves to the tempco when the shunt runs hot", () => {
    // by hand: 0.5 A × 300e-6 × 40 K/√3 = 3.46 mA > 2.887 mA (common practice, no source)
    expect(unc({ ...chain, shuntTempcoPpm: 300, temperatureChange: 40 }).dominantContribution).toBe("shunt tempco");
  });
  it("grades the dominant contribution as a named choice, and a linear sum of the chain's bounds as a recognised mistake", () => {
    const r = gradeAttempt({
      template: "uncertainty",
      params: chain,
      questions: [
        { quantity: "dominantContribution", kind: "prediction", points: 1 },
        { quantity: "relativeStandardUncertaintyPercent", kind: "prediction", points: 1 },
      ],
      // the bounds added linearly: 1 % + 0.05 % + 0.2 % + 0.1 % + 0.01611 % (by hand, PHYSICS.md §9 9h)
      readings: ["Shunt tolerance", "1.366 %"],
    });
    expect(r.results[0].verdict).toBe("correct");
    expect(r.results[1].verdict).toBe("mistake");
    expect(r.results[1].mistake).toBe("linear-sum");
  });
  it("at nanoamps Type A, offset, bias current and leakage dominate (PHYSICS.md §9 9i)", () => {
    // by hand [FORMULA: GUM 4.2.3 s/√n; 4.3.7 a/√3; 5.1.2]: 5 mV across 1 MΩ ± 0.1 % = 5 nA, read with
    // ±(0.05 % + 2 counts of 1 µV); s = 30 µV over n = 10; offset ±20 µV; bias ±10 pA; leakage ±5 pA
    const nano = { reading: 5e-3, readingAccuracyPercent: 0.05, readingCounts: 2, countSize: 1e-6, shuntResistance: 1e6, shuntTolerancePercent: 0.1, coverageFactor: 2, repeatStdDev: 30e-6, repeatCount: 10, offsetBound: 20e-6, biasCurrentBound: 10e-12, leakageBound: 5e-12 };
    const v = unc(nano);
    near(v.current, 5e-9);
    near(v.readingContribution, 2.598e-12); // (0.05 % × 5 mV + 2 µV)/√3/1 MΩ
    near(v.repeatabilityContribution, 9.487e-12); // 30 µV/√10/1 MΩ
    near(v.offsetContribution, 11.55e-12); // 20 µV/√3/1 MΩ
    near(v.biasContribution, 5.774e-12); // 10 pA/√3
    near(v.leakageContribution, 2.887e-12); // 5 pA/√3
    near(v.combinedStandardUncertainty, 16.74e-12);
    near(v.expandedUncertainty, 33.47e-12);
    expect(v.dominantContribution).toBe("offset");
    // s itself for the mean (no √n): 30 pA, a recognised mistake
    const r = gradeAttempt({ template: "uncertainty", params: nano, questions: [{ quantity: "repeatabilityContribution", kind: "prediction", points: 1 }], readings: ["30 pA"] });
    expect(r.results[0].mistake).toBe("no-root-n");
  });
  it("a new lab from the builder's defaults draws the chain, and each draw can be computed", () => {
    const spec = defaultVariantSpec("uncertainty");
    for (let i = 0; i < 50; i++) {
      const p = drawVariant(spec, `chain-${i}`);
      expect(isComputable(templates.uncertainty, p)).toBe(true);
      expect(p.shuntTempcoPpm as number).toBeGreaterThan(0);
    }
  });
});
