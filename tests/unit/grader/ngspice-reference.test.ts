// The grader's circuit values against an independent engine: ngspice (Debian's /usr/bin/ngspice, which
// `npm test` installs when missing), in batch mode. Each check runs over a few hundred drawn circuits, many
// circuits to one deck (independent nodes, one operating point) or one small circuit re-valued with `alter`
// before each analysis, so each check is one ngspice process. What ngspice computes is named beside each
// check: its operating point (Kirchhoff's laws solved numerically), its transient (numerical integration),
// its small-signal AC sweep and its noise analysis (4kTR of every noisy resistor through the circuit,
// integrated over frequency). Nothing here uses the grader's formulas for the expected values.
import { describe, expect, it, vi } from "vitest";
import { BOLTZMANN, defaultVariantSpec, drawVariant, templates, type Params, type VariantSpec } from "../../../lib/grader";
import { runNgspice } from "../../support/spice-batch";

vi.setConfig({ testTimeout: 180_000 });

const N = 300;
const draws = (spec: VariantSpec, tag: string, n = N): Params[] => Array.from({ length: n }, (_, i) => drawVariant(spec, `${tag}-${i}`));
const num = (p: Params, k: string) => p[k] as number;
const deck = (elements: string[], control: string[]) =>
  ["grader reference circuits", ".options reltol=1e-7 abstol=1e-18 vntol=1e-12", ...elements, ".control", "set numdgt=10", ...control, ".endc", ".end", ""].join("\n");
function close(actual: number, expected: number, rel: number, what: string) {
  const err = Math.abs(actual / expected - 1);
  if (!(err <= rel)) throw new Error(`${what}: grader ${actual}, ngspice ${expected} (relative ${err.toExponential(2)} > ${rel})`);
}

describe("shunt circuits: ngspice operating point", () => {
  it(`shunt-burden: true and indicated current, burden voltage and loading error on ${N} drawn circuits agree to 1e-6`, () => {
    const ps = draws(defaultVariantSpec("shunt-burden"), "spice-burden");
    const el: string[] = [];
    ps.forEach((p, i) => {
      // with the meter's shunt in the loop, and the same supply and load without it
      el.push(`VS${i} s${i} 0 dc ${num(p, "supplyVoltage")}`, `RL${i} s${i} a${i} ${num(p, "loadResistance")}`, `RSH${i} a${i} 0 ${num(p, "shuntResistance")}`);
      el.push(`VT${i} t${i} 0 dc ${num(p, "supplyVoltage")}`, `RT${i} t${i} 0 ${num(p, "loadResistance")}`);
    });
    const s = runNgspice(deck(el, ["op", "print all"]), 180_000);
    ps.forEach((p, i) => {
      const g = templates["shunt-burden"].compute(p);
      const ind = -s[`vs${i}#branch`], tru = -s[`vt${i}#branch`];
      close(g.indicatedCurrent as number, ind, 1e-6, `indicated current ${i}`);
      close(g.trueCurrent as number, tru, 1e-6, `true current ${i}`);
      close(g.burdenVoltage as number, s[`a${i}`], 1e-6, `burden ${i}`);
      // the loading error from ngspice's two currents (a difference: printed to 10 digits, so 1e-5 of it)
      close(g.loadingErrorPercent as number, (100 * (ind - tru)) / tru, 1e-5, `loading error ${i}`);
    });
  });

  it(`shunt-selection: burden and power at full scale of the chosen standard shunt on ${N} drawn circuits`, () => {
    const ps = draws(defaultVariantSpec("shunt-selection"), "spice-selection");
    const el: string[] = [];
    ps.forEach((p, i) => {
      const g = templates["shunt-selection"].compute(p);
      // full-scale current through the chosen shunt, fed from a voltage source so ngspice reports its current
      el.push(`I${i} 0 a${i} dc ${num(p, "maxCurrent")}`, `VM${i} a${i} m${i} dc 0`, `R${i} m${i} 0 ${g.standardShunt as number}`);
    });
    const s = runNgspice(deck(el, ["op", "print all"]), 180_000);
    ps.forEach((p, i) => {
      const g = templates["shunt-selection"].compute(p);
      const v = s[`a${i}`], current = s[`vm${i}#branch`];
      close(g.burdenAtFullScale as number, v, 1e-6, `burden ${i}`);
      close(g.shuntPower as number, v * current, 1e-6, `power ${i}`);
      expect(v).toBeLessThanOrEqual(num(p, "maxBurden") * (1 + 1e-9)); // the floor keeps the burden within its limit
    });
  });
});

describe("the two-way offset circuit: ngspice operating point", () => {
  // a current source through a 1 Ω shunt, an amplifier of gain S referred to a reference at V_off
  // (E: v(out) = V_off + S·v(shunt)); the grader's current, fed back in, must give the stated output, its
  // limits full scale and 0 V
  const spec: VariantSpec = {
    template: "bidirectional-offset",
    parameters: {
      offsetVoltage: { mode: "range", min: 0.5, max: 2.5 },
      sensitivity: { mode: "range", min: 1, max: 1e6 },
      outputVoltage: { mode: "range", min: 0.05, max: 3.25 },
      fullScaleVoltage: { mode: "fixed", value: 3.3 },
    },
  };
  it(`signed current and both limits on ${N} drawn circuits give V_out, V_FS and 0 V`, () => {
    const ps = draws(spec, "spice-offset");
    const el: string[] = [];
    ps.forEach((p, i) => {
      const g = templates["bidirectional-offset"].compute(p);
      (["signedCurrent", "maxPositiveCurrent", "maxNegativeCurrent"] as const).forEach((q, k) => {
        const n = `${i}_${k}`;
        el.push(`I${n} 0 a${n} dc ${g[q] as number}`, `R${n} a${n} 0 1`, `VR${n} r${n} 0 dc ${num(p, "offsetVoltage")}`, `E${n} o${n} r${n} a${n} 0 ${num(p, "sensitivity")}`);
      });
    });
    const s = runNgspice(deck(el, ["op", "print all"]), 180_000);
    ps.forEach((p, i) => {
      close(s[`o${i}_0`], num(p, "outputVoltage"), 1e-6, `output ${i}`);
      close(s[`o${i}_1`], num(p, "fullScaleVoltage"), 1e-6, `positive limit ${i}`);
      expect(Math.abs(s[`o${i}_2`])).toBeLessThan(1e-9 * num(p, "fullScaleVoltage"));
    });
  });
});

describe("the RC filter: ngspice AC sweep and transient", () => {
  it(`cut-off (−3.0103 dB) and settling to 1 %, 0.1 % and half a 12-bit step after a 1 V step, on 200 drawn filters`, () => {
    const ps = draws(defaultVariantSpec("filter-noise"), "spice-filter", 200);
    const ctl: string[] = [];
    ps.forEach((p, i) => {
      const r = num(p, "filterResistance"), c = num(p, "filterCapacitance"), tau = r * c, fc = 1 / (2 * Math.PI * tau);
      ctl.push(`alter RF=${r}`, `alter CF=${c}`);
      ctl.push(`ac dec 50 ${fc / 3} ${fc * 3}`, `meas ac fc_${i} when vdb(out)=-3.0103`);
      ctl.push(`tran ${tau / 50} ${10 * tau} 0 ${tau / 50}`);
      ctl.push(`meas tran s1_${i} when v(out)=0.99`, `meas tran s2_${i} when v(out)=0.999`, `meas tran s3_${i} when v(out)=${1 - 2 ** -13}`);
    });
    const s = runNgspice(deck(["V1 in 0 dc 0 ac 1 pwl(0 0 1e-15 1)", "RF in out 1k", "CF out 0 1n"], ctl), 180_000);
    ps.forEach((p, i) => {
      const g = templates["filter-noise"].compute(p);
      const tau = g.timeConstant as number;
      close(g.cutoffFrequency as number, s[`fc_${i}`], 2e-4, `cut-off ${i}`);
      close(g.settlingTime1pct as number, s[`s1_${i}`], 2e-3, `1 % settling ${i}`);
      // PHYSICS.md §6: 6.908τ to 0.1 %, ln(2^13)·τ = 9.011τ to half a step of 12 bits
      close(6.907755 * tau, s[`s2_${i}`], 2e-3, `0.1 % settling ${i}`);
      close(9.010913 * tau, s[`s3_${i}`], 3e-3, `half-step settling ${i}`);
    });
  });
});

describe("thermal noise: ngspice noise analysis", () => {
  it(`the shunt's noise through the filter (√(4kT·R_sh·B_n)) and √(kT/C) for an RC low-pass, on 200 drawn circuits`, () => {
    const ps = draws(defaultVariantSpec("filter-noise"), "spice-noise", 200);
    const ctl: string[] = [];
    ps.forEach((p, i) => {
      const r = num(p, "filterResistance"), c = num(p, "filterCapacitance"), fc = 1 / (2 * Math.PI * r * c);
      ctl.push(`option temp=${num(p, "temperature") - 273.15}`, `alter RSH=${num(p, "shuntResistance")}`, `alter RF=${r}`, `alter CF=${c}`, `alter RK=${r}`, `alter CK=${c}`);
      ctl.push(`noise v(out) I1 dec 20 ${fc * 1e-5} ${fc * 1e5}`, `let n_${i} = onoise_total`, `print n_${i}`);
      ctl.push(`noise v(k) I2 dec 20 ${fc * 1e-5} ${fc * 1e5}`, `let k_${i} = onoise_total`, `print k_${i}`);
    });
    // the shunt (noisy) fed by a current source, a buffer, then the filter with a noiseless resistor; and a
    // plain noisy R with C across it
    const s = runNgspice(deck(["I1 0 a dc 0 ac 1", "RSH a 0 1", "E1 b 0 a 0 1", "RF b out 1k noisy=0", "CF out 0 1n", "I2 0 k dc 0 ac 1", "RK k 0 1k", "CK k 0 1n"], ctl), 180_000);
    ps.forEach((p, i) => {
      const g = templates["filter-noise"].compute(p);
      close(g.thermalNoiseVoltage as number, s[`n_${i}`], 2e-3, `thermal noise voltage ${i}`);
      close(g.thermalNoiseCurrent as number, s[`n_${i}`] / num(p, "shuntResistance"), 2e-3, `thermal noise current ${i}`);
      // √(kT/C): the same circuit's noise with the shunt equal to the filter resistor, whatever R is
      const same = templates["filter-noise"].compute({ ...p, shuntResistance: num(p, "filterResistance") });
      close(same.thermalNoiseVoltage as number, s[`k_${i}`], 2e-3, `kT/C ${i}`);
      close(Math.sqrt((BOLTZMANN * num(p, "temperature")) / num(p, "filterCapacitance")), s[`k_${i}`], 2e-3, `kT/C formula ${i}`);
    });
  });
});
