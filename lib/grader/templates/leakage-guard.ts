// Leakage and guarding at nanoamps: a voltage V_s across an insulation resistance R_ins drives a leakage
// current V_s/R_ins into the measuring node, and the amplifier adds its input bias current I_b. A guard held
// within V_g of the input leaves only V_g across the insulation. Errors are shares of the measured current I.
import type { MistakeCandidate, Params, Template } from "../types";
import { allPositive, num, tq } from "./util";

function values(p: Params) {
  const vs = num(p, "sourceVoltage");
  const rIns = num(p, "insulationResistance");
  const i = num(p, "measuredCurrent");
  const ib = num(p, "biasCurrent");
  const vg = num(p, "guardVoltage");
  const leakage = vs / rIns;
  const guarded = vg / rIns;
  return {
    vs, rIns, i, ib, vg, leakage, guarded,
    leakageErrorPercent: (100 * leakage) / i,
    biasErrorPercent: (100 * ib) / i,
    unguardedErrorPercent: (100 * (leakage + ib)) / i,
    guardedErrorPercent: (100 * (guarded + ib)) / i,
  };
}

export const leakageGuard: Template = {
  key: "leakage-guard",
  title: "Leakage, bias current and guarding at nanoamps",
  summary:
    "Leakage through insulation is V/R_ins; the amplifier's bias current adds to it. A guard at the input's potential leaves only its few millivolts across the insulation, but never removes the bias current.",
  parameters: [
    { key: "sourceVoltage", label: "Voltage across the insulation (unguarded)", symbol: "V_\\mathrm{s}", unit: "V", displayUnit: "V", kind: "number", default: 10, min: 1e-3, max: 1000, suggestedRange: [5, 20] },
    { key: "insulationResistance", label: "Insulation resistance", symbol: "R_\\mathrm{ins}", unit: "ohm", displayUnit: "GΩ", kind: "number", default: 1e11, min: 1e6, max: 1e16, suggestedRange: [1e11, 1e13] },
    { key: "measuredCurrent", label: "Current being measured", symbol: "I", unit: "A", displayUnit: "nA", kind: "number", default: 1e-9, min: 1e-14, max: 1e-3, suggestedRange: [0.5e-9, 5e-9] },
    { key: "biasCurrent", label: "Amplifier input bias current", symbol: "I_\\mathrm{b}", unit: "A", displayUnit: "pA", kind: "number", default: 5e-12, min: 1e-16, max: 1e-6, suggestedRange: [1e-12, 20e-12] },
    { key: "guardVoltage", label: "Residual voltage between guard and input", symbol: "V_\\mathrm{g}", unit: "V", displayUnit: "mV", kind: "number", default: 2e-3, min: 1e-6, max: 1, suggestedRange: [1e-3, 5e-3] },
  ],
  quantities: [
    { key: "leakageCurrent", label: "Leakage current (unguarded)", symbol: "I_\\mathrm{leak}", unit: "A", displayUnit: "pA", kind: "number", description: "The current the full voltage drives through the insulation into the input." },
    { key: "leakageErrorPercent", label: "Leakage error", symbol: "e_\\mathrm{leak}", unit: "%", displayUnit: "%", kind: "number", description: "The leakage as a percentage of the current measured." },
    { key: "biasErrorPercent", label: "Bias-current error", symbol: "e_\\mathrm{b}", unit: "%", displayUnit: "%", kind: "number", description: "The amplifier's input bias current as a percentage of the current measured." },
    { key: "unguardedErrorPercent", label: "Total error without a guard", symbol: "e_\\mathrm{tot}", unit: "%", displayUnit: "%", kind: "number", description: "Leakage plus bias current, as a percentage of the current measured (both adding)." },
    { key: "guardedLeakage", label: "Leakage with the guard", symbol: "I_\\mathrm{leak,g}", unit: "A", displayUnit: "fA", kind: "number", description: "The leakage left when the guard holds the insulation at V_g." },
    { key: "guardedErrorPercent", label: "Total error with the guard", symbol: "e_\\mathrm{g}", unit: "%", displayUnit: "%", kind: "number", description: "Guarded leakage plus bias current, as a percentage of the current measured." },
  ],
  compute(p) {
    const v = values(p);
    return {
      leakageCurrent: v.leakage,
      leakageErrorPercent: v.leakageErrorPercent,
      biasErrorPercent: v.biasErrorPercent,
      unguardedErrorPercent: v.unguardedErrorPercent,
      guardedLeakage: v.guarded,
      guardedErrorPercent: v.guardedErrorPercent,
    };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.vs, v.rIns, v.i, v.ib, v.vg)) return "voltages, insulation resistance and currents must be positive";
    if (!(v.vg < v.vs)) return "the guard's residual voltage must be smaller than the unguarded voltage";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const I = tq(v.i, "A");
    const leak = [`I_\\mathrm{leak} = \\frac{V_\\mathrm{s}}{R_\\mathrm{ins}} = \\frac{${tq(v.vs, "V")}}{${tq(v.rIns, "ohm")}} = ${tq(v.leakage, "A")}`];
    const guard = [`I_\\mathrm{leak,g} = \\frac{V_\\mathrm{g}}{R_\\mathrm{ins}} = \\frac{${tq(v.vg, "V")}}{${tq(v.rIns, "ohm")}} = ${tq(v.guarded, "A")}`];
    if (q === "leakageCurrent") return leak;
    if (q === "leakageErrorPercent") return [...leak, `e_\\mathrm{leak} = \\frac{I_\\mathrm{leak}}{I} = \\frac{${tq(v.leakage, "A")}}{${I}} = ${tq(v.leakageErrorPercent, "%")}`];
    if (q === "biasErrorPercent") return [`e_\\mathrm{b} = \\frac{I_\\mathrm{b}}{I} = \\frac{${tq(v.ib, "A")}}{${I}} = ${tq(v.biasErrorPercent, "%")}`];
    if (q === "unguardedErrorPercent")
      return [...leak, `e_\\mathrm{tot} = \\frac{I_\\mathrm{leak} + I_\\mathrm{b}}{I} = \\frac{${tq(v.leakage, "A")} + ${tq(v.ib, "A")}}{${I}} = ${tq(v.unguardedErrorPercent, "%")}`];
    if (q === "guardedLeakage") return ["\\text{the guard follows the input, so only } V_\\mathrm{g} \\text{ remains across the insulation}", ...guard];
    if (q === "guardedErrorPercent")
      return [...guard, `e_\\mathrm{g} = \\frac{I_\\mathrm{leak,g} + I_\\mathrm{b}}{I} = \\frac{${tq(v.guarded, "A")} + ${tq(v.ib, "A")}}{${I}} = ${tq(v.guardedErrorPercent, "%")}`];
    return [];
  },
  mistakes(p, q) {
    const v = values(p);
    const out: MistakeCandidate[] = [];
    const bias = "You left out the amplifier's input bias current; it flows into the same node as the leakage.";
    const node = "Your guard leaves the full voltage across the insulation: it must sit at the input's own potential, not at the source or a rail.";
    if (q === "unguardedErrorPercent") out.push({ key: "forgot-bias", value: v.leakageErrorPercent, detail: bias });
    if (q === "guardedErrorPercent") {
      out.push({ key: "forgot-bias", value: (100 * v.guarded) / v.i, detail: `${bias} The guard removes leakage, not bias.` });
      out.push({ key: "wrong-guard-node", value: v.unguardedErrorPercent, detail: node });
    }
    if (q === "guardedLeakage") out.push({ key: "wrong-guard-node", value: v.leakage, detail: node });
    return out;
  },
  instrumentReadings(p, q) {
    // an error against the source's set current comes from one reading, I_read = I + leakage + bias (the
    // set current I is given): the meter's accuracy applies to I_read, not to the small percentage
    if (q !== "unguardedErrorPercent" && q !== "guardedErrorPercent") return undefined;
    const v = values(p);
    const read = v.i + (q === "unguardedErrorPercent" ? v.leakage : v.guarded) + v.ib;
    return { values: { I_read: read }, formula: (r) => (100 * (r.I_read - v.i)) / v.i };
  },
};
