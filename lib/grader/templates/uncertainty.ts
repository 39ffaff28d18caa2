// I = V/R from a meter reading across a shunt, with a GUM uncertainty budget: each bound ±a is taken as
// rectangular (u = a/√3), relative standard uncertainties add in quadrature, U = k·u_c.
import type { MistakeCandidate, Params, Template } from "../types";
import { allPositive, num, tq } from "./util";
import { texNumber } from "../format";

export interface UncertaintyBudget {
  current: number;
  /** half-width of the reading's bound, V: p·|V| + n·δ */
  readingBound: number;
  /** standard uncertainty of the reading, V */
  readingStandard: number;
  /** relative standard uncertainties (fractions) */
  relReading: number;
  relShunt: number;
  relCombined: number;
  combined: number;
  expanded: number;
}

/** Standard uncertainty of a rectangular distribution of half-width a (GUM 4.3.7). */
export function rectangularStandardUncertainty(halfWidth: number): number {
  return halfWidth / Math.sqrt(3);
}

/**
 * The budget. With `resolutionTerm`, a separate display-resolution term δ/(2√3) is added in quadrature
 * to the reading's uncertainty (only when the meter's specification does not already cover resolution).
 */
export function uncertaintyBudget(p: Params, opts: { resolutionTerm?: boolean } = {}): UncertaintyBudget {
  const v = num(p, "reading");
  const pct = num(p, "readingAccuracyPercent");
  const counts = num(p, "readingCounts");
  const delta = num(p, "countSize");
  const r = num(p, "shuntResistance");
  const tol = num(p, "shuntTolerancePercent");
  const k = num(p, "coverageFactor");
  const readingBound = (pct / 100) * Math.abs(v) + counts * delta;
  let readingStandard = rectangularStandardUncertainty(readingBound);
  if (opts.resolutionTerm) readingStandard = Math.hypot(readingStandard, delta / (2 * Math.sqrt(3)));
  const relReading = readingStandard / Math.abs(v);
  const relShunt = rectangularStandardUncertainty(tol / 100);
  const relCombined = Math.hypot(relReading, relShunt);
  const current = v / r;
  const combined = relCombined * Math.abs(current);
  return { current, readingBound, readingStandard, relReading, relShunt, relCombined, combined, expanded: k * combined };
}

export const uncertainty: Template = {
  key: "uncertainty",
  title: "Uncertainty of a current measured across a shunt",
  summary:
    "Turn the meter's ±(% of reading + counts) and the shunt's tolerance into standard uncertainties, combine them in quadrature and expand with k.",
  parameters: [
    { key: "reading", label: "Voltage reading across the shunt", symbol: "V", unit: "V", displayUnit: "mV", kind: "number", default: 1.0, min: 1e-6, max: 1000, suggestedRange: [0.05, 2] },
    { key: "readingAccuracyPercent", label: "Meter accuracy (% of reading)", symbol: "p", unit: "%", displayUnit: "%", kind: "number", default: 0.5, min: 0, max: 20 },
    { key: "readingCounts", label: "Meter accuracy (counts)", symbol: "n", unit: "", displayUnit: "counts", kind: "integer", default: 2, min: 0, max: 1000 },
    { key: "countSize", label: "Size of one count", symbol: "\\delta", unit: "V", displayUnit: "mV", kind: "number", default: 1e-3, min: 1e-9, max: 10 },
    { key: "shuntResistance", label: "Shunt resistance", symbol: "R", unit: "ohm", displayUnit: "Ω", kind: "resistor", default: 10, min: 1e-4, max: 1e7, suggestedRange: [0.1, 100] },
    { key: "shuntTolerancePercent", label: "Shunt tolerance", symbol: "t_R", unit: "%", displayUnit: "%", kind: "number", default: 1, min: 0, max: 20 },
    { key: "coverageFactor", label: "Coverage factor", symbol: "k", unit: "", displayUnit: "", kind: "number", default: 2, min: 1, max: 3 },
  ],
  quantities: [
    { key: "current", label: "Current", symbol: "I", unit: "A", displayUnit: "mA", kind: "number", description: "The current, reading divided by the shunt." },
    { key: "relativeStandardUncertaintyPercent", label: "Relative combined standard uncertainty", symbol: "u_{c,r}", unit: "%", displayUnit: "%", kind: "number", description: "The combined standard uncertainty as a percentage of the current." },
    { key: "combinedStandardUncertainty", label: "Combined standard uncertainty", symbol: "u_c", unit: "A", displayUnit: "mA", kind: "number", description: "One standard uncertainty of the current." },
    { key: "expandedUncertainty", label: "Expanded uncertainty", symbol: "U", unit: "A", displayUnit: "mA", kind: "number", description: "The combined standard uncertainty times the coverage factor." },
  ],
  compute(p) {
    const b = uncertaintyBudget(p);
    return {
      current: b.current,
      relativeStandardUncertaintyPercent: 100 * b.relCombined,
      combinedStandardUncertainty: b.combined,
      expandedUncertainty: b.expanded,
    };
  },
  check(p) {
    const b = uncertaintyBudget(p);
    if (!allPositive(num(p, "reading"), num(p, "shuntResistance"), num(p, "coverageFactor"), num(p, "countSize"))) return "reading, shunt, count size and coverage factor must be positive";
    if (!(num(p, "readingAccuracyPercent") >= 0 && num(p, "readingCounts") >= 0 && num(p, "shuntTolerancePercent") >= 0)) return "accuracies and tolerances cannot be negative";
    if (!allPositive(b.combined)) return "the budget has no uncertainty in it";
    return null;
  },
  solution(p, q) {
    const b = uncertaintyBudget(p);
    const V = tq(num(p, "reading"), "V"), R = tq(num(p, "shuntResistance"), "ohm");
    const I = [`I = \\frac{V}{R} = \\frac{${V}}{${R}} = ${tq(b.current, "A")}`];
    if (q === "current") return I;
    const budget = [
      ...I,
      `a_V = p\\,|V| + n\\,\\delta = ${tq(num(p, "readingAccuracyPercent"), "%")} \\times ${V} + ${num(p, "readingCounts")} \\times ${tq(num(p, "countSize"), "V")} = ${tq(b.readingBound, "V")}`,
      `u(V) = \\frac{a_V}{\\sqrt{3}} = ${tq(b.readingStandard, "V")},\\quad u_r(V) = ${tq(100 * b.relReading, "%")}`,
      `u_r(R) = \\frac{${tq(num(p, "shuntTolerancePercent"), "%")}}{\\sqrt{3}} = ${tq(100 * b.relShunt, "%")}`,
      `u_{c,r} = \\sqrt{u_r^2(V) + u_r^2(R)} = \\sqrt{(${texNumber(100 * b.relReading)}\\,\\%)^2 + (${texNumber(100 * b.relShunt)}\\,\\%)^2} = ${tq(100 * b.relCombined, "%")}`,
    ];
    if (q === "relativeStandardUncertaintyPercent") return budget;
    const uc = `u_c = u_{c,r}\\,|I| = ${tq(100 * b.relCombined, "%")} \\times ${tq(Math.abs(b.current), "A")} = ${tq(b.combined, "A")}`;
    if (q === "combinedStandardUncertainty") return [...budget, uc];
    if (q === "expandedUncertainty")
      return [...budget, uc, `U = k\\,u_c = ${texNumber(num(p, "coverageFactor"))} \\times ${tq(b.combined, "A")} = ${tq(b.expanded, "A")}`];
    return [];
  },
  mistakes(p, q) {
    const b = uncertaintyBudget(p);
    const i = Math.abs(b.current);
    const k = num(p, "coverageFactor");
    const relBoundV = b.readingBound / Math.abs(num(p, "reading"));
    const relBoundR = num(p, "shuntTolerancePercent") / 100;
    const linearStd = b.relReading + b.relShunt; // standard uncertainties added linearly
    const linearBounds = relBoundV + relBoundR; // bounds added linearly
    const noRoot3 = Math.hypot(relBoundV, relBoundR); // bounds used as standard uncertainties
    const lin = "You added the relative terms linearly; independent terms add in quadrature: √(u_r(V)² + u_r(R)²).";
    const root3 = "You used the ±bounds as standard uncertainties; a rectangular bound a gives u = a/√3.";
    const out: MistakeCandidate[] = [];
    const add = (scale: number, extraLinear: number[] = []) => {
      out.push({ key: "linear-sum", value: scale * linearStd, detail: lin });
      out.push({ key: "linear-sum", value: scale * linearBounds, detail: lin });
      for (const x of extraLinear) out.push({ key: "linear-sum", value: x, detail: lin });
      out.push({ key: "no-root-three", value: scale * noRoot3, detail: root3 });
    };
    if (q === "relativeStandardUncertaintyPercent") add(100);
    if (q === "combinedStandardUncertainty") add(i);
    if (q === "expandedUncertainty") add(k * i, [i * linearBounds]);
    return out;
  },
};
