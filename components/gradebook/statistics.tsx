// Statistics that say what to re-teach (server component): per lab the submitted and missing counts,
// mean, median and a histogram of counted scores; per question the share of each verdict and the most
// frequent recognised mistake; and the three questions most students missed, each with the lesson
// that teaches that question's quantity.
import Link from "next/link";
import type { GradebookLab, LabStatistics, QuestionStatistics } from "@/db/queries/gradebook";
import { MISTAKES, templates, type TemplateKey } from "@/lib/grader";
import { answeredCount, histogram, missedCount, mostMissed } from "@/lib/gradebook/stats";
import { formatScore } from "@/lib/gradebook/view";
import type { LessonSummary } from "@/lib/lessons";
import { lessonFor } from "@/lib/lessons/lesson-for";
import { ScoreHistogram } from "./score-histogram";

const SHARES = [
  { key: "correct", word: "correct", className: "bg-verdict-correct" },
  { key: "close", word: "close", className: "bg-verdict-close" },
  { key: "mistake", word: "recognised mistake", className: "bg-verdict-mistake" },
  { key: "wrong", word: "wrong", className: "bg-verdict-wrong" },
  { key: "missing", word: "missing", className: "bg-verdict-neutral" },
] as const;

function quantityLabel(templateKey: string, quantity: string): string {
  const t = templates[templateKey as TemplateKey];
  return t?.quantities.find((q) => q.key === quantity)?.label ?? quantity;
}

const mistakeTitle = (key: string | null) => (key ? (MISTAKES[key as keyof typeof MISTAKES]?.title ?? key) : null);

const percent = (n: number, of: number) => (of > 0 ? Math.round((100 * n) / of) : 0);

export function GradebookStatistics({
  labs,
  labStats,
  questionStats,
  lessons,
}: {
  labs: GradebookLab[];
  labStats: LabStatistics[];
  questionStats: QuestionStatistics[];
  lessons: LessonSummary[];
}) {
  const title = new Map(labs.map((l) => [l.id, l.title]));
  const maxPoints = new Map(labs.map((l) => [l.id, l.maxPoints]));
  const top = mostMissed(questionStats, 3);

  return (
    <>
      <section aria-labelledby="reteach-heading" className="card mt-8">
        <h2 id="reteach-heading" className="text-xl">
          What to teach again
        </h2>
        <p className="mt-1 text-sm text-ink-soft">
          The three questions of the course that most students missed among those who submitted the lab (a recognised mistake, a wrong answer or no answer).
        </p>
        {top.length === 0 ? (
          <p className="mt-3 text-sm">No question has been missed yet.</p>
        ) : (
          <ol className="mt-3 space-y-3" data-testid="most-missed">
            {top.map((q) => {
              const students = answeredCount(q);
              const lesson = lessonFor(lessons, q.templateKey, q.quantity);
              return (
                <li key={`${q.labId}-${q.questionId}`} className="rounded-md border border-ink/10 p-3">
                  <p className="font-semibold">
                    {quantityLabel(q.templateKey, q.quantity)} <span className="font-normal text-ink-soft">in {title.get(q.labId)}</span>
                  </p>
                  <p className="text-sm">
                    Missed by {missedCount(q)} of {students} students ({percent(missedCount(q), students)} %).
                    {q.topMistake ? ` Most frequent mistake: ${mistakeTitle(q.topMistake)} (${q.topMistakeCount}).` : ""}
                  </p>
                  {lesson ? (
                    <p className="text-sm">
                      Taught in <Link href={`/lessons/${lesson.slug}`}>{lesson.title}</Link>
                    </p>
                  ) : null}
                </li>
              );
            })}
          </ol>
        )}
      </section>

      <section aria-labelledby="labstats-heading" className="mt-8">
        <h2 id="labstats-heading" className="text-xl">
          Lab by lab
        </h2>
        <div className="mt-3 grid gap-4 lg:grid-cols-2">
          {labStats.map((s) => {
            const qs = questionStats.filter((q) => q.labId === s.labId);
            const name = title.get(s.labId) ?? "Lab";
            return (
              <article key={s.labId} className="card" aria-label={`Statistics of ${name}`}>
                <h3 className="text-lg">{name}</h3>
                <dl className="mt-2 grid grid-cols-4 gap-2 text-sm">
                  <div>
                    <dt className="text-ink-soft">Submitted</dt>
                    <dd className="font-semibold tabular-nums">{s.submitted}</dd>
                  </div>
                  <div>
                    <dt className="text-ink-soft">Missing</dt>
                    <dd className="font-semibold tabular-nums">{s.missing}</dd>
                  </div>
                  <div>
                    <dt className="text-ink-soft">Mean</dt>
                    <dd className="font-semibold tabular-nums">{s.mean === null ? "–" : `${formatScore(s.mean)} / ${formatScore(maxPoints.get(s.labId) ?? 0)}`}</dd>
                  </div>
                  <div>
                    <dt className="text-ink-soft">Median</dt>
                    <dd className="font-semibold tabular-nums">{s.median === null ? "–" : `${formatScore(s.median)} / ${formatScore(maxPoints.get(s.labId) ?? 0)}`}</dd>
                  </div>
                </dl>
                {s.submitted > 0 ? <ScoreHistogram bins={histogram(s.percents)} title={name} /> : <p className="mt-3 text-sm text-ink-soft">No submissions yet.</p>}
                {qs.length ? (
                  <table className="mt-4 w-full text-sm">
                    <caption className="sr-only">Verdicts per question of {name}</caption>
                    <thead>
                      <tr className="text-left text-ink-soft">
                        <th scope="col" className="py-1 pr-2 font-normal">Question</th>
                        <th scope="col" className="py-1 pr-2 font-normal">Verdicts</th>
                        <th scope="col" className="py-1 font-normal">Most frequent mistake</th>
                      </tr>
                    </thead>
                    <tbody>
                      {qs.map((q) => {
                        const total = q.correct + q.close + q.mistake + q.wrong + q.missing;
                        const words = SHARES.map((v) => `${percent(q[v.key], total)} % ${v.word}`).join(", ");
                        return (
                          <tr key={q.questionId} className="border-t border-ink/10 align-top">
                            <th scope="row" className="py-1 pr-2 text-left font-normal">
                              {q.position}. {quantityLabel(q.templateKey, q.quantity)}
                            </th>
                            <td className="py-1 pr-2">
                              <div className="flex h-3 w-full min-w-24 overflow-hidden rounded" aria-hidden="true">
                                {SHARES.map((v) => (q[v.key] > 0 ? <span key={v.key} className={v.className} style={{ width: `${(100 * q[v.key]) / total}%` }} /> : null))}
                              </div>
                              <span className="text-xs text-ink-soft">{words}</span>
                            </td>
                            <td className="py-1">{q.topMistake ? `${mistakeTitle(q.topMistake)} (${q.topMistakeCount})` : "–"}</td>
                          </tr>
                        );
                      })}
                    </tbody>
                  </table>
                ) : null}
              </article>
            );
          })}
        </div>
      </section>
    </>
  );
}
