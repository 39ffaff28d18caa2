// Check values from lib/grader/PHYSICS.md, each with its source as lib/grader/PHYSICS.md tags it. Expected values are typed in from
// the document, not taken from the code.
import { describe, expect, it } from "vitest";
import { gradeAttempt, nearestStandard, templates, uncertaintyBudget, rangeTable, BOLTZMANN, ELEMENTARY_CHARGE } from "../../../lib/grader";
import { create, all } from "mathjs";
import { near } from "./helpers";

// [REF: mathjs] values: the four-figure value is checked against mathjs (constants, units, functions) as well
// as against the grader, so neither the grader nor the typed value stands alone.
const math = create(all);
const ev = (expr: string, unit?: string) => {
  const r = math.evaluate(expr) as number | { toNumber(u: string): number };
  return typeof r === "number" ? r : r.toNumber(unit!);
};

const sb = (supplyVoltage: number, loadResistance: number, shuntResistance: number) =>
  templates["shunt-burden"].compute({ supplyVoltage, loadResistance, shuntResistance });
const sel = (maxCurrent: number, maxBurden: number, series: string) =>
  templates["shunt-selection"].compute({ maxCurrent, maxBurden, series });
// the teaching meter (lib/instruments/library.ts): 14 bit on 2.5 V, ranges 5·10⁵, 5·10³, 50 and 2.5 V/A
const meter = { fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 };
const rr = (current: number) => templates["range-resolution"].compute({ current, ...meter });
const LSB14 = 2.5 / 16384;
const duty = (p: Record<string, number>) => templates["duty-cycle"].compute(p);
const bid = (outputVoltage: number, sensitivity: number) =>
  templates["bidirectional-offset"].compute({ offsetVoltage: 1.65, sensitivity, outputVoltage, fullScaleVoltage: 3.3 });
const fn = (filterResistance: number, filterCapacitance: number, shuntResistance: number, temperature: number) =>
  templates["filter-noise"].compute({ filterResistance, filterCapacitance, shuntResistance, temperature });
const unc = (p: Record<string, number>) => templates.uncertainty.compute(p);
// §5 keeps the seed document's former meter (1.650 V offset, 12 bit on 3.3 V) as check values: common practice
const LSB12 = 3.3 / 4096;

describe("§0 constants", () => {
  it("exact SI 2019 constants", () => {
    // [PUB] SI Brochure 9th ed. (2019), §2.2 Table 1 (defining constants)
    expect(BOLTZMANN).toBe(1.380649e-23);
    // [PUB] same
    expect(ELEMENTARY_CHARGE).toBe(1.602176634e-19);
  });
});

describe("§1 shunt selection and E-series rounding", () => {
  it("1a E96 nearest to 16 834.2 Ω is 16.9 kΩ", () => {
    // [PUB: IEC 60063:2015, E96 list (16.5, 16.9, 17.4); FORMULA: nearest in ratio]
    expect(nearestStandard(16834.2, "E96", "nearest")).toBe(16900);
  });
  it("1b E24 nearest to 319 Ω is 330 Ω", () => {
    // [PUB: IEC 60063:2015, E24 list (300, 330); FORMULA]
    expect(nearestStandard(319, "E24", "nearest")).toBe(330);
  });
  it("1c E96 smallest value ≥ 184 Ω is 187 Ω", () => {
    // [PUB: IEC 60063:2015, E96 list (182, 187)]
    expect(nearestStandard(184, "E96", "ceil")).toBe(187);
  });
  it("1d E24 around 5000 Ω: neighbours 4.7 k / 5.1 k / 5.6 k, log-nearest 5.1 k", () => {
    // [PUB: IEC 60063:2015, E24 list (4.7, 5.1, 5.6); FORMULA (log-nearest)]
    expect(nearestStandard(5000, "E24", "floor")).toBe(4700);
    expect(nearestStandard(5000, "E24", "ceil")).toBe(5100);
    expect(nearestStandard(5100 * 1.0001, "E24", "ceil")).toBe(5600);
    expect(nearestStandard(5000, "E24", "nearest")).toBe(5100);
  });
  it("1e E24 2.848 kΩ is log-nearest 3.0 kΩ (linear-nearest would be 2.7 kΩ)", () => {
    // [FORMULA: IEC 60063 list]
    expect(nearestStandard(2848, "E24", "nearest")).toBe(3000);
    // the geometric boundary √(2.7·3.0) = 2.846 k: just below it, 2.7 k
    expect(nearestStandard(2845, "E24", "nearest")).toBe(2700);
  });
  it("1f E12 4.29 kΩ is log-nearest 4.7 kΩ (linear-nearest would be 3.9 kΩ)", () => {
    // [FORMULA]
    expect(nearestStandard(4290, "E12", "nearest")).toBe(4700);
    expect(nearestStandard(4280, "E12", "nearest")).toBe(3900);
  });
  it("1g 3.3 A, 100 mV: R_max 30.30 mΩ; floor E24 30 mΩ, E96 30.1 mΩ, E12 27 mΩ", () => {
    // [FORMULA]
    near(sel(3.3, 0.1, "E24").idealShunt, 30.30e-3);
    near(sel(3.3, 0.1, "E24").standardShunt, 30e-3);
    near(sel(3.3, 0.1, "E96").standardShunt, 30.1e-3);
    near(sel(3.3, 0.1, "E12").standardShunt, 27e-3);
  });
  it("1h 3.3 A through 30 mΩ: 99.00 mV, 326.7 mW", () => {
    // [FORMULA]
    const v = sel(3.3, 0.1, "E24");
    near(v.burdenAtFullScale, 99.0e-3);
    near(v.shuntPower, 326.7e-3);
    near(2 * (v.shuntPower as number), 0.6534);
  });
  it("1i 3.3 µA, 10 mV: R_max 3.030 kΩ; E24 3.0 kΩ (9.900 mV), E96 3.01 kΩ (9.933 mV)", () => {
    // [FORMULA]
    const e24 = sel(3.3e-6, 10e-3, "E24");
    near(e24.idealShunt, 3.030e3);
    near(e24.standardShunt, 3.0e3);
    near(e24.burdenAtFullScale, 9.900e-3);
    const e96 = sel(3.3e-6, 10e-3, "E96");
    near(e96.standardShunt, 3.01e3);
    near(e96.burdenAtFullScale, 9.933e-3);
  });
  it("1j three-range front end: 33.00 mV burden at full scale; 108.9 nW / µW / mW", () => {
    // [CP design; FORMULA]
    for (const [imax, shunt, power] of [
      [3.3e-6, 10e3, 108.9e-9],
      [3.3e-3, 10, 108.9e-6],
      [3.3, 10e-3, 108.9e-3],
    ]) {
      const v = sel(imax, 33e-3, "E24");
      near(v.standardShunt, shunt);
      near(v.burdenAtFullScale, 33.0e-3);
      near(v.shuntPower, power);
    }
  });
});

describe("§2 burden voltage", () => {
  it("2b 3.3 V, 1 kΩ, 10 Ω: 3.300 mA → 3.267 mA, −0.9901 %, 32.67 mV", () => {
    // [FORMULA]
    const v = sb(3.3, 1000, 10);
    near(v.trueCurrent, 3.300e-3);
    near(v.indicatedCurrent, 3.267e-3);
    near(v.loadingErrorPercent, -0.9901);
    near(v.burdenVoltage, 32.67e-3);
  });
  it("2c 1.8 V, 100 Ω, 10 Ω: 18.00 mA → 16.36 mA, −9.091 %", () => {
    // [FORMULA]
    const v = sb(1.8, 100, 10);
    near(v.trueCurrent, 18.0e-3);
    near(v.indicatedCurrent, 16.36e-3);
    near(v.loadingErrorPercent, -9.091);
  });
  it("2d 3.0 V, 8 Ω, 1.8 Ω: 375.0 mA → 306.1 mA, −18.37 %, 551.0 mV", () => {
    // [FORMULA; REF: mathjs] V_B is the loaded current times R_in (675 mV, the unloaded 375 mA times 1.8 Ω, is the slip to avoid)
    near(ev("3.0 V / (8 ohm + 1.8 ohm)", "mA"), 306.1);
    near(ev("3.0 V / (8 ohm + 1.8 ohm) * 1.8 ohm", "mV"), 551.0);
    const v = sb(3.0, 8, 1.8);
    near(v.trueCurrent, 375.0e-3);
    near(v.indicatedCurrent, 306.1e-3);
    near(v.loadingErrorPercent, -18.37);
    near(v.burdenVoltage, 551.0e-3);
  });
});

describe("§3 range choice (the teaching meter)", () => {
  it("3g 500 nA: 5 µA range, 0.2500 V, code 1638", () => {
    // [FORMULA] 500 nA × 5·10⁵ V/A = 0.25 V; ⌊0.25 × 16384 / 2.5⌋ = ⌊1638.4⌋
    const v = rr(500e-9);
    expect(v.bestRange).toBe("5 µA");
    near(v.outputVoltage, 0.25);
    expect(v.adcCode).toBe(1638);
  });
  it("3h 2.000 mA: 50 mA range, 0.1000 V (the 5 µA and 500 µA ranges would saturate)", () => {
    // [FORMULA] 2 mA × 5·10³ V/A = 10 V ≥ 2.5 V; 2 mA × 50 V/A = 0.1 V
    const v = rr(2e-3);
    expect(v.bestRange).toBe("50 mA");
    near(v.outputVoltage, 0.1);
    const t = rangeTable({ current: 2e-3, ...meter });
    expect(t.rows.map((r) => r.saturated)).toEqual([true, true, false, false]);
  });
  it("3i 5.000 µA: the 5 µA range saturates (2.5 V ≥ 2.49985 V) → 500 µA range, 25.00 mV, 163 codes", () => {
    // [FORMULA] top code voltage (2^14 − 1) × 2.5 V / 2^14 = 2.499847 V; ⌊0.025 × 6553.6⌋ = ⌊163.84⌋
    const t = rangeTable({ current: 5e-6, ...meter });
    near(t.topVoltage, 2.499847, 5e-6);
    expect(t.rows[0].saturated).toBe(true);
    const v = rr(5e-6);
    expect(v.bestRange).toBe("500 µA");
    near(v.outputVoltage, 25e-3);
    expect(v.adcCode).toBe(163);
  });
  it("3j 0.6 mA: 50 mA range; 30.00 mV = 196.6 LSB → code 196 → 598.1 µA", () => {
    // [FORMULA] 0.6 mA × 50 V/A = 30 mV; 30 mV / 152.5879 µV = 196.608; 196 × 3.0518 µA = 598.14 µA
    const v = rr(0.6e-3);
    expect(v.bestRange).toBe("50 mA");
    near(v.outputVoltage, 30e-3);
    near((v.outputVoltage as number) / LSB14, 196.608);
    expect(v.adcCode).toBe(196);
    near((v.adcCode as number) * (v.currentResolution as number), 598.14e-6);
  });
});

describe("§3 converter quantisation (the teaching meter)", () => {
  it("3k 14 bit, 2.5 V: LSB 152.59 µV, 16384 levels, q/√12 44.05 µV, ideal SNR 86.04 dB", () => {
    // [FORMULA: IEEE Std 1241-2010 ideal quantiser; REF: mathjs]
    near(ev("2.5 V / 2^14", "uV"), 152.59);
    near(ev("2.5 V / 2^14 / sqrt(12)", "uV"), 44.048);
    near(ev("20 * log10(2^14 * sqrt(1.5))"), 86.04);
    near(rr(0.2).currentResolution, 61.035e-6); // 1 A range, 2.5 V/A: 152.59 µV / 2.5 V/A
    expect(rr(0.2).adcCode).toBe(3276); // ⌊0.5 × 6553.6⌋
    expect(2 ** 14).toBe(16384);
  });
  it("3g–3k current per code: 305.18 pA, 30.518 nA, 3.0518 µA, 61.035 µA", () => {
    // [FORMULA] 152.5879 µV over 5·10⁵, 5·10³, 50 and 2.5 V/A
    near(rr(500e-9).currentResolution, 305.18e-12);
    near(rr(5e-6).currentResolution, 30.518e-9);
    near(rr(2e-3).currentResolution, 3.0518e-6);
    near(rr(0.2).currentResolution, 61.035e-6);
  });
});

describe("§5 bipolar mode (12 bit, 3.3 V, 1.650 V offset)", () => {
  it("5a nA range, code 3000: 2.417 V → +767.0 nA (forgetting the offset: 2417 nA)", () => {
    // [FORMULA]
    const vout = 3000 * LSB12;
    near(vout, 2.417);
    near(bid(vout, 1e6).signedCurrent, 767.0e-9);
    near(vout / 1e6, 2417e-9);
  });
  it("5b nA range, code 1000: 0.8057 V → −844.3 nA", () => {
    // [FORMULA]
    near(bid(1000 * LSB12, 1e6).signedCurrent, -844.3e-9);
  });
  it("5c nA range, code 2048: I = 0", () => {
    // [FORMULA]
    expect(Math.abs(bid(2048 * LSB12, 1e6).signedCurrent as number)).toBeLessThan(1e-15);
  });
  it("5d µA range, −1.000 mA: 0.6500 V", () => {
    // [FORMULA]
    near(bid(0.65, 1e3).signedCurrent, -1.0e-3);
    expect(Math.floor(0.65 / LSB12)).toBe(806);
  });
  it("5e µA range, code 4095: +1.649 mA", () => {
    // [FORMULA]
    near(bid(4095 * LSB12, 1e3).signedCurrent, 1.649e-3);
    near(bid(4095 * LSB12, 1e3).maxPositiveCurrent, 1.65e-3);
    near(bid(4095 * LSB12, 1e3).maxNegativeCurrent, -1.65e-3);
  });
});

describe("§6 RC filter", () => {
  it("6a 10 kΩ, 100 nF: τ 1.000 ms, f_c 159.2 Hz, t1% 4.605 ms, B_n 250.0 Hz", () => {
    // [FORMULA; MEM]
    const v = fn(10e3, 100e-9, 10e3, 300);
    near(v.timeConstant, 1.0e-3);
    near(v.cutoffFrequency, 159.2);
    near(v.settlingTime1pct, 4.605e-3);
    near(v.noiseBandwidth, 250.0);
  });
  it("6b 1 kΩ, 10 µF: τ 10.00 ms, f_c 15.92 Hz, t1% 46.05 ms", () => {
    // [FORMULA]
    const v = fn(1e3, 10e-6, 1e3, 300);
    near(v.timeConstant, 10.0e-3);
    near(v.cutoffFrequency, 15.92);
    near(v.settlingTime1pct, 46.05e-3);
  });
  it("6f B_n / f_c = 1.571 (π/2)", () => {
    // [FORMULA: B_n = ∫₀^∞ df/(1 + (f/f_c)²) = (π/2)·f_c] summed here numerically over the power response
    // (f in units of f_c, midpoint rule to 1000·f_c, the tail beyond it ≈ 1/1000 − 1/(3·1000³))
    const top = 1000;
    const steps = 1_000_000;
    const df = top / steps;
    let sum = 0;
    for (let i = 0; i < steps; i++) {
      const f = (i + 0.5) * df;
      sum += df / (1 + f * f);
    }
    sum += 1 / top - 1 / (3 * top ** 3);
    near(sum, 1.570796, 1e-6);
    const v = fn(4.7e3, 33e-9, 1e3, 300);
    near((v.noiseBandwidth as number) / (v.cutoffFrequency as number), 1.570796, 1e-6);
  });
});

describe("§7 thermal noise (B_n set by the filter: B_n = 1/(4RC))", () => {
  it("7a 1 kΩ, 300 K, 1 Hz: 4.070 nV/√Hz, 4.070 pA/√Hz", () => {
    // [FORMULA: SI 2019 k; MEM: widely tabulated "≈4 nV/√Hz per kΩ"]
    const v = fn(1e3, 250e-6, 1e3, 300);
    near(v.noiseBandwidth, 1);
    near(v.thermalNoiseVoltage, 4.070e-9);
    near(v.thermalNoiseCurrent, 4.070e-12);
  });
  it("7b 1 kΩ, 290 K, 10 kHz: 400.2 nV rms", () => {
    // [FORMULA: √(4kTRB), SI 2019 k; REF: mathjs (its Boltzmann constant and units)]
    near(ev("sqrt(4 * boltzmann * 290 K * 1 kohm * 10 kHz)", "nV"), 400.2);
    const v = fn(1e3, 25e-9, 1e3, 290);
    near(v.noiseBandwidth, 10e3);
    near(v.thermalNoiseVoltage, 400.2e-9);
  });
  it("7c 100 kΩ, 300 K, 1 MHz: 40.70 µV rms", () => {
    // [FORMULA: √(4kTRB), SI 2019 k; REF: mathjs]
    near(ev("sqrt(4 * boltzmann * 300 K * 100 kohm * 1 MHz)", "uV"), 40.70);
    const v = fn(1e3, 250e-12, 100e3, 300);
    near(v.noiseBandwidth, 1e6);
    near(v.thermalNoiseVoltage, 40.70e-6);
  });
  it("7d 1 MΩ, 300 K, 1 Hz: 128.7 nV/√Hz, 0.1287 pA/√Hz", () => {
    // [FORMULA]
    const v = fn(1e3, 250e-6, 1e6, 300);
    near(v.thermalNoiseVoltage, 128.7e-9);
    near(v.thermalNoiseCurrent, 0.1287e-12);
  });
  it("7e 10 kΩ shunt, 300 K, B_n 250 Hz: 203.5 nV = 20.35 pA rms", () => {
    // [FORMULA]
    const v = fn(10e3, 100e-9, 10e3, 300);
    near(v.thermalNoiseVoltage, 203.5e-9);
    near(v.thermalNoiseCurrent, 20.35e-12);
  });
});

describe("§8 duty-cycled loads", () => {
  const mAh = 3.6;
  it("8a 20 mA for 10 ms every 1 s, 2 µA sleep: 202.0 µA, 200.0 µC; unweighted 10.00 mA = 49.51×", () => {
    // [FORMULA]
    const v = duty({ sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 220 * mAh, usableFraction: 0.8 });
    near(v.averageCurrent, 202.0e-6);
    near(v.chargePerWake, 200.0e-6);
    near((20e-3 + 2e-6) / 2 / (v.averageCurrent as number), 49.51);
  });
  it("8b 8a with 220 mAh, η = 0.8: 871.4 h = 36.31 d", () => {
    // [FORMULA]
    const v = duty({ sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 220 * mAh, usableFraction: 0.8 });
    near(v.batteryLife, 871.4 * 3600);
    near(v.batteryLife, 36.31 * 86400);
  });
  it("8c 25 mA for 5 ms every 10 s, 3 µA; 220 mAh, η 0.8: 15.50 µA, 1.136e4 h = 473.2 d", () => {
    // [FORMULA]
    const v = duty({ sleepCurrent: 3e-6, activeCurrent: 25e-3, activeTime: 5e-3, period: 10, batteryCapacity: 220 * mAh, usableFraction: 0.8 });
    near(v.averageCurrent, 15.50e-6);
    near(v.batteryLife, 1.136e4 * 3600);
    near(v.batteryLife, 473.2 * 86400);
  });
  it("8d 1000 mAh; 10 mA active 1 %, 20 µA sleep: 0.1198 mA, 8347 h", () => {
    // [FORMULA: Ī = duty-weighted mean, t = capacity/Ī; REF: mathjs (units mAh, mA, h)]
    near(ev("0.01 * 10 mA + 0.99 * 20 uA", "mA"), 0.1198);
    near(ev("1000 mAh / (0.01 * 10 mA + 0.99 * 20 uA)", "h"), 8347);
    const v = duty({ sleepCurrent: 20e-6, activeCurrent: 10e-3, activeTime: 0.01, period: 1, batteryCapacity: 1000 * mAh, usableFraction: 1 });
    near(v.averageCurrent, 0.1198e-3);
    near(v.batteryLife, 8347 * 3600);
  });
  it("8e 2200 mAh; 40 mA for 2 s, 0.1 mA for 8 s: 8.080 mA, 272.3 h", () => {
    // [FORMULA; REF: mathjs (units mAh, mA, h)]
    near(ev("(2 s * 40 mA + 8 s * 0.1 mA) / 10 s", "mA"), 8.080);
    near(ev("2200 mAh / ((2 s * 40 mA + 8 s * 0.1 mA) / 10 s)", "h"), 272.3);
    const v = duty({ sleepCurrent: 0.1e-3, activeCurrent: 40e-3, activeTime: 2, period: 10, batteryCapacity: 2200 * mAh, usableFraction: 1 });
    near(v.averageCurrent, 8.080e-3);
    near(v.batteryLife, 272.3 * 3600);
  });
});

describe("§9 GUM uncertainty", () => {
  it("9a bounds 7…10 (a = 1.5), rectangular: u = 0.8660", () => {
    // [PUB: Eurachem/CITAC "Quantifying Uncertainty in Analytical Measurement", App. E.1 example (0.87)]
    // a reading of 8.5 V bounded by ±1.5 V (one count of 1.5 V) across an exact 1 Ω shunt
    const v = unc({ reading: 8.5, readingAccuracyPercent: 0, readingCounts: 1, countSize: 1.5, shuntResistance: 1, shuntTolerancePercent: 0, coverageFactor: 2 });
    near(v.combinedStandardUncertainty, 0.8660);
  });
  const p9b = { reading: 1.0, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 1e-3, shuntResistance: 10, shuntTolerancePercent: 1, coverageFactor: 2 };
  it("9b 1.000 V ±(0.5 % + 2 counts of 1 mV), 10.00 Ω ±1 %: I 100.0 mA, u_c,r 0.7047 %, u_c 0.7047 mA, U 1.409 mA", () => {
    // [FORMULA: GUM 4.3.7, 5.1.6, 6.2]
    const b = uncertaintyBudget(p9b);
    near(b.readingBound, 7.0e-3);
    near(b.readingStandard, 4.041e-3);
    near(100 * b.relReading, 0.4041);
    near(100 * b.relShunt, 0.5774);
    const v = unc(p9b);
    near(v.current, 100.0e-3);
    near(v.relativeStandardUncertaintyPercent, 0.7047);
    near(v.combinedStandardUncertainty, 0.7047e-3);
    near(v.expandedUncertainty, 1.409e-3);
  });
  it("9c 9b plus a separate resolution term δ/(2√3): u(V) 4.052 mV, u_c,r 0.7053 %, U 1.411 mA", () => {
    // [FORMULA]
    const b = uncertaintyBudget(p9b, { resolutionTerm: true });
    near(b.readingStandard, 4.052e-3);
    near(100 * b.relCombined, 0.7053);
    near(b.expanded, 1.411e-3);
  });
  it("9d 50.0 mV ±(0.5 % + 2 × 0.1 mV), 0.100 Ω ±1 %: a_V 0.4500 mV, u_r(V) 0.5196 %, I 500.0 mA, u_c,r 0.7767 %, U 7.767 mA", () => {
    // [FORMULA]
    const p = { reading: 50e-3, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 0.1e-3, shuntResistance: 0.1, shuntTolerancePercent: 1, coverageFactor: 2 };
    const b = uncertaintyBudget(p);
    near(b.readingBound, 0.45e-3);
    near(100 * b.relReading, 0.5196);
    const v = unc(p);
    near(v.current, 500.0e-3);
    near(v.relativeStandardUncertaintyPercent, 0.7767);
    near(v.expandedUncertainty, 7.767e-3);
  });
  it("9e wrong method (linear sum of bounds) for 9b: 1.700 %, and the grader names it", () => {
    // [FORMULA]
    const cands = templates.uncertainty.mistakes(p9b, "expandedUncertainty");
    const linear = cands.filter((c) => c.key === "linear-sum").map((c) => c.value as number);
    expect(linear.some((x) => Math.abs(x / 1.7e-3 - 1) < 5e-4)).toBe(true);
  });
});

describe("bench bands: instrument accuracy on the quantities actually read (worked by hand)", () => {
  // Worst-case first-order propagation, Σ|∂q/∂r_i|·Δr_i, as in JCGM 100:2008 (GUM) §5.1.2 with worst-case
  // (linear) instead of quadrature summation; the arithmetic below is done by hand.
  const policy = { relativeTolerance: 0.0001, instrumentAccuracyPercent: 0.5 };

  it("loading error from two current readings, each ±0.5 %: about ±1 percentage point, not ±0.005", () => {
    // V_s = 3.3 V, R_L = 1 kΩ, R_sh = 10 Ω (no component tolerances given)
    // I_true = 3.3 mA, I_meas = 3.3/1010 = 3.267327 mA, ε = 100·(I_meas − I_true)/I_true = −0.990099 %
    // ∂ε/∂I_meas · ΔI_meas = (100/I_true)·0.005·I_meas = 0.5·(I_meas/I_true) = 0.5·0.990099 = 0.495050
    // ∂ε/∂I_true · ΔI_true = (100·I_meas/I_true²)·0.005·I_true = 0.495050  → half-width 0.990099 points
    const r = gradeAttempt({
      template: "shunt-burden",
      params: { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 },
      questions: [{ quantity: "loadingErrorPercent", kind: "bench", points: 1 }],
      readings: ["-0.99 %"],
      policy,
    }).results[0];
    expect(r.band![1] - r.band![0]).toBeCloseTo(2 * 0.990099, 5);
    expect(r.feedback).toMatch(/I_meas, I_true/);
    // a student whose two readings were each 0.4 % off in opposite directions: ε = 100·(1.004·I_meas/(0.996·I_true) − 1) = −0.1948 %
    const off = gradeAttempt({
      template: "shunt-burden",
      params: { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 },
      questions: [{ quantity: "loadingErrorPercent", kind: "bench", points: 1 }],
      readings: ["-0.195 %"],
      policy,
    }).results[0];
    expect(off.verdict).toBe("correct");
  });

  it("signed current from the output voltage read ±0.5 %: ΔI = 0.005·V_out/S", () => {
    // V_off = 1.65 V (given), S = 10 V/A (given), V_out = 2.1 V read: I = (2.1 − 1.65)/10 = 45 mA
    // ΔI = 0.005 · 2.1 V / 10 V/A = 1.05 mA (the old band, 0.5 % of 45 mA, was 0.225 mA)
    const r = gradeAttempt({
      template: "bidirectional-offset",
      params: { offsetVoltage: 1.65, sensitivity: 10, outputVoltage: 2.1, fullScaleVoltage: 3.3 },
      questions: [{ quantity: "signedCurrent", kind: "bench", points: 1 }],
      readings: ["45 mA"],
      policy,
    }).results[0];
    expect((r.band![1] - r.band![0]) / 2).toBeCloseTo(1.05e-3, 9);
    expect(r.band![0]).toBeCloseTo(0.045 - 1.05e-3, 9);
  });

  it("a quantity read directly keeps ±0.5 % of itself: burden voltage 32.67 mV → ±0.163 mV", () => {
    // V_B = 3.267327 mA · 10 Ω = 32.67327 mV; 0.5 % of it = 0.163366 mV
    const r = gradeAttempt({
      template: "shunt-burden",
      params: { supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 },
      questions: [{ quantity: "burdenVoltage", kind: "bench", points: 1 }],
      readings: ["32.67 mV"],
      policy,
    }).results[0];
    expect((r.band![1] - r.band![0]) / 2).toBeCloseTo(0.163366e-3, 8);
  });
});
