// I = V/R from a meter reading across a shunt, with a GUM uncertainty budget: each bound ±a is taken as
// rectangular (u = a/√3), relative standard uncertainties add in quadrature, U = k·u_c.
import type { MistakeCandidate, Params, Template } from "../types";
import { TEACHING_REFERENCE_VOLTS } from "../../instruments/library";
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
  /** one row per input of the chain, in the order of the budget table */
  rows: BudgetRow[];
  /** the row with the largest contribution */
  dominant: ContributionKey;
}

export type ContributionKey =
  | "reading"
  | "shunt tolerance"
  | "shunt tempco"
  | "amplifier gain"
  | "reference"
  | "quantisation"
  | "repeatability"
  | "offset"
  | "bias current"
  | "leakage";
export const CONTRIBUTION_KEYS: ContributionKey[] = [
  "reading",
  "shunt tolerance",
  "shunt tempco",
  "amplifier gain",
  "reference",
  "quantisation",
  "repeatability",
  "offset",
  "bias current",
  "leakage",
];

/** One line of a GUM budget: input x_i, its standard uncertainty u(x_i), sensitivity c_i = ∂I/∂x_i and u_i(I) = |c_i|·u(x_i). */
export interface BudgetRow {
  key: ContributionKey;
  /** what the input is, in words */
  input: string;
  /** LaTeX symbol of the input */
  symbol: string;
  /** the bound ±a the specification gives (in the input's unit), or the step q for quantisation */
  bound: number;
  distribution: "rectangular ±a: a/√3" | "rectangular step q: q/√12" | "Type A: s/√n" | "off";
  /** u(x_i) in the input's unit */
  standard: number;
  /** SI unit of the input ("V", "ohm", "K", "" for a relative error) */
  unit: string;
  /** c_i = ∂I/∂x_i, in A per the input's unit */
  sensitivity: number;
  sensitivityUnit: "A/V" | "A/ohm" | "A/K" | "A" | "A/A";
  /** u_i(I) = |c_i|·u(x_i), A */
  contribution: number;
}

/** Standard uncertainty of a rectangular distribution of half-width a (GUM 4.3.7). */
export function rectangularStandardUncertainty(halfWidth: number): number {
  return halfWidth / Math.sqrt(3);
}

/** Standard uncertainty of rounding to a step q: rectangular over ±q/2, so q/√12 (GUM F.2.2.1). */
export function quantisationStandardUncertainty(step: number): number {
  return step / Math.sqrt(12);
}

/** An optional parameter: labs made before the chain existed store no value for it. */
function opt(p: Params, key: string, fallback: number): number {
  const v = p[key];
  return typeof v === "number" ? v : fallback;
}

/** The chain's extra inputs, each off (0) unless the lab sets it. */
export function chainInputs(p: Params) {
  const gain = opt(p, "amplifierGain", 1);
  const bits = opt(p, "adcBits", 0);
  const vref = opt(p, "adcReference", TEACHING_REFERENCE_VOLTS);
  return {
    tempcoPpm: opt(p, "shuntTempcoPpm", 0),
    temperatureChange: opt(p, "temperatureChange", 0),
    gainErrorPercent: opt(p, "gainErrorPercent", 0),
    referenceTolerancePercent: opt(p, "referenceTolerancePercent", 0),
    gain,
    bits,
    vref,
    /** one converter step referred to the shunt, V (0 when the chain has no converter) */
    stepAtShunt: bits > 0 ? vref / (2 ** bits * gain) : 0,
    /** Type A: the experimental standard deviation s of n repeated readings, V (GUM 4.2.2) */
    repeatStdDev: opt(p, "repeatStdDev", 0),
    repeatCount: opt(p, "repeatCount", 1),
    /** ± bounds: the amplifier's input offset at the shunt (V), its input bias current and the leakage (A) */
    offsetBound: opt(p, "offsetBound", 0),
    biasCurrentBound: opt(p, "biasCurrentBound", 0),
    leakageBound: opt(p, "leakageBound", 0),
  };
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
  const c = chainInputs(p);
  // With a converter the reading is the converter's code: the amplifier's gain, the reference and the step
  // are its rows, and a voltmeter's ±(p % + n counts) would count the same errors twice (so it is off).
  const voltmeter = c.bits === 0;
  const readingBound = voltmeter ? (pct / 100) * Math.abs(v) + counts * delta : 0;
  let readingStandard = rectangularStandardUncertainty(readingBound);
  if (opts.resolutionTerm && voltmeter) readingStandard = Math.hypot(readingStandard, delta / (2 * Math.sqrt(3)));
  const relReading = readingStandard / Math.abs(v);
  const relShunt = rectangularStandardUncertainty(tol / 100);
  const current = v / r;
  const i = Math.abs(current);
  const alpha = c.tempcoPpm * 1e-6;
  const uTheta = rectangularStandardUncertainty(c.temperatureChange);
  const uGain = rectangularStandardUncertainty(c.gainErrorPercent / 100);
  const uRef = rectangularStandardUncertainty(c.referenceTolerancePercent / 100);
  const uQ = quantisationStandardUncertainty(c.stepAtShunt);
  const relTempco = alpha * uTheta;
  const relGain = uGain;
  const relRef = uRef;
  const relQuant = uQ / Math.abs(v);
  // Type A (GUM 4.2.3): the standard deviation of the mean of n readings, s/√n; offset, bias current and
  // leakage as rectangular ± bounds. The offset enters like the reading (c = 1/R); bias and leakage add to I.
  const uTypeA = c.repeatStdDev / Math.sqrt(c.repeatCount);
  const uOffset = rectangularStandardUncertainty(c.offsetBound);
  const uBias = rectangularStandardUncertainty(c.biasCurrentBound);
  const uLeak = rectangularStandardUncertainty(c.leakageBound);
  const combined = Math.hypot(relReading * i, relShunt * i, relTempco * i, relGain * i, relRef * i, relQuant * i, uTypeA / r, uOffset / r, uBias, uLeak);
  const relCombined = combined / i;
  const rect = "rectangular ±a: a/√3" as const;
  const rows: BudgetRow[] = [
    { key: "reading", input: voltmeter ? "voltage reading" : "voltmeter reading (off: the converter's rows replace it)", symbol: "V", bound: readingBound, distribution: voltmeter ? rect : "off", standard: readingStandard, unit: "V", sensitivity: 1 / r, sensitivityUnit: "A/V", contribution: relReading * i },
    { key: "shunt tolerance", input: "shunt resistance", symbol: "R", bound: (tol / 100) * r, distribution: rect, standard: relShunt * r, unit: "ohm", sensitivity: -current / r, sensitivityUnit: "A/ohm", contribution: relShunt * i },
    { key: "shunt tempco", input: "shunt temperature change", symbol: "\\theta", bound: c.temperatureChange, distribution: rect, standard: uTheta, unit: "K", sensitivity: -current * alpha, sensitivityUnit: "A/K", contribution: relTempco * i },
    { key: "amplifier gain", input: "relative gain error", symbol: "\\varepsilon_G", bound: c.gainErrorPercent / 100, distribution: rect, standard: uGain, unit: "", sensitivity: -current, sensitivityUnit: "A", contribution: relGain * i },
    { key: "reference", input: "relative reference error", symbol: "\\varepsilon_\\mathrm{ref}", bound: c.referenceTolerancePercent / 100, distribution: rect, standard: uRef, unit: "", sensitivity: current, sensitivityUnit: "A", contribution: relRef * i },
    { key: "quantisation", input: "converter step at the shunt", symbol: "q", bound: c.stepAtShunt, distribution: "rectangular step q: q/√12", standard: uQ, unit: "V", sensitivity: 1 / r, sensitivityUnit: "A/V", contribution: relQuant * i },
    { key: "repeatability", input: `mean of ${c.repeatCount} repeated readings (Type A)`, symbol: "\\bar V", bound: c.repeatStdDev, distribution: "Type A: s/√n", standard: uTypeA, unit: "V", sensitivity: 1 / r, sensitivityUnit: "A/V", contribution: uTypeA / r },
    { key: "offset", input: "amplifier input offset at the shunt", symbol: "V_\\mathrm{os}", bound: c.offsetBound, distribution: rect, standard: uOffset, unit: "V", sensitivity: 1 / r, sensitivityUnit: "A/V", contribution: uOffset / r },
    { key: "bias current", input: "amplifier input bias current", symbol: "I_\\mathrm{b}", bound: c.biasCurrentBound, distribution: rect, standard: uBias, unit: "A", sensitivity: 1, sensitivityUnit: "A/A", contribution: uBias },
    { key: "leakage", input: "leakage into the measuring node", symbol: "I_\\mathrm{leak}", bound: c.leakageBound, distribution: rect, standard: uLeak, unit: "A", sensitivity: 1, sensitivityUnit: "A/A", contribution: uLeak },
  ];
  let dominant = rows[0];
  for (const row of rows) if (row.contribution > dominant.contribution) dominant = row;
  return { current, readingBound, readingStandard, relReading, relShunt, relCombined, combined, expanded: k * combined, rows, dominant: dominant.key };
}

const CONTRIBUTION_QUANTITY: Record<string, ContributionKey> = {
  readingContribution: "reading",
  shuntToleranceContribution: "shunt tolerance",
  tempcoContribution: "shunt tempco",
  gainContribution: "amplifier gain",
  referenceContribution: "reference",
  quantisationContribution: "quantisation",
  repeatabilityContribution: "repeatability",
  offsetContribution: "offset",
  biasContribution: "bias current",
  leakageContribution: "leakage",
};

/** LaTeX lines of the full budget table (input, u(x_i), c_i, u_i(I)) for worked solutions. */
function budgetTable(b: UncertaintyBudget): string {
  const cUnit: Record<BudgetRow["sensitivityUnit"], string> = { "A/V": "A/V", "A/ohm": "A/\\Omega", "A/K": "A/K", A: "A", "A/A": "A/A" };
  const rows = b.rows.map((row) => {
    const u = row.unit === "" ? texNumber(row.standard) : tq(row.standard, row.unit);
    const c = `${texNumber(row.sensitivity)}\\,\\mathrm{${cUnit[row.sensitivityUnit]}}`;
    return `\\text{${row.key}} & ${u} & ${c} & ${tq(row.contribution, "A")} \\\\`;
  });
  return `\\begin{array}{lrrr} \\text{source} & u(x_i) & c_i = \\partial I/\\partial x_i & u_i(I) = |c_i|\\,u(x_i) \\\\ \\hline ${rows.join(" ")} \\hline \\text{combined} & & & ${tq(b.combined, "A")} \\end{array}`;
}

export const uncertainty: Template = {
  key: "uncertainty",
  title: "Uncertainty of a current measured across a shunt",
  summary:
    "Turn the meter's ±(% of reading + counts), the shunt's tolerance and temperature coefficient, the amplifier's gain error, the converter's reference tolerance and its step into standard uncertainties, weight each by its sensitivity coefficient, combine in quadrature and expand with k.",
  parameters: [
    { key: "reading", label: "Voltage reading across the shunt", symbol: "V", unit: "V", displayUnit: "mV", kind: "number", default: 1.0, min: 1e-6, max: 1000, suggestedRange: [0.05, 2] },
    { key: "readingAccuracyPercent", label: "Meter accuracy (% of reading)", symbol: "p", unit: "%", displayUnit: "%", kind: "number", default: 0.5, min: 0, max: 20 },
    { key: "readingCounts", label: "Meter accuracy (counts)", symbol: "n", unit: "", displayUnit: "counts", kind: "integer", default: 2, min: 0, max: 1000 },
    { key: "countSize", label: "Size of one count", symbol: "\\delta", unit: "V", displayUnit: "mV", kind: "number", default: 1e-3, min: 1e-9, max: 10 },
    { key: "shuntResistance", label: "Shunt resistance", symbol: "R", unit: "ohm", displayUnit: "Ω", kind: "resistor", default: 10, min: 1e-4, max: 1e7, suggestedRange: [0.1, 100] },
    { key: "shuntTolerancePercent", label: "Shunt tolerance", symbol: "t_R", unit: "%", displayUnit: "%", kind: "number", default: 1, min: 0, max: 20 },
    { key: "coverageFactor", label: "Coverage factor", symbol: "k", unit: "", displayUnit: "", kind: "number", default: 2, min: 1, max: 3 },
    // The rest of the chain. Every default switches its term off, so labs made before these existed keep their values.
    { key: "shuntTempcoPpm", label: "Shunt temperature coefficient", symbol: "\\alpha", unit: "", displayUnit: "ppm/K", kind: "number", default: 0, min: 0, max: 5000, suggestedRange: [20, 100], description: "In parts per million per kelvin; 0 leaves the term out." },
    { key: "temperatureChange", label: "Shunt temperature change (± bound)", symbol: "\\Delta T", unit: "K", displayUnit: "K", kind: "number", default: 0, min: 0, max: 200, suggestedRange: [2, 20], description: "How far the shunt's temperature may be from its calibration temperature." },
    { key: "gainErrorPercent", label: "Amplifier gain error (± bound)", symbol: "g", unit: "%", displayUnit: "%", kind: "number", default: 0, min: 0, max: 20, suggestedRange: [0.1, 0.5] },
    { key: "referenceTolerancePercent", label: "Converter reference tolerance (± bound)", symbol: "r", unit: "%", displayUnit: "%", kind: "number", default: 0, min: 0, max: 20, suggestedRange: [0.1, 0.5] },
    { key: "amplifierGain", label: "Amplifier gain", symbol: "G", unit: "", displayUnit: "", kind: "number", default: 1, min: 1e-3, max: 1e6 },
    { key: "adcBits", label: "Converter resolution (0: no converter)", symbol: "N", unit: "", displayUnit: "bits", kind: "integer", default: 0, min: 0, max: 24, suggestedRange: [10, 16] },
    { key: "adcReference", label: "Converter reference voltage", symbol: "V_\\mathrm{ref}", unit: "V", displayUnit: "V", kind: "number", default: TEACHING_REFERENCE_VOLTS, min: 0.1, max: 10 },
    // Nanoamp terms, each off (0) unless the lab sets it.
    { key: "repeatStdDev", label: "Standard deviation of repeated readings (Type A)", symbol: "s", unit: "V", displayUnit: "µV", kind: "number", default: 0, min: 0, max: 10, description: "The experimental standard deviation of the repeated readings; 0 leaves the term out." },
    { key: "repeatCount", label: "Number of repeated readings averaged", symbol: "n", unit: "", displayUnit: "readings", kind: "integer", default: 1, min: 1, max: 100000 },
    { key: "offsetBound", label: "Amplifier input offset at the shunt (± bound)", symbol: "a_\\mathrm{os}", unit: "V", displayUnit: "µV", kind: "number", default: 0, min: 0, max: 1 },
    { key: "biasCurrentBound", label: "Amplifier input bias current (± bound)", symbol: "a_\\mathrm{b}", unit: "A", displayUnit: "pA", kind: "number", default: 0, min: 0, max: 1e-3 },
    { key: "leakageBound", label: "Leakage into the measuring node (± bound)", symbol: "a_\\mathrm{leak}", unit: "A", displayUnit: "pA", kind: "number", default: 0, min: 0, max: 1e-3 },
  ],
  quantities: [
    { key: "current", label: "Current", symbol: "I", unit: "A", displayUnit: "mA", kind: "number", description: "The current, reading divided by the shunt." },
    { key: "relativeStandardUncertaintyPercent", label: "Relative combined standard uncertainty", symbol: "u_{c,r}", unit: "%", displayUnit: "%", kind: "number", description: "The combined standard uncertainty as a percentage of the current." },
    { key: "combinedStandardUncertainty", label: "Combined standard uncertainty", symbol: "u_c", unit: "A", displayUnit: "mA", kind: "number", description: "One standard uncertainty of the current." },
    { key: "expandedUncertainty", label: "Expanded uncertainty", symbol: "U", unit: "A", displayUnit: "mA", kind: "number", description: "The combined standard uncertainty times the coverage factor." },
    { key: "sensitivityReading", label: "Sensitivity coefficient of the reading", symbol: "c_V", unit: "A/V", displayUnit: "A/V", kind: "number", description: "∂I/∂V = 1/R: how much current one volt of reading stands for." },
    { key: "sensitivityShunt", label: "Sensitivity coefficient of the shunt", symbol: "c_R", unit: "A/ohm", displayUnit: "A/Ω", kind: "number", description: "∂I/∂R = −V/R² = −I/R (negative: a larger shunt gives a smaller current)." },
    { key: "readingContribution", label: "Contribution of the reading", symbol: "u_V(I)", unit: "A", displayUnit: "µA", kind: "number", description: "|c_V| times the reading's standard uncertainty." },
    { key: "shuntToleranceContribution", label: "Contribution of the shunt tolerance", symbol: "u_R(I)", unit: "A", displayUnit: "µA", kind: "number", description: "|c_R| times the shunt's standard uncertainty." },
    { key: "tempcoContribution", label: "Contribution of the shunt's temperature coefficient", symbol: "u_\\theta(I)", unit: "A", displayUnit: "µA", kind: "number", description: "|I|·α times the standard uncertainty of the temperature change, ΔT/√3." },
    { key: "gainContribution", label: "Contribution of the amplifier gain error", symbol: "u_G(I)", unit: "A", displayUnit: "µA", kind: "number", description: "|I| times the gain error's standard uncertainty, g/√3." },
    { key: "referenceContribution", label: "Contribution of the reference tolerance", symbol: "u_\\mathrm{ref}(I)", unit: "A", displayUnit: "µA", kind: "number", description: "|I| times the reference's standard uncertainty, r/√3." },
    { key: "quantisationContribution", label: "Contribution of quantisation", symbol: "u_q(I)", unit: "A", displayUnit: "µA", kind: "number", description: "One converter step referred to the shunt, q = V_ref/(2^N·G), over √12, divided by R." },
    { key: "repeatabilityContribution", label: "Contribution of repeatability (Type A)", symbol: "u_A(I)", unit: "A", displayUnit: "pA", kind: "number", description: "The standard deviation of the mean, s/√n, divided by R." },
    { key: "offsetContribution", label: "Contribution of the amplifier's offset", symbol: "u_\\mathrm{os}(I)", unit: "A", displayUnit: "pA", kind: "number", description: "The offset's bound over √3, divided by R." },
    { key: "biasContribution", label: "Contribution of the bias current", symbol: "u_\\mathrm{b}(I)", unit: "A", displayUnit: "pA", kind: "number", description: "The bias current's bound over √3 (it adds to the current directly)." },
    { key: "leakageContribution", label: "Contribution of leakage", symbol: "u_\\mathrm{leak}(I)", unit: "A", displayUnit: "pA", kind: "number", description: "The leakage's bound over √3 (it adds to the current directly)." },
    { key: "dominantContribution", label: "Dominant contribution", symbol: "\\text{dominant}", unit: "", displayUnit: "", kind: "category", choices: [...CONTRIBUTION_KEYS], description: "The source with the largest contribution u_i(I)." },
  ],
  compute(p) {
    const b = uncertaintyBudget(p);
    const byKey = Object.fromEntries(b.rows.map((row) => [row.key, row])) as Record<ContributionKey, BudgetRow>;
    const out: Record<string, number | string> = {
      current: b.current,
      relativeStandardUncertaintyPercent: 100 * b.relCombined,
      combinedStandardUncertainty: b.combined,
      expandedUncertainty: b.expanded,
      sensitivityReading: byKey.reading.sensitivity,
      sensitivityShunt: byKey["shunt tolerance"].sensitivity,
    };
    for (const [q, key] of Object.entries(CONTRIBUTION_QUANTITY)) out[q] = byKey[key].contribution;
    out.dominantContribution = b.dominant;
    return out;
  },
  check(p) {
    const b = uncertaintyBudget(p);
    if (!allPositive(num(p, "reading"), num(p, "shuntResistance"), num(p, "coverageFactor"), num(p, "countSize"))) return "reading, shunt, count size and coverage factor must be positive";
    if (!(num(p, "readingAccuracyPercent") >= 0 && num(p, "readingCounts") >= 0 && num(p, "shuntTolerancePercent") >= 0)) return "accuracies and tolerances cannot be negative";
    const c = chainInputs(p);
    if (!(c.tempcoPpm >= 0 && c.temperatureChange >= 0 && c.gainErrorPercent >= 0 && c.referenceTolerancePercent >= 0 && c.bits >= 0)) return "the chain's coefficients, bounds and resolution cannot be negative";
    if (!allPositive(c.gain, c.vref) || !Number.isInteger(c.bits)) return "the gain and the reference must be positive and the resolution a whole number of bits";
    if (!(c.repeatStdDev >= 0 && c.offsetBound >= 0 && c.biasCurrentBound >= 0 && c.leakageBound >= 0)) return "the standard deviation and the bounds cannot be negative";
    if (!(Number.isInteger(c.repeatCount) && c.repeatCount >= 1)) return "the number of repeated readings must be a whole number, at least 1";
    if (c.bits > 0 && Math.abs(num(p, "reading")) * c.gain > c.vref) return "the amplified reading must stay within the converter's reference";
    if (!allPositive(b.combined)) return "the budget has no uncertainty in it";
    return null;
  },
  solution(p, q) {
    const b = uncertaintyBudget(p);
    const c = chainInputs(p);
    const V = tq(num(p, "reading"), "V"), R = tq(num(p, "shuntResistance"), "ohm");
    const i = Math.abs(b.current);
    const I = [`I = \\frac{V}{R} = \\frac{${V}}{${R}} = ${tq(b.current, "A")}`];
    if (q === "current") return I;
    const reading = [
      `a_V = p\\,|V| + n\\,\\delta = ${tq(num(p, "readingAccuracyPercent"), "%")} \\times ${V} + ${num(p, "readingCounts")} \\times ${tq(num(p, "countSize"), "V")} = ${tq(b.readingBound, "V")}`,
      `u(V) = \\frac{a_V}{\\sqrt{3}} = ${tq(b.readingStandard, "V")},\\quad u_r(V) = ${tq(100 * b.relReading, "%")}`,
    ];
    const shunt = [`u_r(R) = \\frac{${tq(num(p, "shuntTolerancePercent"), "%")}}{\\sqrt{3}} = ${tq(100 * b.relShunt, "%")}`];
    const cV = `c_V = \\frac{\\partial I}{\\partial V} = \\frac{1}{R} = \\frac{1}{${R}} = ${texNumber(1 / num(p, "shuntResistance"))}\\,\\mathrm{A/V}`;
    const cR = `c_R = \\frac{\\partial I}{\\partial R} = -\\frac{V}{R^2} = -\\frac{I}{R} = ${texNumber(-b.current / num(p, "shuntResistance"))}\\,\\mathrm{A/\\Omega}`;
    const rowOf = (key: ContributionKey) => b.rows.find((row) => row.key === key)!;
    const bounded = (key: ContributionKey, name: string, bound: string, viaR: boolean) => {
      const row = rowOf(key);
      return [
        ...I,
        `u(${name}) = \\frac{${bound}}{\\sqrt 3} = ${tq(row.standard, row.unit)}`,
        viaR ? cV : `\\text{it adds to the current: } c = 1`,
        `u(I) = ${viaR ? "\\frac{u}{R}" : "u"} = ${tq(row.contribution, "A")}`,
      ];
    };
    const lines: Record<string, string[]> = {
      readingContribution:
        c.bits > 0
          ? ["\\text{with a converter the reading is its code: gain, reference and step are its rows, so a voltmeter row would count them twice}", "u_V(I) = 0"]
          : [...I, ...reading, cV, `u_V(I) = |c_V|\\,u(V) = ${tq(rowOf("reading").contribution, "A")}`],
      repeatabilityContribution: [
        `u_A(V) = \\frac{s}{\\sqrt n} = \\frac{${tq(c.repeatStdDev, "V")}}{\\sqrt{${c.repeatCount}}} = ${tq(rowOf("repeatability").standard, "V")}`,
        cV,
        `u_A(I) = \\frac{u_A(V)}{R} = ${tq(rowOf("repeatability").contribution, "A")}`,
      ],
      offsetContribution: bounded("offset", "V_\\mathrm{os}", tq(c.offsetBound, "V"), true),
      biasContribution: bounded("bias current", "I_\\mathrm{b}", tq(c.biasCurrentBound, "A"), false),
      leakageContribution: bounded("leakage", "I_\\mathrm{leak}", tq(c.leakageBound, "A"), false),
      shuntToleranceContribution: [...I, ...shunt, cR, `u_R(I) = |c_R|\\,u(R) = |I|\\,u_r(R) = ${tq(rowOf("shunt tolerance").contribution, "A")}`],
      tempcoContribution: [
        ...I,
        `u(\\theta) = \\frac{\\Delta T}{\\sqrt 3} = \\frac{${tq(c.temperatureChange, "K")}}{\\sqrt 3} = ${tq(rowOf("shunt tempco").standard, "K")}`,
        `c_\\theta = \\frac{\\partial I}{\\partial \\theta} = -I\\,\\alpha = -${tq(b.current, "A")} \\times ${texNumber(c.tempcoPpm)}\\times 10^{-6}\\,\\mathrm{K^{-1}}`,
        `u_\\theta(I) = |c_\\theta|\\,u(\\theta) = ${tq(rowOf("shunt tempco").contribution, "A")}`,
      ],
      gainContribution: [...I, `u_G(I) = |I|\\,\\frac{g}{\\sqrt 3} = ${tq(i, "A")} \\times \\frac{${tq(c.gainErrorPercent, "%")}}{\\sqrt 3} = ${tq(rowOf("amplifier gain").contribution, "A")}`],
      referenceContribution: [...I, `u_\\mathrm{ref}(I) = |I|\\,\\frac{r}{\\sqrt 3} = ${tq(i, "A")} \\times \\frac{${tq(c.referenceTolerancePercent, "%")}}{\\sqrt 3} = ${tq(rowOf("reference").contribution, "A")}`],
      quantisationContribution: [
        `q = \\frac{V_\\mathrm{ref}}{2^N\\,G} = \\frac{${tq(c.vref, "V")}}{2^{${c.bits}} \\times ${texNumber(c.gain)}} = ${tq(c.stepAtShunt, "V")}`,
        `u_q(V) = \\frac{q}{\\sqrt{12}} = ${tq(rowOf("quantisation").standard, "V")}`,
        cV,
        `u_q(I) = \\frac{u_q(V)}{R} = ${tq(rowOf("quantisation").contribution, "A")}`,
      ],
      sensitivityReading: [cV],
      sensitivityShunt: [...I, cR],
    };
    if (q in lines) return lines[q];
    const full = b.rows.slice(2).some((row) => row.contribution > 0);
    const budget = full
      ? [...I, budgetTable(b), `u_{c,r} = \\frac{u_c}{|I|} = \\frac{${tq(b.combined, "A")}}{${tq(i, "A")}} = ${tq(100 * b.relCombined, "%")}`]
      : [
          ...I,
          ...reading,
          ...shunt,
          `u_{c,r} = \\sqrt{u_r^2(V) + u_r^2(R)} = \\sqrt{(${texNumber(100 * b.relReading)}\\,\\%)^2 + (${texNumber(100 * b.relShunt)}\\,\\%)^2} = ${tq(100 * b.relCombined, "%")}`,
        ];
    if (q === "relativeStandardUncertaintyPercent") return budget;
    const uc = full ? `u_c = \\sqrt{\\textstyle\\sum_i u_i^2(I)} = ${tq(b.combined, "A")}` : `u_c = u_{c,r}\\,|I| = ${tq(100 * b.relCombined, "%")} \\times ${tq(i, "A")} = ${tq(b.combined, "A")}`;
    if (q === "combinedStandardUncertainty") return [...budget, uc];
    if (q === "expandedUncertainty")
      return [...budget, uc, `U = k\\,u_c = ${texNumber(num(p, "coverageFactor"))} \\times ${tq(b.combined, "A")} = ${tq(b.expanded, "A")}`];
    if (q === "dominantContribution") return [...I, budgetTable(b), `\\text{largest } u_i(I)\\text{: ${b.dominant}}`];
    return [];
  },
  mistakes(p, q) {
    const b = uncertaintyBudget(p);
    const c = chainInputs(p);
    const i = Math.abs(b.current);
    const k = num(p, "coverageFactor");
    const r = num(p, "shuntResistance");
    const relBoundV = b.readingBound / Math.abs(num(p, "reading"));
    const relBoundOs = c.offsetBound / Math.abs(num(p, "reading"));
    const relBoundB = c.biasCurrentBound / i;
    const relBoundL = c.leakageBound / i;
    const relTypeA = c.repeatStdDev / Math.sqrt(c.repeatCount) / Math.abs(num(p, "reading"));
    const relBoundR = num(p, "shuntTolerancePercent") / 100;
    const relBoundT = c.tempcoPpm * 1e-6 * c.temperatureChange;
    const relBoundG = c.gainErrorPercent / 100;
    const relBoundRef = c.referenceTolerancePercent / 100;
    const relBoundQ = c.stepAtShunt / 2 / Math.abs(num(p, "reading"));
    const rel = b.rows.map((row) => row.contribution / i);
    const linearStd = rel.reduce((a, x) => a + x, 0); // standard uncertainties added linearly
    const linearBounds = relBoundV + relBoundR + relBoundT + relBoundG + relBoundRef + relBoundQ + relBoundOs + relBoundB + relBoundL + relTypeA; // bounds added linearly
    const noRoot3 = Math.hypot(relBoundV, relBoundR, relBoundT, relBoundG, relBoundRef, relBoundQ, relBoundOs, relBoundB, relBoundL, relTypeA); // bounds used as standard uncertainties
    const lin = "You added the relative terms linearly; independent terms add in quadrature: √(Σ u_r²).";
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
    const bound: Record<string, number> = {
      readingContribution: relBoundV, shuntToleranceContribution: relBoundR, tempcoContribution: relBoundT, gainContribution: relBoundG, referenceContribution: relBoundRef,
      offsetContribution: relBoundOs, biasContribution: relBoundB, leakageContribution: relBoundL,
    };
    if (q in bound && bound[q] > 0) out.push({ key: "no-root-three", value: i * bound[q], detail: root3 });
    if (q === "quantisationContribution" && c.stepAtShunt > 0) {
      out.push({ key: "step-not-halved", value: c.stepAtShunt / Math.sqrt(3) / r, detail: "You divided the whole step by √3; rounding spreads over ±q/2, so u = q/√12." });
      out.push({ key: "no-root-three", value: c.stepAtShunt / 2 / r, detail: "You used the half-step q/2 itself as the standard uncertainty; divide it by √3 (q/√12 in all)." });
    }
    if (q === "repeatabilityContribution" && c.repeatCount > 1 && c.repeatStdDev > 0)
      out.push({ key: "no-root-n", value: c.repeatStdDev / r, detail: "You used the standard deviation of one reading, s; the mean of n readings has s/√n." });
    if (q === "sensitivityShunt") out.push({ key: "sign-flip", value: b.current / r, detail: "A larger shunt gives a smaller current for the same reading: ∂I/∂R = −I/R is negative." });
    return out;
  },
  bandFloor(p, q, rel) {
    // a contribution the lab switches off is exactly zero: accept a small answer near it. A contribution that
    // is small but not zero keeps its plain relative band, or a tenfold slip on it would pass (PHYSICS.md §17 17k)
    if (!(q in CONTRIBUTION_QUANTITY)) return 0;
    const b = uncertaintyBudget(p);
    const row = b.rows.find((r) => r.key === CONTRIBUTION_QUANTITY[q]);
    return row && row.contribution === 0 ? 0.1 * rel * b.combined : 0;
  },
};
