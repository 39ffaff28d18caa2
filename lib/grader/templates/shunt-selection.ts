// Choosing a shunt for a hard burden limit: the largest standard value not above V_b,max / I_max.
import type { Params, SeriesName, Template } from "../types";
import { SERIES_NAMES, isSeriesName, nearestStandard } from "../eseries";
import { allPositive, num, tq } from "./util";

function values(p: Params) {
  const imax = num(p, "maxCurrent");
  const vb = num(p, "maxBurden");
  const series: SeriesName = isSeriesName(p.series) ? p.series : "E24";
  const idealShunt = vb / imax;
  const standardShunt = nearestStandard(idealShunt, series, "floor");
  const above = nearestStandard(idealShunt, series, "ceil");
  const nearest = nearestStandard(idealShunt, series, "nearest");
  return {
    imax, vb, series, idealShunt, standardShunt, above, nearest,
    burdenAtFullScale: imax * standardShunt,
    shuntPower: imax * imax * standardShunt,
  };
}

export const shuntSelection: Template = {
  key: "shunt-selection",
  title: "Choosing a shunt for a burden limit",
  summary:
    "Pick the standard shunt value that keeps the burden voltage within its limit at full-scale current, then check its power.",
  parameters: [
    { key: "maxCurrent", label: "Full-scale current", symbol: "I_\\mathrm{max}", unit: "A", displayUnit: "mA", kind: "number", default: 1, min: 1e-9, max: 100, suggestedRange: [1e-3, 1] },
    { key: "maxBurden", label: "Burden voltage limit", symbol: "V_{b,\\mathrm{max}}", unit: "V", displayUnit: "mV", kind: "number", default: 0.1, min: 1e-4, max: 10, suggestedRange: [0.02, 0.2] },
    { key: "series", label: "Resistor series", symbol: "\\mathrm{E}", unit: "", displayUnit: "", kind: "category", default: "E24", choices: SERIES_NAMES },
  ],
  quantities: [
    { key: "idealShunt", label: "Largest allowed shunt", symbol: "R_\\mathrm{max}", unit: "ohm", displayUnit: "Ω", kind: "number", description: "The shunt that drops exactly the burden limit at full-scale current." },
    { key: "standardShunt", label: "Standard shunt value", symbol: "R_\\mathrm{sh}", unit: "ohm", displayUnit: "Ω", kind: "number", discrete: true, description: "The largest value of the series that does not exceed the allowed shunt." },
    { key: "burdenAtFullScale", label: "Burden at full scale", symbol: "V_\\mathrm{b}", unit: "V", displayUnit: "mV", kind: "number", description: "The voltage the chosen shunt drops at full-scale current." },
    { key: "shuntPower", label: "Shunt power at full scale", symbol: "P", unit: "W", displayUnit: "mW", kind: "number", description: "The power the chosen shunt dissipates at full-scale current." },
  ],
  compute(p) {
    const v = values(p);
    return { idealShunt: v.idealShunt, standardShunt: v.standardShunt, burdenAtFullScale: v.burdenAtFullScale, shuntPower: v.shuntPower };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.imax, v.vb)) return "full-scale current and burden limit must be positive";
    if (!isSeriesName(p.series)) return "unknown resistor series";
    if (!allPositive(v.standardShunt)) return "no standard value below the limit";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const steps = [
      "R_\\mathrm{max} = \\frac{V_{b,\\mathrm{max}}}{I_\\mathrm{max}}",
      `R_\\mathrm{max} = \\frac{${tq(v.vb, "V")}}{${tq(v.imax, "A")}} = ${tq(v.idealShunt, "ohm")}`,
    ];
    if (q === "idealShunt") return steps;
    steps.push(
      `R_\\mathrm{sh} = \\max\\{E \\in \\mathrm{${v.series}} : E \\le R_\\mathrm{max}\\} = ${tq(v.standardShunt, "ohm")}\\quad\\text{(floor, not nearest: the limit is hard)}`,
    );
    if (q === "standardShunt") return steps;
    if (q === "burdenAtFullScale")
      steps.push(`V_\\mathrm{b} = I_\\mathrm{max}\\,R_\\mathrm{sh} = ${tq(v.imax, "A")} \\times ${tq(v.standardShunt, "ohm")} = ${tq(v.burdenAtFullScale, "V")}`);
    if (q === "shuntPower")
      steps.push(
        `P = I_\\mathrm{max}^2\\,R_\\mathrm{sh} = (${tq(v.imax, "A")})^2 \\times ${tq(v.standardShunt, "ohm")} = ${tq(v.shuntPower, "W")}`,
        `\\text{rate the shunt for at least } 2P = ${tq(2 * v.shuntPower, "W")}`,
      );
    return steps;
  },
  mistakes(p, q) {
    const v = values(p);
    // a value above the limit: the ceiling (which is also the nearest value when rounding went up)
    if (!(v.above > v.idealShunt * (1 + 1e-9))) return [];
    const how = v.nearest === v.above ? "You took the nearest standard value" : "You rounded up to the next standard value";
    const detail = `${how} (${v.above} Ω), which is above the limit; take the largest value at or below ${v.idealShunt.toPrecision(4)} Ω.`;
    switch (q) {
      case "standardShunt":
        return [{ key: "nearest-not-floor", value: v.above, detail }];
      case "burdenAtFullScale":
        return [{ key: "nearest-not-floor", value: v.imax * v.above, detail }];
      case "shuntPower":
        return [{ key: "nearest-not-floor", value: v.imax * v.imax * v.above, detail }];
    }
    return [];
  },
};
