// Questions whose accepted band cannot tell the right value from a tenth of it: a bench reading whose
// instrument accuracy, propagated through the readings, is wider than the value itself (a guarded error of
// half a percent read with a ±0.5 % meter), or a prediction that can sit so near zero that the band's floor
// sets it. The grader keeps such bands honest (a careful student is never failed for what the instrument
// cannot resolve); the lab builder shows these warnings so the instructor can ask the question another way.
import { gradeAttempt, type GradePolicy, type Question } from "./grade";
import { templates } from "./templates";
import { componentTolerancesFromSpec, drawVariant, type VariantSpec } from "./variant";

export interface BandWarning {
  /** the question's position in the lab */
  index: number;
  quantity: string;
  kind: "prediction" | "bench";
  /** drawn circuits in which one tenth of the right value still earns points, of `drawn` */
  failing: number;
  drawn: number;
  message: string;
}

/**
 * Draws `draws` circuits from the lab's spec (fixed seeds, so the answer does not change between calls)
 * and grades one tenth of each expected value; a question that gives points for it in any draw is named.
 * A spec that cannot be drawn gives no warnings (the builder reports that elsewhere).
 */
export function bandWarnings(spec: VariantSpec, questions: Question[], policy: GradePolicy = {}, draws = 40): BandWarning[] {
  const t = templates[spec.template];
  if (!t || questions.length === 0) return [];
  const full: GradePolicy = { ...policy, componentTolerances: { ...componentTolerancesFromSpec(spec), ...(policy.componentTolerances ?? {}) } };
  const failing = questions.map(() => 0);
  const how = questions.map(() => "");
  for (let i = 0; i < draws; i++) {
    let params;
    try {
      params = drawVariant(spec, `band-check-${i}`);
    } catch {
      return [];
    }
    const values = t.compute(params);
    const readings = questions.map((q) => {
      const v = values[q.quantity];
      return typeof v === "number" && v !== 0 && Number.isFinite(v) ? v / 10 : null;
    });
    const graded = gradeAttempt({ template: t, params, questions, readings, policy: full }).results;
    graded.forEach((r, k) => {
      if (readings[k] !== null && (r.verdict === "correct" || r.verdict === "close")) {
        failing[k]++;
        how[k] = r.method;
      }
    });
  }
  const out: BandWarning[] = [];
  questions.forEach((q, index) => {
    if (failing[index] === 0) return;
    const label = t.quantities.find((s) => s.key === q.quantity)?.label ?? q.quantity;
    const why = how[index].includes("propagation")
      ? "the instrument's accuracy on the readings it is worked out from is wider than the value itself. Ask it as a prediction, or give a more accurate instrument."
      : how[index].includes("counts")
        ? "a burst holds only a few samples, and either whole count around the value is right. Give the bursts more samples (a longer burst or a faster logger)."
        : how[index].includes("floor")
        ? "the value can come out so near zero that the band's floor sets it. Keep the parameter ranges away from the values that make it zero."
        : "the accepted band is wider than the value itself. Narrow the tolerance.";
    out.push({
      index,
      quantity: q.quantity,
      kind: q.kind,
      failing: failing[index],
      drawn: draws,
      message: `${label} (${q.kind === "bench" ? "bench reading" : "prediction"}): in ${failing[index]} of ${draws} drawn circuits an answer one tenth of the right value would still earn points, because ${why}`,
    });
  });
  return out;
}
