// A first-order RC filter after the shunt, and the shunt's own thermal (Johnson) noise in the filter's noise bandwidth.
import type { MistakeCandidate, Params, Template } from "../types";
import { BOLTZMANN } from "../constants";
import { allPositive, num, tq } from "./util";

function values(p: Params) {
  const r = num(p, "filterResistance");
  const c = num(p, "filterCapacitance");
  const rsh = num(p, "shuntResistance");
  const t = num(p, "temperature");
  const tau = r * c;
  const fc = 1 / (2 * Math.PI * tau);
  const bn = (Math.PI / 2) * fc;
  const vn = Math.sqrt(4 * BOLTZMANN * t * rsh * bn);
  return {
    r, c, rsh, t, tau, fc, bn, vn,
    settling: tau * Math.log(100),
    inoise: vn / rsh,
  };
}

export const filterNoise: Template = {
  key: "filter-noise",
  title: "RC filter and thermal noise",
  summary:
    "An RC low-pass sets the time constant, the cut-off and the noise bandwidth; the shunt's thermal noise is integrated over that bandwidth.",
  parameters: [
    { key: "filterResistance", label: "Filter resistance", symbol: "R", unit: "ohm", displayUnit: "kΩ", kind: "resistor", default: 10e3, min: 1, max: 10e6, suggestedRange: [1e3, 100e3] },
    { key: "filterCapacitance", label: "Filter capacitance", symbol: "C", unit: "F", displayUnit: "nF", kind: "number", default: 100e-9, min: 1e-12, max: 1e-2, suggestedRange: [10e-9, 1e-6] },
    { key: "shuntResistance", label: "Shunt resistance", symbol: "R_\\mathrm{sh}", unit: "ohm", displayUnit: "kΩ", kind: "resistor", default: 10e3, min: 1e-3, max: 10e6, suggestedRange: [10, 100e3] },
    { key: "temperature", label: "Temperature", symbol: "T", unit: "K", displayUnit: "K", kind: "number", default: 300, min: 1, max: 500, suggestedRange: [290, 310] },
  ],
  quantities: [
    { key: "timeConstant", label: "Time constant", symbol: "\\tau", unit: "s", displayUnit: "ms", kind: "number", description: "τ = RC, the filter's response time." },
    { key: "cutoffFrequency", label: "Cut-off frequency", symbol: "f_\\mathrm{c}", unit: "Hz", displayUnit: "Hz", kind: "number", description: "The −3 dB corner frequency of the filter." },
    { key: "settlingTime1pct", label: "Settling time to 1 %", symbol: "t_{1\\%}", unit: "s", displayUnit: "ms", kind: "number", description: "The time a step takes to settle within 1 % of its final value." },
    { key: "noiseBandwidth", label: "Noise bandwidth", symbol: "B_\\mathrm{n}", unit: "Hz", displayUnit: "Hz", kind: "number", description: "The bandwidth of an ideal brick-wall filter that passes the same white-noise power." },
    { key: "thermalNoiseVoltage", label: "Thermal noise voltage of the shunt", symbol: "v_\\mathrm{n}", unit: "V", displayUnit: "nV", kind: "number", description: "The rms Johnson noise voltage of the shunt within the noise bandwidth." },
    { key: "thermalNoiseCurrent", label: "Thermal noise current of the shunt", symbol: "i_\\mathrm{n}", unit: "A", displayUnit: "pA", kind: "number", description: "The same noise expressed as a current through the shunt." },
  ],
  compute(p) {
    const v = values(p);
    return {
      timeConstant: v.tau,
      cutoffFrequency: v.fc,
      settlingTime1pct: v.settling,
      noiseBandwidth: v.bn,
      thermalNoiseVoltage: v.vn,
      thermalNoiseCurrent: v.inoise,
    };
  },
  check(p) {
    const v = values(p);
    return allPositive(v.r, v.c, v.rsh, v.t) ? null : "resistances, capacitance and temperature must be positive";
  },
  solution(p, q) {
    const v = values(p);
    const tau = [`\\tau = R\\,C = ${tq(v.r, "ohm")} \\times ${tq(v.c, "F")} = ${tq(v.tau, "s")}`];
    const fc = [...tau, `f_\\mathrm{c} = \\frac{1}{2\\pi\\tau} = \\frac{1}{2\\pi \\times ${tq(v.tau, "s")}} = ${tq(v.fc, "Hz")}`];
    const bn = [...fc, `B_\\mathrm{n} = \\frac{\\pi}{2} f_\\mathrm{c} = \\frac{1}{4RC} = ${tq(v.bn, "Hz")}`];
    const vn = [
      ...bn,
      `v_\\mathrm{n} = \\sqrt{4 k_\\mathrm{B} T R_\\mathrm{sh} B_\\mathrm{n}} = \\sqrt{4 \\times 1.380649\\times10^{-23}\\,\\mathrm{J/K} \\times ${tq(v.t, "K")} \\times ${tq(v.rsh, "ohm")} \\times ${tq(v.bn, "Hz")}} = ${tq(v.vn, "V")}`,
    ];
    switch (q) {
      case "timeConstant":
        return tau;
      case "cutoffFrequency":
        return fc;
      case "settlingTime1pct":
        return [...tau, `t_{1\\%} = \\tau \\ln 100 = 4.605\\,\\tau = ${tq(v.settling, "s")}`];
      case "noiseBandwidth":
        return bn;
      case "thermalNoiseVoltage":
        return vn;
      case "thermalNoiseCurrent":
        return [...vn, `i_\\mathrm{n} = \\frac{v_\\mathrm{n}}{R_\\mathrm{sh}} = \\frac{${tq(v.vn, "V")}}{${tq(v.rsh, "ohm")}} = ${tq(v.inoise, "A")}`];
    }
    return [];
  },
  mistakes(p, q) {
    const v = values(p);
    const out: MistakeCandidate[] = [];
    const no2pi = "You used 1/(RC); the cut-off frequency is 1/(2πRC).";
    const asBw = "You integrated the noise over the cut-off frequency; use the noise bandwidth B_n = (π/2)·f_c.";
    const vnAtFc = Math.sqrt(4 * BOLTZMANN * v.t * v.rsh * v.fc);
    if (q === "cutoffFrequency") out.push({ key: "omitted-2pi", value: 1 / v.tau, detail: no2pi });
    if (q === "noiseBandwidth") {
      out.push({ key: "cutoff-as-bandwidth", value: v.fc, detail: "You gave the cut-off frequency; the noise bandwidth of one pole is (π/2)·f_c." });
      out.push({ key: "omitted-2pi", value: Math.PI / 2 / v.tau, detail: no2pi });
    }
    if (q === "thermalNoiseVoltage") out.push({ key: "cutoff-as-bandwidth", value: vnAtFc, detail: asBw });
    if (q === "thermalNoiseCurrent") out.push({ key: "cutoff-as-bandwidth", value: vnAtFc / v.rsh, detail: asBw });
    return out;
  },
};
