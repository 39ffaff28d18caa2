// The built-in instrument profiles worked by hand, range by range: burden, resolution and the accuracy band
// of one reading. Every check value was worked on paper from the formula named beside it:
//   burden        V_b = R_in × I (Ohm's law), or the stated burden at full scale scaled by I / I_FS
//   resolution    counts: I_FS / N;  converter: Q = V_ref / 2^N (IEEE Std 1241, ideal code width), over S V/A
//   accuracy      ±(a % × |reading| + n × resolution + b % × I_FS), the stated limits; u = a / √3 (GUM 4.3.7)
import { describe, expect, it } from "vitest";
import {
  accuracyBand,
  autoRangeIndex,
  bestRangeIndex,
  burdenAtFullScale,
  burdenVolts,
  converterCode,
  hysteresisFault,
  inputResistance,
  outputAtFullScale,
  outputVolts,
  resolutionAmps,
  standardUncertainty,
  type InstrumentProfile,
} from "../../../lib/instruments/profile";
import { LIBRARY, benchMultimeter, copyOfLibrary, feedbackAmmeter, handheldMultimeter, libraryInstrument, teachingMeter } from "../../../lib/instruments/library";
import { near } from "../grader/helpers";

const range = (p: InstrumentProfile, key: string) => {
  const r = p.ranges.find((x) => x.key === key);
  if (!r) throw new Error(`no range ${key}`);
  return r;
};

describe("teaching meter (14 bit on 2.5 V, gain 50, shunts 10 kΩ / 100 Ω / 1 Ω / 50 mΩ)", () => {
  // Q = 2.5 V / 2^14 = 2.5 / 16384 V = 152.587890625 µV (IEEE Std 1241, ideal code width)
  const Q = 152.587890625e-6;
  it("every range gives 2.5 V at full scale (S × I_FS, S = R_sh × 50)", () => {
    for (const r of teachingMeter.ranges) near(outputAtFullScale(r), 2.5);
  });
  it("5 µA range: burden 50 mV at full scale, 20 mV at 2 µA; 305.2 pA per code; 2 µA read ±11.22 nA", () => {
    const r = range(teachingMeter, "r5u");
    near(burdenAtFullScale(r), 50e-3); // 10 kΩ × 5 µA = 50 mV (Ohm's law)
    near(burdenVolts(r, 2e-6), 20e-3); // 10 kΩ × 2 µA = 20 mV (Ohm's law)
    near(resolutionAmps(r), 305.17578125e-12); // Q / S = 152.587890625 µV / (5 × 10^5 V/A) (IEEE Std 1241)
    const b = accuracyBand(r, 2e-6);
    // 0.5 % × 2 µA = 10 nA; 4 codes × 305.17578 pA = 1.2207031 nA; sum 11.2207031 nA (stated limits)
    near(b.halfWidth, 11.2207031e-9);
    near(b.low, 2e-6 - 11.2207031e-9);
    // u = 11.2207031 nA / √3 = 6.478274 nA (GUM 4.3.7, rectangular)
    near(standardUncertainty(r, 2e-6), 6.478274e-9);
  });
  it("500 µA range: 50 mV; 30.52 nA per code; 300 µA read ±811.0 nA", () => {
    const r = range(teachingMeter, "r500u");
    near(burdenAtFullScale(r), 50e-3); // 100 Ω × 500 µA (Ohm's law)
    near(resolutionAmps(r), Q / 5000); // 152.5879 µV / 5000 V/A = 30.517578 nA (IEEE Std 1241)
    near(resolutionAmps(r), 30.517578e-9);
    // 0.25 % × 300 µA = 750 nA; 2 × 30.517578 nA = 61.035156 nA; sum 811.035156 nA
    near(accuracyBand(r, 300e-6).halfWidth, 811.035156e-9);
  });
  it("50 mA range: 50 mV; 3.052 µA per code; 20 mA read ±56.10 µA", () => {
    const r = range(teachingMeter, "r50m");
    near(burdenAtFullScale(r), 50e-3); // 1 Ω × 50 mA
    near(resolutionAmps(r), 3.0517578e-6); // 152.5879 µV / 50 V/A
    near(accuracyBand(r, 20e-3).halfWidth, 56.103516e-6); // 50 µA + 2 × 3.0517578 µA
  });
  it("1 A range: 50 mV; 61.04 µA per code; 0.5 A read ±2.622 mA", () => {
    const r = range(teachingMeter, "r1");
    near(burdenAtFullScale(r), 50e-3); // 50 mΩ × 1 A
    near(inputResistance(r), 0.05);
    near(resolutionAmps(r), 61.035156e-6); // 152.5879 µV / 2.5 V/A
    near(accuracyBand(r, 0.5).halfWidth, 2.6220703e-3); // 0.5 % × 0.5 A = 2.5 mA + 2 × 61.035156 µA
  });
  it("output and truncating code, one way and both ways around the 1.25 V offset", () => {
    const r = range(teachingMeter, "r5u");
    near(outputVolts(teachingMeter, r, 2e-6), 1.0); // 5 × 10^5 V/A × 2 µA
    expect(converterCode(r, 1.0)).toBe(6553); // ⌊1.0 × 16384 / 2.5⌋ = ⌊6553.6⌋ (IEEE Std 1241, truncating quantiser)
    near(outputVolts(teachingMeter, r, 2e-6, true), 2.25); // 1.25 V + 1.0 V
    expect(converterCode(r, 2.25)).toBe(14745); // ⌊2.25 × 16384 / 2.5⌋ = ⌊14745.6⌋
    near(outputVolts(teachingMeter, r, -2e-6, true), 0.25); // 1.25 V − 1.0 V
    expect(converterCode(r, 0.25)).toBe(1638); // ⌊1638.4⌋
    expect(converterCode(r, 2.6)).toBe(16383); // clipped to the top code 2^14 − 1
  });
  it("best range: the most sensitive one that holds the current; both ways halves each full scale", () => {
    expect(bestRangeIndex(teachingMeter, 3e-6)).toBe(0); // 3 µA < 5 µA
    expect(bestRangeIndex(teachingMeter, 3e-6, true)).toBe(1); // both ways the 5 µA range holds ±2.5 µA only
    expect(bestRangeIndex(teachingMeter, -2e-6, true)).toBe(0);
    expect(bestRangeIndex(teachingMeter, 0.2)).toBe(3);
    expect(bestRangeIndex(teachingMeter, 1.5)).toBe(-1);
  });
  it("auto-ranging with hysteresis: up above 90 % of full scale, down below 0.8 %", () => {
    expect(hysteresisFault(teachingMeter)).toBe(-1); // 0.008 × 100 = 0.8 < 0.9 and 0.008 × 20 = 0.16 < 0.9
    expect(autoRangeIndex(teachingMeter, 4.6e-6, 0)).toBe(1); // 4.6 µA > 0.9 × 5 µA = 4.5 µA: up
    expect(autoRangeIndex(teachingMeter, 4.4e-6, 1)).toBe(1); // 4.4 µA > 0.008 × 500 µA = 4 µA: stays (hysteresis)
    expect(autoRangeIndex(teachingMeter, 3.9e-6, 1)).toBe(0); // 3.9 µA < 4 µA: down
    expect(autoRangeIndex(teachingMeter, 4.4e-6, 0)).toBe(0); // 4.4 µA < 4.5 µA: stays
    expect(autoRangeIndex(teachingMeter, 4.4e-6)).toBe(1); // from the top: 1 A → 50 mA → 500 µA, 4.4 µA > 4 µA stops
    expect(autoRangeIndex(teachingMeter, 1e-6)).toBe(0); // 1 µA < 4 µA: on down to 5 µA
    // thresholds without hysteresis: 0.01 × 100 = 1.0 ≥ 0.9 at the switch from 500 µA down to 5 µA
    expect(hysteresisFault({ ...teachingMeter, autoRange: { upAtFractionOfFullScale: 0.9, downAtFractionOfFullScale: 0.01, settlingSeconds: 0 } })).toBe(1);
  });
});

describe("handheld multimeter (6000 counts, stated burden)", () => {
  it("per range: burden, input resistance, resolution and one reading's band", () => {
    const cases = [
      // key, burden at I, I, R_in = V_b / I_FS, resolution I_FS / N, reading, half-width
      ["r600u", 45e-3, 300e-6, 150, 0.1e-6, 250e-6, 2.8e-6], // 0.09 V × 300/600; 0.09 / 600 µA; 600 µA / 6000; 1 % × 250 µA + 3 × 0.1 µA
      ["r6m", 45e-3, 3e-3, 15, 1e-6, 5e-3, 53e-6], // 0.09 V / 2; 0.09 / 6 mA; 6 mA / 6000; 50 µA + 3 µA
      ["r60m", 0.1e0, 40e-3, 2.5, 10e-6, 40e-3, 510e-6], // 0.15 × 40/60; 0.15 / 60 mA; 60 mA / 6000; 1.2 % × 40 mA = 480 µA + 30 µA
      ["r600m", 0.1, 100e-3, 1, 100e-6, 100e-3, 1.5e-3], // 0.6 × 100/600; 0.6 / 0.6 A; 0.6 A / 6000; 1.2 mA + 0.3 mA
      ["r10", 0.1, 2, 0.05, 10e-3, 2, 90e-3], // 0.5 × 2/10; 0.5 / 10 A; 10 A / 1000; 2 % × 2 A = 40 mA + 5 × 10 mA
    ] as const;
    for (const [key, vb, i, rin, res, reading, half] of cases) {
      const r = range(handheldMultimeter, key);
      near(burdenVolts(r, i), vb);
      near(inputResistance(r), rin);
      near(resolutionAmps(r), res);
      near(accuracyBand(r, reading).halfWidth, half);
    }
  });
});

describe("bench multimeter (200 000 counts, known shunts)", () => {
  it("per range: burden at full scale, resolution and one reading's band", () => {
    const cases = [
      // key, R_sh × I_FS, I_FS / 200 000, reading, a % × reading + b % × I_FS
      ["r200u", 0.1, 1e-9, 100e-6, 60e-9], // 500 Ω × 200 µA; 0.05 % × 100 µA = 50 nA + 0.005 % × 200 µA = 10 nA
      ["r2m", 0.1, 10e-9, 1e-3, 600e-9], // 50 Ω × 2 mA; 500 nA + 100 nA
      ["r20m", 0.1, 100e-9, 10e-3, 6e-6], // 5 Ω × 20 mA; 5 µA + 1 µA
      ["r200m", 0.1, 1e-6, 150e-3, 85e-6], // 0.5 Ω × 200 mA; 75 µA + 10 µA
      ["r2", 0.2, 10e-6, 1.5, 1.7e-3], // 0.1 Ω × 2 A; 0.1 % × 1.5 A = 1.5 mA + 0.01 % × 2 A = 0.2 mA
    ] as const;
    for (const [key, vb, res, reading, half] of cases) {
      const r = range(benchMultimeter, key);
      near(burdenAtFullScale(r), vb);
      near(resolutionAmps(r), res);
      near(accuracyBand(r, reading).halfWidth, half);
    }
  });
});

describe("feedback ammeter (virtual ground, 2 V at full scale, 20 000 counts)", () => {
  it("per range: feedback resistor, 200 µV burden, resolution and one reading's band", () => {
    const cases = [
      // key, R_f = 2 V / I_FS, I_FS / 20 000, reading, a % × reading + n × resolution
      ["r2n", 1e9, 0.1e-12, 1e-9, 6e-12], // 0.5 % × 1 nA = 5 pA + 10 × 0.1 pA
      ["r20n", 100e6, 1e-12, 10e-9, 35e-12], // 0.3 % × 10 nA = 30 pA + 5 pA
      ["r200n", 10e6, 10e-12, 100e-9, 250e-12], // 200 pA + 50 pA
      ["r2u", 1e6, 100e-12, 1e-6, 2.5e-9], // 2 nA + 0.5 nA
      ["r20u", 100e3, 1e-9, 10e-6, 25e-9], // 20 nA + 5 nA
      ["r200u", 10e3, 10e-9, 100e-6, 150e-9], // 0.1 % × 100 µA = 100 nA + 50 nA
      ["r2m", 1e3, 100e-9, 1e-3, 1.5e-6], // 1 µA + 0.5 µA
    ] as const;
    for (const [key, rf, res, reading, half] of cases) {
      const r = range(feedbackAmmeter, key);
      near(r.feedbackOhms, rf);
      near(outputAtFullScale(r), 2);
      near(burdenAtFullScale(r), 200e-6);
      near(burdenVolts(r, reading), (200e-6 * reading) / r.fullScale); // stated burden scaled by I / I_FS
      near(resolutionAmps(r), res);
      near(accuracyBand(r, reading).halfWidth, half);
    }
  });
});

describe("the library", () => {
  it("holds four profiles, ranges ordered from the smallest full scale up, each with real hysteresis", () => {
    expect(LIBRARY.map((i) => i.libraryKey)).toEqual(["teaching-meter", "handheld-multimeter", "bench-multimeter", "feedback-ammeter"]);
    for (const p of LIBRARY) {
      for (let k = 1; k < p.ranges.length; k++) expect(p.ranges[k].fullScale).toBeGreaterThan(p.ranges[k - 1].fullScale);
      expect(hysteresisFault(p)).toBe(-1);
      expect(new Set(p.ranges.map((r) => r.key)).size).toBe(p.ranges.length);
    }
  });
  it("a copy is a deep copy without the library key", () => {
    const c = copyOfLibrary("teaching-meter")!;
    expect("libraryKey" in c).toBe(false);
    c.ranges[0].fullScale = 1;
    expect(libraryInstrument("teaching-meter")!.ranges[0].fullScale).toBe(5e-6);
    expect(copyOfLibrary("nope")).toBeUndefined();
  });
});
