// Verdicts as words, icons and colours (never colour alone), and the values a feedback row shows.
// Pure, so the lab page (server) and the feedback page (client) share it and the unit tests run it.
import { formatQuantity } from "@/lib/grader/format";

export type VerdictKey = "correct" | "close" | "mistake" | "unit" | "wrong" | "missing";

export const VERDICTS: Record<VerdictKey, { word: string; icon: string; text: string; bg: string; border: string }> = {
  correct: { word: "Correct", icon: "✓", text: "text-verdict-correct", bg: "bg-verdict-correct/10", border: "border-verdict-correct" },
  close: { word: "Close", icon: "≈", text: "text-verdict-close", bg: "bg-verdict-close/10", border: "border-verdict-close" },
  mistake: { word: "Recognised mistake", icon: "!", text: "text-verdict-mistake", bg: "bg-verdict-mistake/10", border: "border-verdict-mistake" },
  unit: { word: "Wrong kind of unit", icon: "⊘", text: "text-verdict-wrong", bg: "bg-verdict-wrong/10", border: "border-verdict-wrong" },
  wrong: { word: "Not accepted", icon: "✗", text: "text-verdict-wrong", bg: "bg-verdict-wrong/10", border: "border-verdict-wrong" },
  missing: { word: "No answer", icon: "–", text: "text-verdict-neutral", bg: "bg-verdict-neutral/10", border: "border-verdict-neutral" },
};

export const VERDICT_ORDER: VerdictKey[] = ["correct", "close", "mistake", "unit", "wrong", "missing"];

export function verdictInfo(v: string) {
  return VERDICTS[(v in VERDICTS ? v : "wrong") as VerdictKey];
}

/** How many questions got each verdict. */
export function verdictCounts(results: { verdict: string }[]): Record<VerdictKey, number> {
  const out = { correct: 0, close: 0, mistake: 0, unit: 0, wrong: 0, missing: 0 } as Record<VerdictKey, number>;
  for (const r of results) out[(r.verdict in out ? r.verdict : "wrong") as VerdictKey]++;
  return out;
}

/** "3 correct, 1 close, 1 recognised mistake": only the verdicts that occur. */
export function verdictSummary(results: { verdict: string }[]): string {
  const c = verdictCounts(results);
  const parts = VERDICT_ORDER.filter((k) => c[k] > 0).map((k) => `${c[k]} ${VERDICTS[k].word.toLowerCase()}`);
  return parts.join(", ") || "no questions";
}

/** A score as people write it: up to two decimals, no trailing zeros. */
export function points(n: number): string {
  return String(Math.round(n * 100) / 100);
}

export interface ResultValues {
  unit: string;
  displayUnit: string;
  answer: number | string | null;
  readAs?: string;
  expected?: number | string;
  band?: [number, number] | null;
}

function showValue(v: number | string, unit: string, displayUnit: string): string {
  if (typeof v === "string") return v.replace(/^u(?=A$|$)/, "µ");
  return formatQuantity(v, unit, displayUnit ? { displayUnit } : undefined);
}

/** What the student answered: the grader's reading, else the typed text, else "no answer". */
export function studentValue(r: ResultValues, typed?: string | null): string {
  if (r.readAs) return r.readAs;
  if (typeof r.answer === "number") return formatQuantity(r.answer, r.unit);
  if (typeof r.answer === "string" && r.answer) return showValue(r.answer, r.unit, r.displayUnit);
  if (typed && typed.trim()) return `“${typed.trim()}”`;
  return "no answer";
}

export function expectedValue(r: ResultValues): string | null {
  if (r.expected === undefined || r.expected === null) return null;
  return showValue(r.expected, r.unit, r.displayUnit);
}

/** The acceptance band, "from 9.01 µA to 9.19 µA", in the quantity's display unit. */
export function bandText(r: ResultValues): string | null {
  if (!r.band) return null;
  const [lo, hi] = r.band;
  return `from ${showValue(lo, r.unit, r.displayUnit)} to ${showValue(hi, r.unit, r.displayUnit)}`;
}

/** Score line with the late penalty spelt out. */
export function scoreLine(a: { score: number; rawScore: number; maxScore: number; lateDays: number; penaltyPercent: number }): string {
  const base = `${points(a.score)} of ${points(a.maxScore)} points`;
  if (!(a.penaltyPercent > 0)) return base;
  return `${base} (${points(a.rawScore)} before a late penalty of ${points(a.penaltyPercent)} % for ${a.lateDays} day${a.lateDays === 1 ? "" : "s"} late)`;
}
