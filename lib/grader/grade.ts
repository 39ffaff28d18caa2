// Grading an attempt: expected values from the student's parameters, acceptance bands, verdicts,
// recognised mistakes, feedback and worked solutions.
import { z } from "zod";
import type { MistakeCandidate, MistakeKey, Params, QuantitySpec, QuantityValue, Template, TemplateKey } from "./types";
import { templates } from "./templates";
import { parseQuantity } from "./units";
import { formatQuantity, texQuantity } from "./format";
import { MISTAKES } from "./mistakes";
import { graderVersion } from "./constants";

export const questionSchema = z.object({
  /** optional id, used to look up the reading when readings are keyed */
  id: z.string().optional(),
  quantity: z.string(),
  kind: z.enum(["prediction", "bench"]),
  /** in steps of one half, as staff regrade them; at most 1000 (scores are stored as 4-byte floats) */
  points: z
    .number()
    .min(0)
    .max(1000, "At most 1000 points.")
    .refine((p) => Number.isInteger(p * 2), "Points go in steps of one half (for example 1.5)."),
  /** overrides the policy's relative tolerance for this question, in percent */
  tolerancePercent: z.number().positive().optional(),
});
export type Question = z.infer<typeof questionSchema>;

export const gradePolicySchema = z.object({
  relativeTolerance: z.number().positive().default(0.01),
  closeMultiple: z.number().min(1).default(2),
  closeCredit: z.number().min(0).max(1).default(0.5),
  /** parameter key → tolerance in percent (resistor tolerances) */
  componentTolerances: z.record(z.string(), z.number().min(0)).optional(),
  /** accuracy of the student's instrument for bench readings, percent of reading */
  instrumentAccuracyPercent: z.number().min(0).optional(),
});
export type GradePolicy = z.input<typeof gradePolicySchema>;

export type Verdict = "correct" | "close" | "mistake" | "unit" | "wrong" | "missing";
export type Reading = string | number | null | undefined;

export interface GradeInput {
  template: TemplateKey | Template;
  params: Params;
  questions: Question[];
  /** one reading per question (same order), or keyed by question id, else by quantity key */
  readings: Reading[] | Record<string, Reading>;
  /** measured values of the student's components; bench expected values are recomputed from them */
  measuredParams?: Params;
  policy?: GradePolicy;
}

export interface QuestionResult {
  id?: string;
  quantity: string;
  kind: "prediction" | "bench";
  verdict: Verdict;
  points: number;
  maxPoints: number;
  expected: QuantityValue;
  /** [lo, hi] in SI; null for a category answer */
  band: [number, number] | null;
  /** the answer as read (SI number or category text), null when missing or unreadable */
  answer: number | string | null;
  /** the answer echoed back in words, e.g. "9.10 µA" */
  readAs?: string;
  mistake?: MistakeKey;
  /** how the band was set, in words */
  method: string;
  feedback: string;
  solution: string[];
}

export interface GradeResult {
  template: TemplateKey;
  score: number;
  maxScore: number;
  graderVersion: string;
  results: QuestionResult[];
}

const NON_PREFIX_DISPLAY = new Set(["h", "d", "min", "mAh", "Ah", "°C"]);

function fmt(v: number, spec: QuantitySpec): string {
  return formatQuantity(v, spec.unit, NON_PREFIX_DISPLAY.has(spec.displayUnit) ? { displayUnit: spec.displayUnit } : undefined);
}

function normaliseCategory(s: string): string {
  return s
    .trim()
    .toLowerCase()
    .replace(/[µμ]/g, "u")
    .replace(/\s+/g, "")
    .replace(/range$/, "");
}

function lookupReading(input: GradeInput, q: Question, index: number): Reading {
  const r = input.readings;
  if (Array.isArray(r)) return r[index];
  if (q.id !== undefined && q.id in r) return r[q.id];
  return r[q.quantity];
}

function pct(x: number): string {
  return `${Number((100 * x).toPrecision(3))} %`;
}

/** Per-attempt cache of computed values for the nominal, measured and perturbed parameter sets. */
class Evaluator {
  private cache = new Map<string, Record<string, QuantityValue>>();
  constructor(private t: Template) {}
  private solutions = new Map<string, string[]>();
  /** the worked solution for a quantity, as a fresh array (callers append the student's answer) */
  solution(tag: string, p: Params, quantity: string): string[] {
    const key = `${tag}:${quantity}`;
    let s = this.solutions.get(key);
    if (!s) {
      s = this.t.solution(p, quantity);
      this.solutions.set(key, s);
    }
    return s.slice();
  }
  values(tag: string, p: Params): Record<string, QuantityValue> {
    let v = this.cache.get(tag);
    if (!v) {
      v = this.t.compute(p);
      this.cache.set(tag, v);
    }
    return v;
  }
}

function withParam(p: Params, key: string, value: number): Params {
  const out: Params = {};
  for (const k in p) out[k] = p[k];
  out[key] = value;
  return out;
}

/**
 * Worst-case first-order propagation: Σ |∂q/∂x_i| · Δx_i over the toleranced parameters, with central
 * numerical derivatives (relative step 1e-6).
 */
function propagate(t: Template, ev: Evaluator, tag: string, p: Params, q: string, tolerances: Record<string, number>, skip: Params | undefined): number {
  let sum = 0;
  for (const key in tolerances) {
    const tol = tolerances[key];
    const x = p[key];
    if (!(tol > 0) || typeof x !== "number" || x === 0 || (skip && key in skip)) continue;
    const h = Math.abs(x) * 1e-6;
    const at = (v: number, side: string): number => {
      const actual = withParam(p, key, v);
      const bench = t.benchValue?.(p, actual, q);
      return bench !== undefined ? bench : (ev.values(`${tag}${side}${key}`, actual)[q] as number);
    };
    const up = at(x + h, "+");
    const down = at(x - h, "-");
    const d = (up - down) / (2 * h);
    if (Number.isFinite(d)) sum += Math.abs(d) * Math.abs(x) * (tol / 100);
  }
  return sum;
}

/**
 * Half-width of the band from an instrument accurate to ±`percent` % of each reading: Σ|∂q/∂r|·|r|·percent/100
 * over the readings the quantity is worked out from (worst case, first order), or percent/100·|q| when the
 * quantity itself is read.
 */
export function instrumentHalfWidth(t: Template, p: Params, quantity: string, expected: number, percent: number): { half: number; readings: string[] } {
  if (!(percent > 0)) return { half: 0, readings: [] };
  const read = t.instrumentReadings?.(p, quantity);
  if (!read) return { half: (percent / 100) * Math.abs(expected), readings: [] };
  let sum = 0;
  for (const [name, r] of Object.entries(read.values)) {
    if (r === 0) continue;
    const h = Math.abs(r) * 1e-6;
    const d = (read.formula({ ...read.values, [name]: r + h }) - read.formula({ ...read.values, [name]: r - h })) / (2 * h);
    if (Number.isFinite(d)) sum += Math.abs(d) * Math.abs(r) * (percent / 100);
  }
  return { half: sum, readings: Object.keys(read.values) };
}

function paramLabel(t: Template, key: string): string {
  return t.parameters.find((p) => p.key === key)?.label.toLowerCase() ?? key;
}

/**
 * Grade one attempt. Throws only for a lab configuration error: parameters the template cannot compute, or a
 * question naming a quantity the template does not have. Measured values that do not describe a working
 * circuit are ignored (with a note in the feedback).
 */
export function gradeAttempt(input: GradeInput): GradeResult {
  const t = typeof input.template === "string" ? templates[input.template] : input.template;
  if (!t) throw new Error(`Unknown template "${String(input.template)}"`);
  const policy = input.policy ?? {};
  const relDefault = policy.relativeTolerance ?? 0.01;
  const closeMultiple = policy.closeMultiple ?? 2;
  const closeCredit = policy.closeCredit ?? 0.5;
  const tolerances = policy.componentTolerances ?? {};
  const instrument = policy.instrumentAccuracyPercent ?? 0;
  const nominalProblem = t.check(input.params);
  if (nominalProblem !== null) throw new Error(`Template "${t.key}" cannot grade these parameters: ${nominalProblem}`);
  let measured = input.measuredParams && Object.keys(input.measuredParams).length > 0 ? input.measuredParams : undefined;
  let benchParams = input.params;
  let measuredNote = "";
  if (measured) {
    benchParams = {};
    for (const k in input.params) benchParams[k] = input.params[k];
    for (const k in measured) benchParams[k] = measured[k];
    const problem = t.check(benchParams);
    if (problem !== null) {
      // the student's measured values do not describe a working circuit: grade against the nominal one
      measuredNote = ` Your measured component values were not used (${problem}); the nominal values were.`;
      measured = undefined;
      benchParams = input.params;
    }
  }
  const ev = new Evaluator(t);

  const results: QuestionResult[] = [];
  let score = 0;
  let maxScore = 0;
  input.questions.forEach((q, index) => {
    const spec = t.quantities.find((s) => s.key === q.quantity);
    if (!spec) throw new Error(`Template "${t.key}" has no quantity "${q.quantity}"`);
    const bench = q.kind === "bench";
    const tag = bench && measured ? "measured" : "nominal";
    const p = bench && measured ? benchParams : input.params;
    const expected = ev.values(tag, p)[q.quantity];
    const reading = lookupReading(input, q, index);
    const r = spec.kind === "category" ? gradeCategory(t, spec, p, q, expected as string, reading, ev, tag) : gradeNumber(t, spec, p, q, expected as number, reading, {
      ev, tag, rel: q.tolerancePercent !== undefined ? q.tolerancePercent / 100 : relDefault,
      closeMultiple, closeCredit, tolerances, instrument, measured,
    });
    if (bench && measuredNote) r.feedback += measuredNote;
    r.maxPoints = q.points;
    r.points = r.verdict === "correct" ? q.points : r.verdict === "close" ? q.points * closeCredit : 0;
    if (q.id !== undefined) r.id = q.id;
    score += r.points;
    maxScore += q.points;
    results.push(r);
  });
  return { template: t.key, score, maxScore, graderVersion, results };
}

function missing(q: Question, expected: QuantityValue, band: [number, number] | null, method: string, solution: string[]): QuestionResult {
  return { quantity: q.quantity, kind: q.kind, verdict: "missing", points: 0, maxPoints: q.points, expected, band, answer: null, method, feedback: "No answer was given.", solution };
}

function showCategory(v: string): string {
  return v.replace(/^u/, "µ");
}

/**
 * Why a typed answer to a quantity of `template` cannot be graded, or null when it can (a blank is
 * "no answer" and can). An unreadable value, a value of the wrong kind and a category that is not one of
 * the choices are never graded: the submission is refused and the student fixes it.
 */
export function readingProblem(template: TemplateKey, quantity: string, reading: Reading): string | null {
  const spec = templates[template]?.quantities.find((s) => s.key === quantity);
  if (!spec || reading === null || reading === undefined || typeof reading === "number") return null;
  const typed = String(reading).trim();
  if (typed === "") return null;
  if (spec.kind === "category") {
    const choices = spec.choices ?? [];
    return choices.map(normaliseCategory).includes(normaliseCategory(typed)) ? null : `Choose one of: ${choices.map(showCategory).join(", ")}.`;
  }
  const r = parseQuantity(typed, spec.unit);
  return r.ok || r.reason === "empty" ? null : r.message;
}

function gradeCategory(t: Template, spec: QuantitySpec, p: Params, q: Question, expected: string, reading: Reading, ev: Evaluator, tag: string): QuestionResult {
  const solution = ev.solution(tag, p, q.quantity);
  const method = "exact match";
  if (reading === null || reading === undefined || String(reading).trim() === "") return missing(q, expected, null, method, solution);
  const typed = String(reading).trim();
  const answer = normaliseCategory(typed);
  solution.push(`\\text{your answer: } \\text{${typed.replace(/[µμ]/g, "u").replace(/[^A-Za-z0-9 ]/g, "")}}`);
  const r: QuestionResult = { quantity: q.quantity, kind: q.kind, verdict: "wrong", points: 0, maxPoints: q.points, expected, band: null, answer: typed, method, feedback: "", solution };
  if (answer === normaliseCategory(expected)) {
    r.answer = expected;
    return finish(r, "correct", `Correct: ${showCategory(expected)}.`);
  }
  for (const c of t.mistakes(p, q.quantity)) {
    if (typeof c.value === "string" && normaliseCategory(c.value) === answer) {
      const m = MISTAKES[c.key];
      r.answer = c.value;
      r.mistake = c.key;
      return finish(r, "mistake", `${c.title ?? m.title}. ${c.detail ?? m.explain} ${m.fix}`);
    }
  }
  const known = spec.choices?.map(normaliseCategory).includes(answer);
  return finish(
    r,
    "wrong",
    known
      ? `Not accepted: the answer is ${showCategory(expected)}. Compare your steps with the worked solution.`
      : `"${typed}" is not one of the choices (${(spec.choices ?? []).map(showCategory).join(", ")}); the answer is ${showCategory(expected)}.`,
  );
}

interface NumberContext {
  ev: Evaluator;
  tag: string;
  rel: number;
  closeMultiple: number;
  closeCredit: number;
  tolerances: Record<string, number>;
  instrument: number;
  measured?: Params;
}

function finish(r: QuestionResult, verdict: Verdict, feedback: string): QuestionResult {
  r.verdict = verdict;
  r.feedback = feedback;
  return r;
}

function bandRange(band: [number, number], spec: QuantitySpec): string {
  return `${fmt(band[0], spec)} to ${fmt(band[1], spec)}`;
}

function prefixSlips(expected: number): MistakeCandidate[] {
  return [1e3, 1e-3, 1e6, 1e-6].map((f) => ({ key: "prefix-slip" as const, value: expected * f }));
}

function gradeNumber(t: Template, spec: QuantitySpec, p: Params, q: Question, expected: number, reading: Reading, c: NumberContext): QuestionResult {
  const exact = t.exactBand?.(p, q.quantity);
  const floor = t.bandFloor?.(p, q.quantity, c.rel) ?? 0;
  const labHalf = Math.max(exact ?? c.rel * Math.abs(expected), floor);
  let half = labHalf;
  const floored = floor > (exact ?? c.rel * Math.abs(expected));
  const labText =
    exact !== undefined && !floored
      ? `±${fmt(exact, spec)}`
      : floored
        ? `±${fmt(floor, spec)} floor near zero, wider than the ${exact !== undefined ? `±${fmt(exact, spec)} band` : `±${pct(c.rel)} lab tolerance`}`
        : `±${pct(c.rel)} lab tolerance`;
  let method = floored ? "floor near zero" : exact !== undefined ? `fixed band ${labText}` : "lab tolerance";
  let bandText = labText;

  if (q.kind === "bench") {
    const propagated = spec.discrete ? 0 : propagate(t, c.ev, c.tag, p, q.quantity, c.tolerances, c.measured);
    const instrument = instrumentHalfWidth(t, p, q.quantity, expected, c.instrument);
    const instrumentHalf = instrument.half;
    const worst = propagated + instrumentHalf;
    const parts: string[] = [];
    for (const key in c.tolerances)
      if (c.tolerances[key] > 0 && !(c.measured && key in c.measured) && typeof p[key] === "number") parts.push(`${paramLabel(t, key)} ±${c.tolerances[key]} %`);
    if (c.instrument > 0) parts.push(instrument.readings.length ? `instrument ±${c.instrument} % on each reading (${instrument.readings.join(", ")})` : `instrument ±${c.instrument} %`);
    const what = parts.length ? parts.join(", ") : "no component or instrument tolerances";
    const measuredText = c.measured ? " Expected value recomputed from your measured component values." : "";
    if (worst > half) {
      half = worst;
      method = "worst-case first-order propagation";
      bandText = `±${Math.abs(expected) > 0 ? pct(worst / Math.abs(expected)) : fmt(worst, spec)}: the wider of the ${labText} and a worst-case first-order propagation, Σ|∂q/∂x|·Δx, of ${what}.${measuredText}`;
    } else {
      method = exact !== undefined || floored ? method : "lab tolerance (wider than the propagated component tolerances)";
      bandText = `${labText}, wider than a worst-case first-order propagation of ${what}.${measuredText}`;
    }
    if (spec.counted) {
      // a count on the bench is a whole number: the one below and the one above are both what a careful
      // student sees, as the edges fall between samples (PHYSICS.md §16)
      const lo = Math.floor(expected * (1 + 1e-12)), hi = Math.ceil(expected * (1 - 1e-12));
      const countHalf = Math.max(expected - lo, hi - expected);
      if (countHalf > half) {
        half = countHalf;
        method = "whole counts either side";
        bandText = `${fmt(lo, spec)} or ${fmt(hi, spec)} counted: a count is a whole number, and where the burst's edges fall decides which one you see`;
      }
    }
  }
  const band: [number, number] = [expected - half, expected + half];
  const solution = c.ev.solution(c.tag, p, q.quantity);

  // read the answer
  let answer: number;
  let readAs: string | undefined;
  if (reading === null || reading === undefined || (typeof reading === "string" && reading.trim() === "")) return missing(q, expected, band, method, solution);
  if (typeof reading === "number") {
    if (!Number.isFinite(reading)) return missing(q, expected, band, method, solution);
    answer = reading;
  } else {
    const parsed = parseQuantity(reading, spec.unit);
    if (!parsed.ok) {
      if (parsed.reason === "empty") return missing(q, expected, band, method, solution);
      const verdict: Verdict = parsed.reason === "dimension" || parsed.hint === "no-unit" ? "unit" : "wrong";
      return { quantity: q.quantity, kind: q.kind, verdict, points: 0, maxPoints: q.points, expected, band, answer: null, method, feedback: `${parsed.message} The answer is ${fmt(expected, spec)}.`, solution };
    }
    answer = parsed.value;
    readAs = fmt(answer, spec);
  }
  const note = t.answerNote?.(p, q.quantity, answer);
  const read = (readAs ? `Read as ${readAs}. ` : "") + (note ? `${note} ` : "");
  solution.push(`\\text{your answer: } ${texQuantity(answer, spec.unit, NON_PREFIX_DISPLAY.has(spec.displayUnit) ? { displayUnit: spec.displayUnit } : undefined)}`);
  const slack = 1e-12 * Math.max(Math.abs(expected), half);
  const out: QuestionResult = { quantity: q.quantity, kind: q.kind, verdict: "wrong", points: 0, maxPoints: q.points, expected, band, answer, method, feedback: "", solution };
  if (readAs) out.readAs = readAs;

  if (Math.abs(answer - expected) <= half + slack)
    return finish(out, "correct", `${read}Correct: within the accepted band ${bandRange(band, spec)} (${bandText.replace(/\.$/, "")}).`);

  // recognised wrong methods: count only when the correct value is not also inside the candidate's band
  // a mistake's window scales with the relative band before any floor near zero (PHYSICS.md §17): a floor
  // set for the expected value is absolute, and scaled by a large wrong value it would swallow the right one's
  // neighbourhood; the floor stays as the window's minimum
  const unfloored = Math.max(exact ?? c.rel * Math.abs(expected), q.kind === "bench" && method === "worst-case first-order propagation" ? half : 0);
  const relHalf = expected !== 0 ? unfloored / Math.abs(expected) : c.rel;
  const candidates = t.mistakes(p, q.quantity);
  if (spec.unit !== "" && spec.unit !== "%") candidates.push(...prefixSlips(expected));
  // a capital M (mega, 10⁶) typed for a lowercase m (milli, 10⁻³): a factor of 10⁹, worth naming
  if (typeof reading === "string" && /\dM|\sM/.test(reading.trim()) && spec.unit !== "ohm")
    candidates.push({
      key: "prefix-slip",
      value: expected * 1e9,
      detail: "Your number is 10⁹ times too large: you wrote a capital M, which is mega (10⁶); milli (10⁻³) is a lowercase m. SI prefixes are case-sensitive.",
    });
  for (const m of candidates) {
    if (typeof m.value !== "number" || !Number.isFinite(m.value)) continue;
    const cHalf = Math.max(exact ?? relHalf * Math.abs(m.value), floor);
    if (Math.abs(expected - m.value) <= cHalf + slack) continue;
    if (Math.abs(answer - m.value) <= cHalf) {
      const info = MISTAKES[m.key];
      out.mistake = m.key;
      return finish(out, "mistake", `${read}${m.title ?? info.title}. ${m.detail ?? info.explain} ${info.fix} The answer is ${fmt(expected, spec)}.`);
    }
  }
  if (Math.abs(answer - expected) <= c.closeMultiple * half + slack)
    return finish(
      out,
      "close",
      `${read}Close: ${fmt(answer, spec)} is outside the accepted band ${bandRange(band, spec)} (${bandText.replace(/\.$/, "")}) but within ${c.closeMultiple}× of it, so it earns ${Math.round(100 * c.closeCredit)} % of the points. Check your rounding and the values you used; the answer is ${fmt(expected, spec)}.`,
    );
  return finish(out, "wrong", `${read}Not accepted: the answer is ${fmt(expected, spec)} (accepted ${bandRange(band, spec)}). Compare your steps with the worked solution.`);
}
