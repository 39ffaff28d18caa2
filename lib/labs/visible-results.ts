// What a viewer may see of a graded attempt. Students see expected values, bands and worked solutions
// only when the lab allows it; staff always do. Pure: no framework or database imports.
import { MISTAKES, templates, type GradeResult, type QuestionResult, type TemplateKey } from "@/lib/grader";

export interface PresentedResult {
  questionId: string;
  quantity: string;
  label: string;
  unit: string;
  displayUnit: string;
  kind: "prediction" | "bench";
  verdict: QuestionResult["verdict"];
  points: number;
  maxPoints: number;
  answer: number | string | null;
  readAs?: string;
  mistake?: { key: string; title: string; explain: string; fix: string };
  feedback: string;
  method?: string;
  expected?: number | string;
  band?: [number, number] | null;
  solution?: string[];
  traceNote?: string;
  /** points set by staff over the grader's, with their reason */
  override?: { points: number; graderPoints: number; reason: string; at: string; keptAt?: string };
}

export interface StoredResult extends GradeResult {
  results: (QuestionResult & { id?: string; traceNote?: string; graderPoints?: number; override?: { points: number; reason: string; at: string; keptAt?: string } })[];
}

/** Feedback that does not give the answer away, for labs that hide expected values. */
function guardedFeedback(r: QuestionResult): string {
  const read = r.readAs ? `Read as ${r.readAs}. ` : "";
  switch (r.verdict) {
    case "correct":
      return `${read}Correct.`;
    case "close":
      return `${read}Close: just outside the accepted band, so it earns partial credit. Check your rounding and the values you used.`;
    case "mistake": {
      const m = r.mistake ? MISTAKES[r.mistake] : undefined;
      return m ? `${read}${m.title}. ${m.explain} ${m.fix}` : `${read}A recognised wrong method.`;
    }
    case "unit":
      return "That answer has the wrong kind of unit for this quantity (for example a voltage where a current is asked).";
    case "missing":
      return "No answer was given.";
    default:
      return `${read}Not accepted. Go through your steps again.`;
  }
}

export function presentResults(templateKey: TemplateKey, stored: StoredResult, showExpected: boolean): PresentedResult[] {
  const t = templates[templateKey];
  return stored.results.map((r, i) => {
    const spec = t.quantities.find((q) => q.key === r.quantity);
    const m = r.mistake ? MISTAKES[r.mistake] : undefined;
    const base: PresentedResult = {
      questionId: r.id ?? `q${i + 1}`,
      quantity: r.quantity,
      label: spec?.label ?? r.quantity,
      unit: spec?.unit ?? "",
      displayUnit: spec?.displayUnit ?? "",
      kind: r.kind,
      verdict: r.verdict,
      points: r.points,
      maxPoints: r.maxPoints,
      answer: r.answer,
      readAs: r.readAs,
      mistake: m && r.mistake ? { key: r.mistake, ...m } : undefined,
      feedback: showExpected ? r.feedback : guardedFeedback(r),
      traceNote: r.traceNote,
      override: r.override ? { points: r.override.points, graderPoints: r.graderPoints ?? r.points, reason: r.override.reason, at: r.override.at, keptAt: r.override.keptAt } : undefined,
    };
    if (showExpected) {
      base.method = r.method;
      base.expected = r.expected;
      base.band = r.band;
      base.solution = r.solution;
    }
    return base;
  });
}
