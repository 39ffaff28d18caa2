// The analysis against square waves whose numbers are known in closed form, and against the duty-cycle
// check values of lib/grader/PHYSICS.md §8 (and the RC-filter values of §6e).
import { describe, expect, it } from "vitest";
import { analyzeTrace, squareWaveCsv, type SquareWaveSpec } from "../../../lib/trace";
import { closedForm, DAY, expectClose, HOUR, MAH } from "./helpers";

async function analyse(spec: SquareWaveSpec, options: Parameters<typeof analyzeTrace>[1] = {}) {
  return analyzeTrace(squareWaveCsv(spec), options);
}

describe("square wave in closed form", () => {
  const spec = { sleepCurrent: 5e-6, activeCurrent: 12e-3, activeTime: 0.004, period: 0.05, cycles: 40, sampleInterval: 0.0005 };
  const cf = closedForm(spec);

  it("gives the time-weighted average, levels, duty cycle and charge per wake", async () => {
    const r = await analyse(spec);
    expect(r.rows).toBe(40 * 100 + 1);
    expect(r.badRows).toBe(0);
    expectClose(r.duration, cf.duration, 1e-9);
    expectClose(r.averageCurrent, cf.average, 1e-9);
    expectClose(r.totalCharge, cf.totalCharge, 1e-9);
    expectClose(r.sleepLevel, spec.sleepCurrent, 1e-9);
    expectClose(r.activeLevel, spec.activeCurrent, 1e-9);
    expectClose(r.dutyCycle, cf.dutyCycle, 1e-9);
    expectClose(r.chargePerWake, cf.chargePerWake, 1e-9);
    expectClose(r.activeTimePerWake, spec.activeTime, 1e-9);
    expect(r.minCurrent).toBe(spec.sleepCurrent);
    expect(r.maxCurrent).toBe(spec.activeCurrent);
    expect(r.wakes).toBe(spec.cycles);
    expectClose(r.period, spec.period, 1e-9);
    expect(r.twoLevel).toBe(true);
    expect(r.threshold).toBeGreaterThan(spec.sleepCurrent);
    expect(r.threshold).toBeLessThan(spec.activeCurrent);
    expect(r.integration).toBe("sample-and-hold");
  });

  it("sample-and-hold and trapezoidal integration both give the closed-form average", async () => {
    const r = await analyse(spec);
    expectClose(r.averageCurrent, cf.average, 1e-9);
    expectClose(r.averageCurrentTrapezoid, cf.average, 1e-9);
  });

  it("gives the same answers in other units and with a semicolon and decimal comma", async () => {
    const r = await analyse({ ...spec, units: { time: "ms", current: "uA" }, separator: ";", decimalComma: true });
    expect(r.units).toMatchObject({ time: "ms", current: "uA", timeSource: "header", currentSource: "header", inferred: false });
    expect(r.format).toMatchObject({ delimiter: ";", decimalComma: true });
    expectClose(r.averageCurrent, cf.average, 1e-9);
    expectClose(r.chargePerWake, cf.chargePerWake, 1e-9);
    expectClose(r.duration, cf.duration, 1e-9);
  });

  it("the plain mean of the samples is not the average when sampling is uneven", async () => {
    // A logger that writes a line only when the current changes (lib/grader/PHYSICS.md §8a's wrong unweighted mean).
    const lines = ["time,current"];
    const N = 1000;
    for (let c = 0; c < N; c++) lines.push(`${c},0.000002`, `${c + 0.99},0.02`);
    lines.push(`${N},0.000002`);
    const r = await analyzeTrace(lines.join("\n"));
    // [FORMULA]
    expectClose(r.averageCurrent, 202.0e-6);
    // unweighted mean (wrong) 10.00 mA = 49.51× too high [FORMULA]; one closing sample moves it by 0.05 %
    expectClose(r.sampleMean, 10.0e-3, 1e-3);
    expectClose(r.sampleMean / r.averageCurrent, 49.51, 1e-3);
    expectClose(r.chargePerWake, 200.0e-6);
    expect(r.wakes).toBe(N);
  });
});

describe("lib/grader/PHYSICS.md §8 check values from generated traces", () => {
  it("8a: 20 mA for 10 ms every 1 s, sleep 2 µA", async () => {
    const spec = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 0.01, period: 1, cycles: 20, sampleInterval: 0.001 };
    const r = await analyse(spec);
    const cf = closedForm(spec);
    expectClose(r.averageCurrent, cf.average, 1e-9);
    // [FORMULA]
    expectClose(r.averageCurrent, 202.0e-6);
    // [FORMULA]
    expectClose(r.chargePerWake, 200.0e-6);
    expectClose(r.dutyCycle, 0.01, 1e-9);
    expectClose(r.sleepLevel, 2e-6, 1e-9);
    expectClose(r.activeLevel, 20e-3, 1e-9);
  });

  it("8b: 8a with 220 mAh, η = 0.8", async () => {
    const spec = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 0.01, period: 1, cycles: 20, sampleInterval: 0.001 };
    const r = await analyse(spec, { batteryCapacity: 220 * MAH, usableFraction: 0.8 });
    expectClose(r.batteryLife, (0.8 * 220 * MAH) / closedForm(spec).average, 1e-9);
    // [FORMULA]
    expectClose(r.batteryLife! / HOUR, 871.4);
    // [FORMULA]
    expectClose(r.batteryLife! / DAY, 36.31);
  });

  it("8b: usableFraction defaults to 0.8", async () => {
    const spec = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 0.01, period: 1, cycles: 3, sampleInterval: 0.001 };
    const r = await analyse(spec, { batteryCapacity: 220 * MAH });
    // [FORMULA]
    expectClose(r.batteryLife! / HOUR, 871.4);
  });

  it("8c: 25 mA for 5 ms every 10 s, sleep 3 µA; 220 mAh, η = 0.8", async () => {
    const spec = { sleepCurrent: 3e-6, activeCurrent: 25e-3, activeTime: 0.005, period: 10, cycles: 5, sampleInterval: 0.001 };
    const r = await analyse(spec, { batteryCapacity: 220 * MAH, usableFraction: 0.8 });
    expectClose(r.averageCurrent, closedForm(spec).average, 1e-9);
    // [FORMULA]
    expectClose(r.averageCurrent, 15.5e-6);
    // [FORMULA]
    expectClose(r.batteryLife! / HOUR, 1.136e4);
    // [FORMULA]
    expectClose(r.batteryLife! / DAY, 473.2);
    expectClose(r.chargePerWake, 25e-3 * 0.005, 1e-9);
    expect(r.wakes).toBe(5);
    expectClose(r.period, 10, 1e-9);
  });

  it("8d: 1000 mAh; 10 mA active 1 %, 20 µA sleep 99 % (no derating: 8347 h is 1000 mAh / Ī)", async () => {
    const spec = { sleepCurrent: 20e-6, activeCurrent: 10e-3, activeTime: 0.01, period: 1, cycles: 10, sampleInterval: 0.001 };
    const r = await analyse(spec, { batteryCapacity: 1000 * MAH, usableFraction: 1 });
    expectClose(r.averageCurrent, closedForm(spec).average, 1e-9);
    // PHYSICS.md §8 8d [FORMULA; REF: mathjs]
    expectClose(r.averageCurrent, 0.1198e-3);
    // PHYSICS.md §8 8d [FORMULA; REF: mathjs]
    expectClose(r.batteryLife! / HOUR, 8347);
    expectClose(r.dutyCycle, 0.01, 1e-9);
  });

  it("8e: 2200 mAh; 40 mA for 2 s, 0.1 mA for 8 s (no derating)", async () => {
    const spec = { sleepCurrent: 0.1e-3, activeCurrent: 40e-3, activeTime: 2, period: 10, cycles: 6, sampleInterval: 0.01 };
    const r = await analyse(spec, { batteryCapacity: 2200 * MAH, usableFraction: 1 });
    expectClose(r.averageCurrent, closedForm(spec).average, 1e-9);
    // PHYSICS.md §8 8e [FORMULA; REF: mathjs]
    expectClose(r.averageCurrent, 8.08e-3);
    // PHYSICS.md §8 8e [FORMULA; REF: mathjs]
    expectClose(r.batteryLife! / HOUR, 272.3);
    expectClose(r.chargePerWake, 40e-3 * 2, 1e-9);
    expectClose(r.sleepLevel, 0.1e-3, 1e-9);
    expectClose(r.activeLevel, 40e-3, 1e-9);
  });
});

describe("lib/grader/PHYSICS.md §6: an RC filter keeps the charge and lowers the peak", () => {
  // 20 mA, 1 ms pulses every 20τ, sleep 0, through a first-order low-pass sampled every 10 µs. The filter is
  // stepped exactly for an input held over each sample interval: y ← x + (y − x)·e^(−dt/τ).
  function filteredCsv(tau: number): string {
    const dt = 10e-6;
    const pulse = 100; // samples: 1 ms
    const perPeriod = Math.round((20 * tau) / dt);
    const cycles = 3;
    const a = Math.exp(-dt / tau);
    const lines = ["t (s),I (A)"];
    let y = 0;
    for (let k = 0; k <= cycles * perPeriod; k++) {
      lines.push(`${k * dt},${y}`);
      const x = k % perPeriod < pulse ? 20e-3 : 0;
      y = x + (y - x) * a;
    }
    return lines.join("\n");
  }

  it("6e: τ = 1 ms → peak 12.64 mA, charge 20.00 µC per pulse", async () => {
    const r = await analyzeTrace(filteredCsv(1e-3));
    // [FORMULA]
    expectClose(r.maxCurrent, 12.64e-3);
    // [FORMULA]
    expectClose(r.totalCharge / 3, 20.0e-6);
  });

  it("6e: τ = 10 ms → peak 1.903 mA, charge 20.00 µC per pulse", async () => {
    const r = await analyzeTrace(filteredCsv(10e-3));
    // [FORMULA]
    expectClose(r.maxCurrent, 1.903e-3);
    // [FORMULA]
    expectClose(r.totalCharge / 3, 20.0e-6);
  });

  it("the unfiltered pulses have the same average and the full peak", async () => {
    const spec = { sleepCurrent: 0, activeCurrent: 20e-3, activeTime: 1e-3, period: 20e-3, cycles: 3, sampleInterval: 10e-6 };
    const raw = await analyse(spec);
    const filtered = await analyzeTrace(filteredCsv(1e-3));
    expect(raw.maxCurrent).toBe(20e-3);
    expectClose(filtered.averageCurrent, raw.averageCurrent, 1e-6);
  });
});
