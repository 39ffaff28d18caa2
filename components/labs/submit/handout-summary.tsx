// A plain handout (instructions, safety notes, the student's own values, the questions) used on the
// lab page until the full handout component is available.
import type { handoutFromParams } from "@/lib/labs/handout";

export type HandoutData = ReturnType<typeof handoutFromParams>;

export function HandoutSummary({ handout }: { handout: HandoutData }) {
  const { lab, template, parameters, questions } = handout;
  return (
    <section aria-labelledby="handout-heading" className="card" data-testid="handout">
      <h2 id="handout-heading" className="text-xl">
        Handout: {template.title}
      </h2>
      {lab.instructions ? <p className="mt-2 whitespace-pre-line text-sm">{lab.instructions}</p> : null}
      {lab.safetyNotes ? (
        <div className="caution-box" role="note">
          <p className="font-semibold">Safety</p>
          <p className="whitespace-pre-line text-sm">{lab.safetyNotes}</p>
        </div>
      ) : null}
      <h3 className="mt-4 text-lg">Your circuit values</h3>
      <dl className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        {parameters.map((p) => (
          <div key={p.key} className="flex justify-between gap-4 border-b border-ink/10 py-1">
            <dt className="text-ink-soft">{p.label}</dt>
            <dd className="m-0 font-semibold tabular-nums" data-param={p.key}>
              {p.shown}
              {p.tolerancePercent !== undefined ? <span className="font-normal text-ink-soft"> (±{p.tolerancePercent} %)</span> : null}
            </dd>
          </div>
        ))}
      </dl>
      <h3 className="mt-4 text-lg">Questions</h3>
      <ol className="mt-2 list-decimal space-y-1 pl-6 text-sm">
        {questions.map((q) => (
          <li key={q.id}>
            <span className="font-semibold">{q.label}</span> ({q.kind === "bench" ? "bench reading" : "prediction"}, {q.points} point{q.points === 1 ? "" : "s"}
            {q.displayUnit ? `, in ${q.displayUnit} or any unit of the same kind` : ""}): {q.description}
          </li>
        ))}
      </ol>
    </section>
  );
}
