// The simulated bench with the course teaching meter (lib/instruments/library.ts) and the circuits the labs
// put on it (lib/simulation/circuits.ts). Check values worked by hand beside each.
import { describe, expect, it } from "vitest";
import { teachingMeter } from "@/lib/instruments/library";
import { accuracyBand } from "@/lib/instruments/profile";
import { circuitFor, hasSimulatedBench, simulateReadings, NODE_SUPPLY_VOLTS } from "@/lib/simulation";

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

describe("the teaching meter on the simulated bench", () => {
  it("reads the loaded current within the range's stated accuracy on each range that holds it", () => {
    // 0.4 V across 1 kΩ: with the 500 µA range's 100 Ω 363.6 µA, with the 50 mA range's 1 Ω 399.6 µA,
    // with the 1 A range's 50 mΩ 400.0 µA `[FORMULA: PHYSICS.md §2, I = V_s/(R_L + R_in)]`
    const circuit = circuitFor("shunt-burden", { supplyVoltage: 0.4, loadResistance: 1000, shuntResistance: 100 })!;
    for (const [key, ohms] of [["r500u", 100], ["r50m", 1], ["r1", 0.05]] as const) {
      const range = teachingMeter.ranges.find((r) => r.key === key)!;
      const loaded = 0.4 / (1000 + ohms);
      for (const student of ["a", "b", "c"]) {
        const rs = simulateReadings(`tm-${student}`, teachingMeter, circuit, { range: key, filter: true, from: 5, count: 2001 });
        const m = mean(rs.slice(1).map((r) => r.value as number));
        expect(Math.abs(m - loaded), `${key} ${student}`).toBeLessThanOrEqual(accuracyBand(range, loaded).halfWidth);
      }
    }
  });

  it("shows an overload on the 5 µA range for 300 µA, and auto-ranging settles on the 500 µA range", () => {
    const circuit = { supplyVoltage: 0.3, loadResistance: 1000 };
    const over = simulateReadings("tm", teachingMeter, circuit, { range: "r5u", filter: true, from: 0, count: 5 });
    expect(over.slice(1).every((r) => r.value === null)).toBe(true);
    // from the 1 A range: 300 µA < 0.008 × 1 A = 8 mA → down; 299.7 µA < 0.008 × 50 mA = 400 µA → down;
    // on the 500 µA range 272.7 µA is neither above 0.9 × 500 µA nor below 0.008 × 500 µA = 4 µA: stays
    const auto = simulateReadings("tm", teachingMeter, circuit, { range: "auto", filter: true, from: 0, count: 40 });
    expect(auto.at(-1)!.range).toBe("r500u");
  });
});

describe("circuits of the labs' templates", () => {
  it("puts the drawn load on the bench, and a node's currents as resistances on a 3.3 V rail", () => {
    expect(circuitFor("shunt-burden", { supplyVoltage: 3.3, loadResistance: 470, shuntResistance: 10 })).toEqual({ supplyVoltage: 3.3, loadResistance: 470 });
    const node = circuitFor("duty-cycle", { sleepCurrent: 2e-6, activeCurrent: 0.02, activeTime: 0.01, period: 1, batteryCapacity: 792, usableFraction: 0.8 })!;
    // 3.3 V / 2 µA = 1.650 MΩ asleep, 3.3 V / 20 mA = 165.0 Ω awake
    expect(NODE_SUPPLY_VOLTS).toBe(3.3);
    expect(node.loadResistance).toBeCloseTo(1.65e6, 3);
    expect(node.burst).toEqual({ loadResistance: expect.closeTo(165, 9), width: 0.01, period: 1, delay: 0.25 });
    expect(circuitFor("filter-noise", { filterResistance: 1e4 })).toBeUndefined();
    expect(hasSimulatedBench("uncertainty")).toBe(false);
    expect(circuitFor("shunt-burden", { supplyVoltage: 3.3, loadResistance: 0, shuntResistance: 1 })).toBeUndefined();
  });
});
