// The graded part of the feedback: the score, then one card per question with the student's answer,
// the expected value when it may be shown, the mistake found and the worked solution (already typeset).
import { utcDate } from "@/lib/dates";
import type { AttemptView } from "./types";
import { bandText, expectedValue, points, scoreLine, studentValue, verdictInfo, verdictSummary } from "./verdict";

type Result = AttemptView["results"][number];

export function Graded({ attempt, typed, solutionHtml, studentName }: { attempt: AttemptView; typed: Record<string, string | null>; solutionHtml: Record<string, string>; studentName: string | null }) {
  return (
    <>
      <p className="mt-2 text-xs font-semibold uppercase tracking-wide text-copper">
        Attempt {attempt.number}
        {studentName ? ` · ${studentName}` : ""}
      </p>
      <h1 className="mt-1 text-3xl">Feedback: {attempt.labTitle}</h1>
      <section className="card mt-4" aria-labelledby="score-heading" data-testid="score">
        <h2 id="score-heading" className="sr-only">
          Score
        </h2>
        <p className="text-sm text-ink-soft" data-testid="attempt-status">
          Graded {utcDate(attempt.gradedAt ?? attempt.submittedAt)} · submitted {utcDate(attempt.submittedAt)}
        </p>
        <p className="mt-1 text-3xl font-semibold tabular-nums" data-testid="score-value">
          {points(attempt.score)} <span className="text-lg font-normal text-ink-soft">of {points(attempt.maxScore)} points</span>
        </p>
        <p className="mt-1 text-sm">{scoreLine(attempt)}.</p>
        <p className="mt-1 text-sm text-ink-soft">{verdictSummary(attempt.results)}.</p>
        {attempt.simulated ? (
          <p className="mt-1 text-sm" data-testid="attempt-bench">
            Readings taken on the simulated bench.
          </p>
        ) : null}
        {!attempt.expectedShown ? (
          <p className="mt-2 text-sm text-ink-soft">Expected values and worked solutions stay hidden while you can still earn points on this lab (attempts left and the lab still open); the feedback below says how each answer was judged.</p>
        ) : null}
        <p className="mt-2 text-xs text-ink-soft">Grader version {attempt.graderVersion}</p>
      </section>

      <section aria-labelledby="questions-heading" className="mt-6">
        <h2 id="questions-heading" className="text-xl">
          Question by question
        </h2>
        <ol className="mt-3 space-y-4">
          {attempt.results.map((r, i) => (
            <ResultCard key={r.questionId} index={i} r={r} typed={typed[r.questionId]} solutionHtml={solutionHtml} />
          ))}
        </ol>
      </section>
    </>
  );
}

function ResultCard({ r, index, typed, solutionHtml }: { r: Result; index: number; typed?: string | null; solutionHtml: Record<string, string> }) {
  const v = verdictInfo(r.verdict);
  const expected = expectedValue(r);
  const band = bandText(r);
  return (
    <li className={`card border-l-4 ${v.border}`} data-testid="result" data-verdict={r.verdict} aria-labelledby={`q-${r.questionId}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`q-${r.questionId}`} className="text-lg">
          {index + 1}. {r.label}
        </h3>
        <p className="text-sm tabular-nums">
          {points(r.points)} / {points(r.maxPoints)} points
        </p>
      </div>
      <p className={`mt-1 inline-flex items-center gap-2 rounded-full px-3 py-0.5 text-sm font-semibold ${v.bg} ${v.text}`} data-testid="verdict">
        <span aria-hidden="true" className="font-mono">
          {v.icon}
        </span>
        {v.word}
      </p>
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-ink-soft">Your answer</dt>
          <dd className="m-0 font-semibold tabular-nums">
            {studentValue(r, typed)}
            {typed && r.readAs && typed.trim() !== r.readAs ? <span className="font-normal text-ink-soft"> (you typed “{typed.trim()}”)</span> : null}
          </dd>
        </div>
        {expected ? (
          <div>
            <dt className="text-ink-soft">Expected</dt>
            <dd className="m-0 font-semibold tabular-nums">
              {expected}
              {band ? <span className="block font-normal text-ink-soft">accepted {band}</span> : null}
            </dd>
          </div>
        ) : null}
      </dl>
      {r.override ? (
        <p className="mt-3 rounded-md border border-copper/40 bg-copper/5 p-3 text-sm" data-testid="override">
          <span className="font-semibold">Points set by the course staff: {points(r.override.points)}</span> (the grader gave {points(r.override.graderPoints)}). Reason: {r.override.reason}
          {r.override.keptAt ? ` Kept when the lab was changed and this attempt graded again (${utcDate(r.override.keptAt)}).` : null}
        </p>
      ) : null}
      {r.mistake ? (
        <div className="mt-3 rounded-md border border-verdict-mistake/40 bg-verdict-mistake/5 p-3 text-sm" data-testid="mistake">
          <p className="font-semibold">What went wrong: {r.mistake.title}</p>
          <p className="mt-1">{r.mistake.explain}</p>
          <p className="mt-1">
            <span className="font-semibold">Next time: </span>
            {r.mistake.fix}
          </p>
        </div>
      ) : null}
      {r.feedback ? <p className="mt-3 text-sm">{r.feedback}</p> : null}
      {r.method ? <p className="mt-2 text-xs text-ink-soft">How the band was set: {r.method}</p> : null}
      {r.traceNote && !r.feedback?.includes(r.traceNote) ? <p className="mt-2 text-sm">{r.traceNote}</p> : null}
      {r.solution && r.solution.length ? (
        <details className="mt-3">
          <summary className="cursor-pointer text-sm font-semibold text-trace">Worked solution with your numbers</summary>
          <div className="mt-2 space-y-1 overflow-x-auto" data-testid="worked-solution">
            {r.solution.map((line, k) =>
              solutionHtml[line] ? (
                <div key={k} dangerouslySetInnerHTML={{ __html: solutionHtml[line] }} />
              ) : (
                <pre key={k} className="whitespace-pre-wrap font-mono text-xs">
                  {line}
                </pre>
              ),
            )}
          </div>
        </details>
      ) : null}
    </li>
  );
}
