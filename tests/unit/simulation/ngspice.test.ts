// The simulated bench against a circuit simulator (ngspice, Debian's /usr/bin/ngspice) on the same circuit:
// its noise analysis for the standard deviation of the readings, its transient analysis for the settling.
// The meter is modelled in SPICE as the shunt in the loop with the load, an ideal amplifier of gain 1 and a
// first-order RC low-pass whose resistor is marked noiseless (so only the shunt and the load make noise, as in
// the module); the result is read back as current through the shunt.
import { describe, expect, it } from "vitest";
import { cutoffOf, simulateReadings, timeConstantOf, type SimReading } from "@/lib/simulation";
import { runNgspice } from "@/tests/support/spice-batch";
import { fineSamplingMeter, settlingMeter } from "./instruments";

const std = (xs: number[]) => {
  const m = xs.reduce((a, b) => a + b, 0) / xs.length;
  return Math.sqrt(xs.reduce((a, b) => a + (b - m) ** 2, 0) / (xs.length - 1));
};
const values = (rs: SimReading[]) => rs.slice(1).map((r) => r.value as number);

/** The bench circuit with a meter of shunt `rsh` and low-pass cut-off `fc`, with `control` as its analysis. */
function netlist(vs: string, rl: number, rsh: number, fc: number, control: string): string {
  const rf = 1; // Ω, noiseless; C sets the cut-off
  return [
    "simulated bench check",
    ".options temp=26.85", // 300 K, the module's bench temperature
    `V1 vs 0 ${vs}`,
    `RL vs a ${rl}`,
    `RSH a 0 ${rsh}`,
    "E1 b 0 a 0 1",
    `RF b out ${rf} noisy=0`,
    `CF out 0 ${1 / (2 * Math.PI * fc * rf)}`,
    ".control",
    control,
    ".endc",
    ".end",
    "",
  ].join("\n");
}

describe("the simulated bench against ngspice", () => {
  it("the standard deviation of 10,000 readings matches ngspice's integrated output noise with q/√12, within 10 %", () => {
    const range = fineSamplingMeter.ranges[0];
    const fc = cutoffOf(range, false); // filter off: the amplifier's bandwidth
    const spice = runNgspice(netlist("dc 1 ac 1", 100e3, 1000, fc, "noise v(out) V1 dec 50 1e-3 1e9\nsetplot noise2\nprint onoise_total"));
    const thermal = spice.onoise_total / 1000; // volts across the shunt, read as current through it
    expect(thermal).toBeGreaterThan(4e-10);
    const q = 2.5 / 65536 / 76294;
    const expected = Math.sqrt(thermal ** 2 + q ** 2 / 12);
    const rs = simulateReadings("seed-spice", fineSamplingMeter, { supplyVoltage: 1, loadResistance: 100e3 }, { range: "r30u", filter: false, from: 0, count: 10_001 });
    const ratio = std(values(rs)) / expected;
    expect(ratio).toBeGreaterThan(0.9);
    expect(ratio).toBeLessThan(1.1);
  });

  it("the reading after a step settles as ngspice's transient: at τ, 2τ and 5τ within 0.5 % of the final", () => {
    const range = settlingMeter.ranges[0];
    const tau = timeConstantOf(range, true);
    const fc = cutoffOf(range, true);
    const at = [1, 2, 5, 30].map((n) => n * tau);
    const control = [`tran ${tau / 200} ${31 * tau} 0 ${tau / 200}`, ...at.map((t, i) => `meas tran y${i} find v(out) at=${t}`)].join("\n");
    const spice = runNgspice(netlist("pulse(0 1 0 1p 1p 1 2)", 100e3, 1000, fc, control));
    const spiceFraction = [0, 1, 2].map((i) => spice[`y${i}`] / spice.y3);
    expect(spiceFraction[0]).toBeCloseTo(1 - Math.exp(-1), 2); // the simulator agrees with the formula
    const rs = at.map((t) => simulateReadings("seed-spice", settlingMeter, { supplyVoltage: 1, loadResistance: 100e3 }, { range: "r10m", filter: true, from: 0, count: 2, rate: 1 / t })[1]);
    const final = rs[3].value as number;
    [0, 1, 2].forEach((i) => expect(Math.abs((rs[i].value as number) / final - spiceFraction[i])).toBeLessThan(0.005));
  });
});
