"use client";
// One "Check yourself" question: the student types an answer with its unit, the server checks it with
// gradeAttempt (ungraded) and returns the verdict and the worked solution already typeset.
import { useId, useState, useTransition } from "react";
import { checkAnswer, type CheckResult } from "./check-question-action";

const verdictText: Record<string, { label: string; className: string }> = {
  correct: { label: "Correct", className: "text-verdict-correct" },
  close: { label: "Close", className: "text-verdict-close" },
  mistake: { label: "A known slip", className: "text-verdict-mistake" },
  unit: { label: "Check the unit", className: "text-verdict-wrong" },
  wrong: { label: "Not yet", className: "text-verdict-wrong" },
  missing: { label: "No answer", className: "text-verdict-neutral" },
};

export function CheckQuestion({ id, number, prompt, unitHint }: { id: string; number: number; prompt: string; unitHint: string }) {
  const inputId = useId();
  const [answer, setAnswer] = useState("");
  const [result, setResult] = useState<CheckResult | null>(null);
  const [showSolution, setShowSolution] = useState(false);
  const [pending, startTransition] = useTransition();

  function submit(e: React.FormEvent) {
    e.preventDefault();
    startTransition(async () => {
      try {
        setResult(await checkAnswer(id, answer));
      } catch {
        setResult({ ok: false, message: "The check could not reach the server; try again." });
      }
      setShowSolution(false);
    });
  }

  const v = result?.ok ? (verdictText[result.verdict] ?? verdictText.wrong) : null;
  return (
    <li className="card my-4 break-inside-avoid" data-question={id}>
      <p className="mt-0">
        <span className="font-semibold">Question {number}. </span>
        {prompt}
      </p>
      <form onSubmit={submit} className="no-print flex flex-wrap items-end gap-3">
        <div className="min-w-48 flex-1">
          <label htmlFor={inputId} className="field-label">
            Your answer{unitHint ? ` (with its unit, e.g. in ${unitHint})` : ""}
          </label>
          <input
            id={inputId}
            className="field-input"
            value={answer}
            onChange={(e) => setAnswer(e.target.value)}
            autoComplete="off"
            spellCheck={false}
            aria-describedby={`${inputId}-result`}
          />
        </div>
        <button type="submit" className="btn-primary" disabled={pending}>
          {pending ? "Checking…" : "Check"}
        </button>
      </form>
      <div id={`${inputId}-result`} aria-live="polite" className="mt-3">
        {result && !result.ok && <p className="field-error">{result.message}</p>}
        {result?.ok && v && (
          <div>
            <p className="my-1">
              <span className={`font-semibold ${v.className}`}>{v.label}.</span> {result.feedback}
            </p>
            <button type="button" className="btn-quiet mt-2" aria-expanded={showSolution} onClick={() => setShowSolution((s) => !s)}>
              {showSolution ? "Hide the worked solution" : "Show the worked solution"}
            </button>
            {showSolution && (
              <div className="mt-2 rounded-md bg-paper-sunk p-3" data-testid="worked-solution">
                <p className="my-1 text-sm">Expected: {result.expected}</p>
                {result.solutionHtml.map((html, i) => (
                  <div key={i} className="overflow-x-auto" dangerouslySetInnerHTML={{ __html: html }} />
                ))}
              </div>
            )}
          </div>
        )}
      </div>
    </li>
  );
}
