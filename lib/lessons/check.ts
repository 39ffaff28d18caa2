// Checks a "Check yourself" answer (ungraded): the question is looked up on the server by id (the client
// sends only the id and the typed text), graded by lib/grader's gradeAttempt, and the worked solution's
// LaTeX steps are typeset here with KaTeX, so no KaTeX code is sent to the browser.
import katex from "katex";
import { z } from "zod";
import { gradeAttempt, isTemplateKey } from "@/lib/grader";
import { getQuestion } from "./questions";
import { formatText } from "./format";

export type CheckResult =
  | { ok: true; verdict: string; feedback: string; expected: string; solutionHtml: string[] }
  | { ok: false; message: string };

const input = z.object({ questionId: z.string().min(1).max(80), answer: z.string().max(200) });

function tex(step: string): string {
  try {
    return katex.renderToString(step, { displayMode: true, throwOnError: false, output: "html", strict: false });
  } catch {
    return katex.renderToString("\\text{(step could not be typeset)}", { displayMode: true });
  }
}

export async function checkLessonAnswer(questionId: string, answer: string): Promise<CheckResult> {
  const parsed = input.safeParse({ questionId, answer });
  if (!parsed.success) return { ok: false, message: "That answer could not be read." };
  const q = getQuestion(parsed.data.questionId);
  if (!q) return { ok: false, message: "This question no longer exists; reload the page." };
  if (!parsed.data.answer.trim()) return { ok: false, message: "Type an answer first, with its unit." };

  if (!isTemplateKey(q.template)) return { ok: false, message: "This question's circuit is not available." };
  const result = gradeAttempt({
    template: q.template,
    params: q.params,
    questions: [{ quantity: q.quantity, points: 1, kind: "prediction" }],
    readings: { [q.quantity]: parsed.data.answer },
  });
  const r = result.results[0];
  const expected = typeof r.expected === "number" ? formatText(r.expected, q.unit) : String(r.expected);
  return { ok: true, verdict: r.verdict, feedback: readerFeedback(r.verdict, r.feedback, r.readAs), expected, solutionHtml: r.solution.map(tex) };
}

/**
 * The grader's feedback speaks to a student in a graded lab (bands, lab tolerance, points). A reader of a
 * lesson gets it once, in plain words: the verdict's label is shown beside it, and the expected value with
 * the worked solution, so neither is repeated here.
 */
export function readerFeedback(verdict: string, feedback: string, readAs?: string): string {
  const read = readAs ? `Read as ${readAs}. ` : "";
  if (verdict === "correct") return `${read}That agrees with the worked solution within 1 %.`;
  if (verdict === "close") return `${read}Near, but more than 1 % away: check your rounding and the values you used.`;
  if (verdict === "wrong") return `${read}Compare your steps with the worked solution.`;
  // a recognised slip or a unit: the grader's explanation, without the answer (shown with the solution)
  return feedback.replace(/\s*The answer is [^]*$/, "").trim();
}
