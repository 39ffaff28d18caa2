// A load that sleeps at I_s and wakes to I_a for t_a once every period T, run from a battery.
import type { MistakeCandidate, Params, Template } from "../types";
import { allPositive, num, tq } from "./util";
import { texNumber } from "../format";

function values(p: Params) {
  const is = num(p, "sleepCurrent");
  const ia = num(p, "activeCurrent");
  const ta = num(p, "activeTime");
  const T = num(p, "period");
  const cap = num(p, "batteryCapacity");
  const eta = num(p, "usableFraction");
  const averageCurrent = (ia * ta + is * (T - ta)) / T;
  return {
    is, ia, ta, T, cap, eta, averageCurrent,
    chargePerWake: ia * ta,
    batteryLife: (eta * cap) / averageCurrent,
    unweighted: (ia + is) / 2,
  };
}

export const dutyCycle: Template = {
  key: "duty-cycle",
  title: "Average current and battery life of a duty-cycled load",
  summary:
    "Weight each current by the time it flows to get the average, then divide the usable battery charge by it.",
  parameters: [
    { key: "sleepCurrent", label: "Sleep current", symbol: "I_\\mathrm{s}", unit: "A", displayUnit: "µA", kind: "number", default: 2e-6, min: 1e-9, max: 0.1, suggestedRange: [1e-6, 20e-6] },
    { key: "activeCurrent", label: "Active current", symbol: "I_\\mathrm{a}", unit: "A", displayUnit: "mA", kind: "number", default: 20e-3, min: 1e-6, max: 5, suggestedRange: [5e-3, 50e-3] },
    { key: "activeTime", label: "Active time per wake", symbol: "t_\\mathrm{a}", unit: "s", displayUnit: "ms", kind: "number", default: 10e-3, min: 1e-6, max: 3600, suggestedRange: [1e-3, 50e-3] },
    { key: "period", label: "Wake period", symbol: "T", unit: "s", displayUnit: "s", kind: "number", default: 1, min: 1e-3, max: 86400, suggestedRange: [0.5, 60] },
    { key: "batteryCapacity", label: "Battery capacity", symbol: "C_\\mathrm{bat}", unit: "C", displayUnit: "mAh", kind: "number", default: 792, min: 3.6, max: 360000, suggestedRange: [360, 7200] },
    { key: "usableFraction", label: "Usable fraction of capacity", symbol: "\\eta", unit: "", displayUnit: "", kind: "number", default: 0.8, min: 0.1, max: 1 },
  ],
  quantities: [
    { key: "averageCurrent", label: "Average current", symbol: "\\bar I", unit: "A", displayUnit: "µA", kind: "number", description: "The time-weighted mean current over one period." },
    { key: "chargePerWake", label: "Charge per wake", symbol: "Q_\\mathrm{wake}", unit: "C", displayUnit: "µC", kind: "number", description: "The charge drawn during one active burst." },
    { key: "batteryLife", label: "Battery life", symbol: "t_\\mathrm{life}", unit: "s", displayUnit: "h", kind: "number", description: "How long the usable charge lasts at the average current." },
  ],
  compute(p) {
    const v = values(p);
    return { averageCurrent: v.averageCurrent, chargePerWake: v.chargePerWake, batteryLife: v.batteryLife };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.is, v.ia, v.ta, v.T, v.cap, v.eta)) return "currents, times, capacity and usable fraction must be positive";
    if (!(v.ta < v.T)) return "the active time must be shorter than the period";
    if (!(v.ia > v.is)) return "the active current must be larger than the sleep current";
    if (v.eta > 1) return "the usable fraction cannot exceed 1";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const avg = [
      "\\bar I = \\frac{I_\\mathrm{a} t_\\mathrm{a} + I_\\mathrm{s} (T - t_\\mathrm{a})}{T}",
      `\\bar I = \\frac{${tq(v.ia, "A")} \\times ${tq(v.ta, "s")} + ${tq(v.is, "A")} \\times (${tq(v.T, "s")} - ${tq(v.ta, "s")})}{${tq(v.T, "s")}} = ${tq(v.averageCurrent, "A")}`,
    ];
    if (q === "averageCurrent") return avg;
    if (q === "chargePerWake")
      return ["Q_\\mathrm{wake} = I_\\mathrm{a}\\,t_\\mathrm{a}", `Q_\\mathrm{wake} = ${tq(v.ia, "A")} \\times ${tq(v.ta, "s")} = ${tq(v.chargePerWake, "C")}`];
    if (q === "batteryLife")
      return [
        ...avg,
        `C_\\mathrm{bat} = ${tq(v.cap, "C", { displayUnit: "mAh" })} \\times 3.6\\,\\mathrm{C/mAh} = ${tq(v.cap, "C")}`,
        `t_\\mathrm{life} = \\frac{\\eta\\,C_\\mathrm{bat}}{\\bar I} = \\frac{${texNumber(v.eta)} \\times ${tq(v.cap, "C")}}{${tq(v.averageCurrent, "A")}} = ${tq(v.batteryLife, "s")} = ${tq(v.batteryLife, "s", { displayUnit: "h" })} = ${tq(v.batteryLife, "s", { displayUnit: "d" })}`,
      ];
    return [];
  },
  mistakes(p, q) {
    const v = values(p);
    const out: MistakeCandidate[] = [];
    if (q === "averageCurrent")
      out.push({ key: "unweighted-average", value: v.unweighted, detail: "You averaged the two currents as (I_a + I_s)/2; weight each by the time it flows." });
    if (q === "batteryLife") {
      out.push({ key: "unweighted-average", value: (v.eta * v.cap) / v.unweighted, detail: "Your average current was (I_a + I_s)/2; weight each current by the time it flows." });
      const detail = "The capacity was not converted: 1 mAh = 3.6 C, and 1 h = 3600 s.";
      for (const f of [3.6, 1 / 3.6, 3600, 1 / 3600]) out.push({ key: "capacity-units", value: v.batteryLife * f, detail });
    }
    return out;
  },
};
