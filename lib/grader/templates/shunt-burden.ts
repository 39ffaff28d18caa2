// A load R_L fed from an ideal supply V_s, with the meter's shunt R_sh in series.
import type { Params, Template } from "../types";
import { allPositive, num, tq } from "./util";

function values(p: Params) {
  const vs = num(p, "supplyVoltage");
  const rl = num(p, "loadResistance");
  const rsh = num(p, "shuntResistance");
  const trueCurrent = vs / rl;
  const indicatedCurrent = vs / (rl + rsh);
  const burdenVoltage = indicatedCurrent * rsh;
  const loadingErrorPercent = (100 * (indicatedCurrent - trueCurrent)) / trueCurrent;
  return { vs, rl, rsh, trueCurrent, indicatedCurrent, burdenVoltage, loadingErrorPercent };
}

export const shuntBurden: Template = {
  key: "shunt-burden",
  title: "Burden voltage of a shunt ammeter",
  summary:
    "A meter's shunt in series with the load drops a burden voltage, so the meter reads less current than flows without it.",
  parameters: [
    { key: "supplyVoltage", label: "Supply voltage", symbol: "V_\\mathrm{s}", unit: "V", displayUnit: "V", kind: "number", default: 3.3, min: 0.1, max: 30, suggestedRange: [1.8, 5] },
    { key: "loadResistance", label: "Load resistance", symbol: "R_\\mathrm{L}", unit: "ohm", displayUnit: "Ω", kind: "resistor", default: 1000, min: 1, max: 10e6, suggestedRange: [100, 10e3] },
    { key: "shuntResistance", label: "Shunt (meter input) resistance", symbol: "R_\\mathrm{sh}", unit: "ohm", displayUnit: "Ω", kind: "resistor", default: 10, min: 1e-3, max: 1e6, suggestedRange: [1, 100] },
  ],
  quantities: [
    { key: "trueCurrent", label: "Current without the meter", symbol: "I_\\mathrm{true}", unit: "A", displayUnit: "mA", kind: "number", description: "The current the load draws when the meter is not in the circuit." },
    { key: "indicatedCurrent", label: "Current the meter shows", symbol: "I_\\mathrm{meas}", unit: "A", displayUnit: "mA", kind: "number", description: "The current that flows, and is read, with the shunt in series." },
    { key: "burdenVoltage", label: "Burden voltage", symbol: "V_\\mathrm{B}", unit: "V", displayUnit: "mV", kind: "number", description: "The voltage dropped across the shunt while it carries the current." },
    { key: "loadingErrorPercent", label: "Loading error", symbol: "\\varepsilon", unit: "%", displayUnit: "%", kind: "number", description: "How far the reading is from the true current, in percent (negative: reads low)." },
  ],
  compute(p) {
    const v = values(p);
    return {
      trueCurrent: v.trueCurrent,
      indicatedCurrent: v.indicatedCurrent,
      burdenVoltage: v.burdenVoltage,
      loadingErrorPercent: v.loadingErrorPercent,
    };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.vs, v.rl, v.rsh)) return "supply, load and shunt must all be positive";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const Vs = tq(v.vs, "V"), RL = tq(v.rl, "ohm"), Rsh = tq(v.rsh, "ohm");
    const Im = tq(v.indicatedCurrent, "A"), It = tq(v.trueCurrent, "A");
    switch (q) {
      case "trueCurrent":
        return ["I_\\mathrm{true} = \\frac{V_\\mathrm{s}}{R_\\mathrm{L}}", `I_\\mathrm{true} = \\frac{${Vs}}{${RL}} = ${It}`];
      case "indicatedCurrent":
        return [
          "I_\\mathrm{meas} = \\frac{V_\\mathrm{s}}{R_\\mathrm{L} + R_\\mathrm{sh}}",
          `I_\\mathrm{meas} = \\frac{${Vs}}{${RL} + ${Rsh}} = ${Im}`,
        ];
      case "burdenVoltage":
        return [
          "V_\\mathrm{B} = I_\\mathrm{meas}\\,R_\\mathrm{sh}",
          `I_\\mathrm{meas} = \\frac{${Vs}}{${RL} + ${Rsh}} = ${Im}`,
          `V_\\mathrm{B} = ${Im} \\times ${Rsh} = ${tq(v.burdenVoltage, "V")}`,
        ];
      case "loadingErrorPercent":
        return [
          "\\varepsilon = 100\\,\\% \\cdot \\frac{I_\\mathrm{meas} - I_\\mathrm{true}}{I_\\mathrm{true}} = -100\\,\\% \\cdot \\frac{R_\\mathrm{sh}}{R_\\mathrm{L} + R_\\mathrm{sh}}",
          `\\varepsilon = -100\\,\\% \\cdot \\frac{${Rsh}}{${RL} + ${Rsh}} = ${tq(v.loadingErrorPercent, "%")}`,
        ];
    }
    return [];
  },
  instrumentReadings(p, q) {
    if (q !== "loadingErrorPercent") return undefined;
    // the loading error comes from two current readings: with the meter's shunt in series and without it
    const v = values(p);
    return {
      values: { I_meas: v.indicatedCurrent, I_true: v.trueCurrent },
      formula: (r) => (100 * (r.I_meas - r.I_true)) / r.I_true,
    };
  },
  mistakes(p, q) {
    const v = values(p);
    switch (q) {
      case "trueCurrent":
        return [{ key: "ignored-burden", value: v.indicatedCurrent, title: "Meter's shunt counted in the true current", detail: "You included the shunt, but the true current is the one without the meter: V_s/R_L." }];
      case "indicatedCurrent":
        return [{ key: "ignored-burden", value: v.trueCurrent, detail: "You used V_s/R_L; with the meter in series the current is V_s/(R_L + R_sh)." }];
      case "burdenVoltage":
        return [{ key: "ignored-burden", value: v.trueCurrent * v.rsh, title: "Current without the meter used for the burden", detail: "You multiplied the shunt by V_s/R_L; the current that flows through it is V_s/(R_L + R_sh)." }];
      case "loadingErrorPercent":
        return [{ key: "sign-flip", value: -v.loadingErrorPercent, detail: "The meter reads low, so the loading error is negative." }];
    }
    return [];
  },
};
