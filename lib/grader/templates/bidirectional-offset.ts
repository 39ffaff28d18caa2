// A bipolar (mid-supply-referenced) output: zero current sits at the offset voltage.
import type { MistakeCandidate, Params, Template } from "../types";
import { TEACHING_OFFSET_VOLTS, TEACHING_REFERENCE_VOLTS } from "../../instruments/library";
import { allPositive, num, tq } from "./util";

function values(p: Params) {
  const voff = num(p, "offsetVoltage");
  const s = num(p, "sensitivity");
  const vout = num(p, "outputVoltage");
  const vfs = num(p, "fullScaleVoltage");
  return {
    voff, s, vout, vfs,
    signedCurrent: (vout - voff) / s,
    maxPositiveCurrent: (vfs - voff) / s,
    maxNegativeCurrent: -voff / s,
  };
}

export const bidirectionalOffset: Template = {
  key: "bidirectional-offset",
  title: "Reading a bidirectional (offset) output",
  summary: "Subtract the zero-current offset before dividing by the sensitivity; the offset also sets the limits in each direction.",
  parameters: [
    { key: "offsetVoltage", label: "Zero-current offset", symbol: "V_\\mathrm{off}", unit: "V", displayUnit: "V", kind: "number", default: TEACHING_OFFSET_VOLTS, min: 0.01, max: 10 },
    { key: "sensitivity", label: "Sensitivity", symbol: "S", unit: "V/A", displayUnit: "mV/µA", kind: "number", default: 5000, min: 1e-3, max: 1e9 },
    { key: "outputVoltage", label: "Output voltage", symbol: "V_\\mathrm{out}", unit: "V", displayUnit: "V", kind: "number", default: 1.85, min: 0, max: 10, suggestedRange: [0.1, 2.4] },
    { key: "fullScaleVoltage", label: "Full-scale output", symbol: "V_\\mathrm{FS}", unit: "V", displayUnit: "V", kind: "number", default: TEACHING_REFERENCE_VOLTS, min: 0.1, max: 10 },
  ],
  quantities: [
    { key: "signedCurrent", label: "Current (with sign)", symbol: "I", unit: "A", displayUnit: "µA", kind: "number", description: "The current, positive or negative, that gives this output." },
    { key: "maxPositiveCurrent", label: "Largest positive current", symbol: "I_{+,\\mathrm{max}}", unit: "A", displayUnit: "mA", kind: "number", description: "The current that drives the output to full scale." },
    { key: "maxNegativeCurrent", label: "Largest negative current", symbol: "I_{-,\\mathrm{max}}", unit: "A", displayUnit: "mA", kind: "number", description: "The current that drives the output to zero volts (a negative number)." },
  ],
  compute(p) {
    const v = values(p);
    return { signedCurrent: v.signedCurrent, maxPositiveCurrent: v.maxPositiveCurrent, maxNegativeCurrent: v.maxNegativeCurrent };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.voff, v.s, v.vfs)) return "offset, sensitivity and full scale must be positive";
    if (!(v.voff < v.vfs)) return "the offset must lie below full scale";
    if (!(v.vout >= 0 && v.vout <= v.vfs)) return "the output must lie between 0 V and full scale";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const S = tq(v.s, "V/A");
    if (q === "signedCurrent")
      return [
        "I = \\frac{V_\\mathrm{out} - V_\\mathrm{off}}{S}",
        `I = \\frac{${tq(v.vout, "V")} - ${tq(v.voff, "V")}}{${S}} = ${tq(v.signedCurrent, "A")}`,
      ];
    if (q === "maxPositiveCurrent")
      return [
        "I_{+,\\mathrm{max}} = \\frac{V_\\mathrm{FS} - V_\\mathrm{off}}{S}",
        `I_{+,\\mathrm{max}} = \\frac{${tq(v.vfs, "V")} - ${tq(v.voff, "V")}}{${S}} = ${tq(v.maxPositiveCurrent, "A")}`,
      ];
    if (q === "maxNegativeCurrent")
      return ["I_{-,\\mathrm{max}} = -\\frac{V_\\mathrm{off}}{S}", `I_{-,\\mathrm{max}} = -\\frac{${tq(v.voff, "V")}}{${S}} = ${tq(v.maxNegativeCurrent, "A")}`];
    return [];
  },
  mistakes(p, q) {
    const v = values(p);
    const out: MistakeCandidate[] = [];
    const offset = "You divided the output by S without subtracting the zero-current offset first.";
    if (q === "signedCurrent") {
      out.push({ key: "forgot-offset", value: v.vout / v.s, detail: offset });
      out.push({ key: "sign-flip", value: -v.signedCurrent, detail: "An output below the offset means a negative current, above it a positive one." });
    }
    if (q === "maxPositiveCurrent") out.push({ key: "forgot-offset", value: v.vfs / v.s, detail: offset });
    if (q === "maxNegativeCurrent")
      out.push({ key: "sign-flip", value: -v.maxNegativeCurrent, detail: "The limit in the negative direction is a negative current: the output falls to 0 V." });
    return out;
  },
  instrumentReadings(p, q) {
    if (q !== "signedCurrent") return undefined;
    // what is read is the output voltage; the offset and the sensitivity are given on the handout
    const v = values(p);
    return { values: { V_out: v.vout }, formula: (r) => (r.V_out - v.voff) / v.s };
  },
  bandFloor(p, q, rel) {
    // near zero current, accept a tenth of the relative tolerance of the offset's worth of current
    const v = values(p);
    return q === "signedCurrent" ? (0.1 * rel * Math.abs(v.voff)) / v.s : 0;
  },
};
