// Statistics of the simulated bench from the module itself, checked against models worked here (sources beside
// each). PHYSICS.md §2 (burden), §3 (auto-ranging), §4 (quantisation), §6 (settling), §7 (thermal noise), §16.
import { describe, expect, it } from "vitest";
import { simulateReadings, type BenchCircuit, type SimReading } from "@/lib/simulation";
import { templates } from "@/lib/grader";
import { autoMeter, countsMeter, feedbackMeter, fineSamplingMeter, loggerMeter, settlingMeter } from "./instruments";

/** Boltzmann constant, J/K: exact by definition (SI Brochure, 9th edition, 2019). */
const K_B = 1.380649e-23;
const T = 300;

const values = (rs: SimReading[]) => rs.map((r) => r.value as number);
const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
const std = (xs: number[]) => {
  const m = mean(xs);
  return Math.sqrt(xs.reduce((a, b) => a + (b - m) ** 2, 0) / (xs.length - 1));
};

describe("burden: the mean of 10,000 readings", () => {
  // PHYSICS.md §19 19a: 2 mA range of 2000 counts, 200 mV at full scale: R_in = 0.2 V / 2 mA = 100 Ω `[FORMULA: PHYSICS.md §2]`
  const circuit: BenchCircuit = { supplyVoltage: 3.3, loadResistance: 2200 };
  const unloaded = 3.3 / 2200; // 1.500 mA
  const loaded = 3.3 / (2200 + 100); // 1.434783 mA, ε = −4.348 % `[FORMULA: I_meas = V_s/(R_L + R_in)]`
  const step = 2e-3 / 2000; // 1 µA
  const bandOf = (i: number) => 0.005 * i + 2 * step; // ±(0.5 % of reading + 2 counts)

  it("lies within the stated accuracy of the loaded current for every student, and outside the unloaded band", { timeout: 60_000 }, () => {
    const means = new Set<number>();
    for (const student of ["s-1", "s-2", "s-3", "s-4", "s-5", "s-6", "s-7", "s-8"]) {
      const rs = simulateReadings(`seed-${student}`, countsMeter, circuit, { range: "r2m", filter: false, from: 0, count: 10_001 });
      const m = mean(values(rs.slice(1)));
      expect(Math.abs(m - loaded)).toBeLessThanOrEqual(bandOf(loaded));
      // the loading error (65.2 µA) exceeds the accuracy band of the unloaded current (9.5 µA)
      expect(Math.abs(m - unloaded)).toBeGreaterThan(bandOf(unloaded));
      means.add(m);
    }
    // one fixed gain and offset error per student: the students' means do not all agree
    expect(means.size).toBeGreaterThan(1);
  });

  it("repeats exactly for the same seed, range and time", () => {
    const a = simulateReadings("seed-x", countsMeter, circuit, { range: "r2m", filter: false, from: 12.5, count: 50 });
    const b = simulateReadings("seed-x", countsMeter, circuit, { range: "r2m", filter: false, from: 12.5, count: 50 });
    expect(b).toEqual(a);
  });

  it("shows an overload on a range the current does not fit", () => {
    const rs = simulateReadings("seed-x", countsMeter, circuit, { range: "r2u", filter: false, from: 0, count: 4 });
    // the first reading is the output's start from zero at the switch; then the display shows the overload
    expect(rs.slice(1).map((r) => r.value)).toEqual([null, null, null]);
  });
});

describe("noise: the standard deviation of 10,000 readings", () => {
  // every run starts with the output at zero (the change that started it); the statistics take the settled
  // readings after it
  const settledOf = (rs: SimReading[]) => values(rs.slice(1));

  it("matches √(4kTRB) of the shunt over the noise bandwidth summed with q/√12, within 10 %", () => {
    // PHYSICS.md §19 19b: 1 kΩ shunt in the loop with a 100 kΩ load, filter off (the amplifier's 10 kHz): the shunt reads the thermal
    // noise of R_sh ∥ R_L = 990.1 Ω `[FORMULA: Johnson 1928, Nyquist 1928: v² = 4kTRB]` over the noise bandwidth
    // of one pole B = (π/2)·10 kHz = 15.71 kHz `[FORMULA: PHYSICS.md §6]`:
    // √(4 × 1.380649e-23 × 300 × 990.1 × 15 708) = 507.6 nV, read through 1 kΩ as 0.5076 nA. One step q = 2.5 V/2¹⁶/76 294 V/A =
    // 0.5000 nA, σ_q = q/√12 = 0.1443 nA `[FORMULA: IEEE Std 1241-2010, ideal quantiser]`; together 0.5277 nA.
    const rp = (1000 * 100e3) / (1000 + 100e3);
    const thermal = Math.sqrt(4 * K_B * T * rp * (Math.PI / 2) * 10_000) / 1000;
    const q = 2.5 / 65536 / 76294;
    const expected = Math.sqrt(thermal ** 2 + q ** 2 / 12);
    expect(expected).toBeCloseTo(0.5277e-9, 12);
    const rs = simulateReadings("seed-noise", fineSamplingMeter, { supplyVoltage: 1, loadResistance: 100e3 }, { range: "r30u", filter: false, from: 10, count: 10_001 });
    const ratio = std(settledOf(rs)) / expected;
    expect(ratio).toBeGreaterThan(0.9);
    expect(ratio).toBeLessThan(1.1);
  });

  it("of a feedback ammeter matches the feedback resistor's (and the source's) thermal noise current, within 10 %", () => {
    // PHYSICS.md §19 19c: i² = 4kTB(1/R_F + 1/R_L) `[FORMULA: Johnson 1928, Nyquist 1928; a virtual-ground input, PHYSICS.md §2]`,
    // R_F = 1 GΩ, R_L = 1 TΩ, filter off, B = (π/2)·10 kHz = 15.71 kHz: √(4kT × 15 708 Hz × 1.001e-9 S) =
    // 0.5104 pA; with q/√12 = 0.02887 pA of the 0.1 pA step, 0.5112 pA.
    const thermal = Math.sqrt(4 * K_B * T * (Math.PI / 2) * 10_000 * (1 / 1e9 + 1 / 1e12));
    const expected = Math.sqrt(thermal ** 2 + (0.1e-12) ** 2 / 12);
    expect(expected).toBeCloseTo(0.5112e-12, 15);
    const rs = simulateReadings("seed-fb", feedbackMeter, { supplyVoltage: 1, loadResistance: 1e12 }, { range: "r2n", filter: false, from: 0, count: 10_001 });
    const ratio = std(settledOf(rs)) / expected;
    expect(ratio).toBeGreaterThan(0.9);
    expect(ratio).toBeLessThan(1.1);
  });

  it("falls with the filter: the 1 Hz filter takes the same input's noise below one step", () => {
    const rs = simulateReadings("seed-fb", feedbackMeter, { supplyVoltage: 1, loadResistance: 1e12 }, { range: "r2n", filter: true, from: 0, count: 2_001, rate: 0.5 });
    // √(4kT × 1.571 Hz × 1.001e-9 S) = 5.104 fA rms, far below the 0.1 pA step: the reading stays on one or two codes
    expect(new Set(settledOf(rs)).size).toBeLessThanOrEqual(2);
  });

  it("a quiet input far below one step reads the same code every time (PHYSICS.md §4: no dither, no averaging below a step)", () => {
    const rs = simulateReadings("seed-quiet", countsMeter, { supplyVoltage: 3.3, loadResistance: 2200 }, { range: "r2m", filter: false, from: 0, count: 1001 });
    expect(new Set(settledOf(rs)).size).toBe(1);
  });
});

describe("settling", () => {
  it("reaches 63.2 % of the final reading one time constant after the run starts", () => {
    // PHYSICS.md §19 19d: τ = 1/(2π·10 Hz) = 15.92 ms; 1 − e⁻¹ = 0.6321 `[FORMULA: PHYSICS.md §6, v(t) = V∞(1 − e^(−t/τ))]`
    const tau = 1 / (2 * Math.PI * 10);
    const circuit = { supplyVoltage: 1, loadResistance: 100e3 };
    const [start, atTau] = simulateReadings("seed-step", settlingMeter, circuit, { range: "r10m", filter: true, from: 3, count: 2, rate: 1 / tau });
    const final = simulateReadings("seed-step", settlingMeter, circuit, { range: "r10m", filter: true, from: 3, count: 2, rate: 1 / (30 * tau) })[1];
    expect(start.t).toBe(3);
    expect(Math.abs(start.value as number)).toBeLessThan(1e-9);
    expect((atTau.value as number) / (final.value as number)).toBeCloseTo(1 - Math.exp(-1), 3);
  });
});

describe("auto-ranging", () => {
  const run = (current: number, count = 400) =>
    simulateReadings("seed-auto", autoMeter, { supplyVoltage: 1, loadResistance: 1 / current }, { range: "auto", filter: true, from: 0, count, rate: 10 });
  const switches = (rs: SimReading[]) => rs.filter((r, i) => i > 0 && r.range !== rs[i - 1].range).length;

  it("settles on the most sensitive range below the up-threshold, as PHYSICS.md §3 3a and 3b", () => {
    expect(run(500e-9).at(-1)!.range).toBe("n"); // 3a
    expect(run(2e-3).at(-1)!.range).toBe("u"); // 3b
  });

  it("goes up at 0.90 of full scale and comes down only at 0.80 of the lower range's (PHYSICS.md §3 3d, 3e)", () => {
    // up from the 3.3 µA range at 2.970 µA: 2.98 µA ends on the 3.3 mA range; down to it only at ≤ 2.640 µA
    expect(run(2.98e-6).at(-1)!.range).toBe("u");
    expect(run(2.9e-6).at(-1)!.range).toBe("u"); // between the thresholds: it came from above and stays up
    // 3e: 2.0 µA comes down; on the 3.3 mA range it is only 2.48 steps, so the decision is coarse (3.5 steps
    // read as the code's centre, 2.820 µA, would not: 2.6 µA stays up)
    expect(run(2.0e-6).at(-1)!.range).toBe("n");
    expect(run(2.6e-6).at(-1)!.range).toBe("u");
  });

  it("never oscillates at a threshold: after reaching its range it stays there for 400 readings", () => {
    for (const current of [2.64e-6, 2.97e-6, 2.64e-3, 2.97e-3]) {
      const rs = run(current, 800);
      const last = rs.at(-1)!.range;
      const firstOnLast = rs.findIndex((r) => r.range === last);
      expect(rs.slice(firstOnLast).every((r) => r.range === last)).toBe(true);
      expect(switches(rs)).toBeLessThanOrEqual(2);
    }
  });

  it("drops the first readings after a switch (the glitch) and takes no decision on them", () => {
    const rs = run(500e-9, 30);
    const switchAt = rs.findIndex((r) => r.range === "n");
    expect(switchAt).toBeGreaterThan(0);
    // the output restarts from zero on the new range and settles within the profile's 0.2 s (τ = 0.2 s/ln 100 =
    // 43.4 ms): the first reading, 0.1 s after the switch, is about 1 − e^(−2.30) = 90 % of the settled one
    const settled = rs.at(-1)!.value as number;
    expect(Math.abs(rs[switchAt].value as number)).toBeLessThan(Math.abs(settled));
  });
});

describe("sampling a burst train below the burst rate", () => {
  it("logs the alias the sampling-burst template computes", () => {
    // PHYSICS.md §19 19e: wakes every 1.02 s for 50 ms at 20 mA over 2 µA asleep, logged at 1 Hz: f_a = |1/1.02 − 1·1| = 19.61 mHz
    // `[PUB: PHYSICS.md §16 16c; the template sampling-burst]`
    const params = { sampleRate: 1000, burstWidth: 50e-3, requiredSamples: 20, wakePeriod: 1.02, logRate: 1, activeCurrent: 20e-3, sleepCurrent: 2e-6 };
    const alias = templates["sampling-burst"].compute(params).apparentWakeFrequency as number;
    const vs = 3.3;
    const circuit: BenchCircuit = { supplyVoltage: vs, loadResistance: vs / 2e-6, burst: { loadResistance: vs / 20e-3, width: 50e-3, period: 1.02, delay: 0.3 } };
    const n = 2040;
    const log = values(simulateReadings("seed-log", loggerMeter, circuit, { range: "r40m", filter: false, from: 0, count: n, rate: 1 }));
    // the strongest frequency of the log between 1/n and the Nyquist frequency (a plain DFT)
    const m = mean(log);
    let best = 0, bestPower = -1;
    for (let k = 1; k < n / 2; k++) {
      let re = 0, im = 0;
      for (let i = 0; i < n; i++) {
        re += (log[i] - m) * Math.cos((2 * Math.PI * k * i) / n);
        im -= (log[i] - m) * Math.sin((2 * Math.PI * k * i) / n);
      }
      const p = re * re + im * im;
      if (p > bestPower) [best, bestPower] = [k, p];
    }
    expect(Math.abs(best / n - alias)).toBeLessThanOrEqual(1 / n);
    expect(alias).toBeCloseTo(0.019608, 5);
  });
});
