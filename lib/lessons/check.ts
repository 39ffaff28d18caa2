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
  return { ok: true, verdict: r.verdict, feedback: r.feedback, expected, solutionHtml: r.solution.map(tex) };
}
