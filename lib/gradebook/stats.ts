// Pure helpers for the gradebook's statistics: histogram bins and the questions most students missed.
import type { QuestionStatistics } from "@/db/queries/gradebook";

/** Counts of percentages in `bins` equal bins over 0–100 (100 falls in the last bin). */
export function histogram(percents: number[], bins = 10): { from: number; to: number; count: number }[] {
  const width = 100 / bins;
  const out = Array.from({ length: bins }, (_, i) => ({ from: i * width, to: (i + 1) * width, count: 0 }));
  for (const p of percents) {
    const i = Math.min(bins - 1, Math.max(0, Math.floor(p / width)));
    out[i].count++;
  }
  return out;
}

/**
 * Students who submitted the lab and missed the question: a recognised mistake, a wrong answer, or no
 * answer. Students who did not submit at all say nothing about the teaching, so they are left out.
 */
export const missedCount = (q: Pick<QuestionStatistics, "mistake" | "wrong" | "missing" | "notSubmitted">) => q.mistake + q.wrong + q.missing - q.notSubmitted;

/** Students who submitted the lab. */
export const answeredCount = (q: Pick<QuestionStatistics, "correct" | "close" | "mistake" | "wrong" | "missing" | "notSubmitted">) =>
  q.correct + q.close + q.mistake + q.wrong + q.missing - q.notSubmitted;

/** The `n` questions that most submitting students missed (ties: more recognised mistakes first, then lab order). */
export function mostMissed<Q extends QuestionStatistics>(qs: Q[], n = 3): Q[] {
  return qs
    .map((q, i) => ({ q, i }))
    .filter(({ q }) => missedCount(q) > 0)
    .sort((a, b) => missedCount(b.q) - missedCount(a.q) || b.q.mistake - a.q.mistake || a.i - b.i)
    .slice(0, n)
    .map(({ q }) => q);
}
