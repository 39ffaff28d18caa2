// Staff points over the grader's. The grader's own points stay in the stored result (`graderPoints`), so a
// recomputation can apply the same overrides again. Pure: no framework or database imports.
import type { StaffOverride } from "@/db/types";
import type { StoredResult } from "./visible-results";

export type { StaffOverride };
export type Overrides = Record<string, StaffOverride>;

type Stored = StoredResult & { params?: unknown };

/** Total points, rounded to a thousandth so sums of halves and grader fractions stay clean. */
export const roundPoints = (p: number) => Math.round(p * 1000) / 1000;

/**
 * The result with each overridden question's points replaced by the staff's, the grader's points kept
 * beside them, and the raw total. Questions without an override get the grader's points back.
 */
export function applyOverrides<T extends Stored>(result: T, overrides: Overrides): { result: T; rawScore: number; applied: string[] } {
  const applied: string[] = [];
  const results = result.results.map((r, i) => {
    const id = r.id ?? `q${i + 1}`;
    const graderPoints = (r as { graderPoints?: number }).graderPoints ?? r.points;
    const o = overrides[id];
    // strip a previous override's fields, then apply the current one
    const { override: _o, graderPoints: _g, ...plain } = r as typeof r & { override?: unknown; graderPoints?: number };
    void _o;
    void _g;
    if (!o) return { ...plain, points: graderPoints };
    applied.push(id);
    return { ...plain, points: Math.min(o.points, r.maxPoints), graderPoints, override: { points: o.points, reason: o.reason, at: o.at } };
  });
  const rawScore = roundPoints(results.reduce((s, r) => s + r.points, 0));
  return { result: { ...result, results, score: rawScore }, rawScore, applied };
}

/** A review request is open when it was asked and not answered since (a student may ask again after an answer). */
export function reviewIsOpen(a: { reviewRequestedAt: Date | string | null; reviewAnsweredAt: Date | string | null }): boolean {
  if (!a.reviewRequestedAt) return false;
  return !a.reviewAnsweredAt || new Date(a.reviewAnsweredAt).getTime() < new Date(a.reviewRequestedAt).getTime();
}
