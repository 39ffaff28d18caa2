// An outside reference: mathjs evaluates the same formulas with units, independently of lib/grader's code.
import { describe, expect, it } from "vitest";
import { create, all } from "mathjs";
import { BOLTZMANN, ELEMENTARY_CHARGE, templates } from "../../../lib/grader";
import { near } from "./helpers";

const math = create(all);
const ev = (expr: string, unit: string) => (math.evaluate(expr) as { toNumber(u: string): number }).toNumber(unit);

describe("mathjs as an independent oracle", () => {
  it("its physical constants are the SI 2019 exact values, and so are ours", () => {
    expect(math.boltzmann.toNumber("J/K")).toBe(1.380649e-23);
    expect(math.elementaryCharge.toNumber("C")).toBe(1.602176634e-19);
    expect(BOLTZMANN).toBe(math.boltzmann.toNumber("J/K"));
    expect(ELEMENTARY_CHARGE).toBe(math.elementaryCharge.toNumber("C"));
  });

  it("shunt burden", () => {
    const v = templates["shunt-burden"].compute({ supplyVoltage: 3.3, loadResistance: 1000, shuntResistance: 10 });
    near(v.indicatedCurrent, ev("3.3 V / (1 kohm + 10 ohm)", "A"), 1e-12);
    near(v.trueCurrent, ev("3.3 V / 1 kohm", "A"), 1e-12);
    near(v.burdenVoltage, ev("3.3 V / (1 kohm + 10 ohm) * 10 ohm", "V"), 1e-12);
  });

  it("shunt selection power", () => {
    const v = templates["shunt-selection"].compute({ maxCurrent: 3.3, maxBurden: 0.1, series: "E24" });
    near(v.shuntPower, ev("(3.3 A)^2 * 30 mohm", "W"), 1e-12);
    near(v.idealShunt, ev("100 mV / 3.3 A", "ohm"), 1e-12);
  });

  it("filter and thermal noise", () => {
    const v = templates["filter-noise"].compute({ filterResistance: 10e3, filterCapacitance: 100e-9, shuntResistance: 10e3, temperature: 300 });
    near(v.timeConstant, ev("10 kohm * 100 nF", "s"), 1e-12);
    near(v.cutoffFrequency, ev("1 / (2 * pi * 10 kohm * 100 nF)", "Hz"), 1e-12);
    near(v.noiseBandwidth, ev("1 / (4 * 10 kohm * 100 nF)", "Hz"), 1e-12);
    near(v.thermalNoiseVoltage, ev("sqrt(4 * boltzmann * 300 K * 10 kohm * 1 / (4 * 10 kohm * 100 nF))", "V"), 1e-9);
    near(v.thermalNoiseCurrent, ev("sqrt(4 * boltzmann * 300 K / (4 * 10 kohm * 100 nF) / 10 kohm)", "A"), 1e-9);
  });

  it("duty cycle and battery life", () => {
    const p = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 792, usableFraction: 0.8 };
    const v = templates["duty-cycle"].compute(p);
    const avg = "((20 mA * 10 ms + 2 uA * (1 s - 10 ms)) / 1 s)";
    near(v.averageCurrent, ev(avg, "A"), 1e-12);
    near(v.batteryLife, ev(`0.8 * 220 mAh / ${avg}`, "s"), 1e-12);
    near(v.chargePerWake, ev("20 mA * 10 ms", "C"), 1e-12);
  });

  it("bidirectional offset and uncertainty", () => {
    const b = templates["bidirectional-offset"].compute({ offsetVoltage: 1.65, sensitivity: 1e6, outputVoltage: 2.5, fullScaleVoltage: 3.3 });
    near(b.signedCurrent, ev("(2.5 V - 1.65 V) / (1 mV / nA)", "A"), 1e-12);
    const u = templates.uncertainty.compute({ reading: 1, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 1e-3, shuntResistance: 10, shuntTolerancePercent: 1, coverageFactor: 2 });
    near(u.expandedUncertainty, ev("2 * (1 V / 10 ohm) * sqrt(((0.005 * 1 V + 2 mV) / sqrt(3) / 1 V)^2 + (0.01 / sqrt(3))^2)", "A"), 1e-12);
  });
});
