// One student's row of the gradebook as a list (server component): each published lab with the counted
// score after any late penalty, its markers and a link to the counted attempt, and the total so far.
import Link from "next/link";
import type { Gradebook } from "@/db/queries/gradebook";
import { cellMarkers, formatScore } from "@/lib/gradebook/view";

export function StudentGrades({
  gradebook,
  heading,
  heldLabIds = [],
  headingLevel = 2,
}: {
  gradebook: Gradebook;
  heading: string;
  /** labs whose grades are not yet released to students */
  heldLabIds?: string[];
  headingLevel?: 2 | 3;
}) {
  const s = gradebook.students[0];
  const H = headingLevel === 2 ? "h2" : "h3";
  if (!s) return null;
  return (
    <section aria-labelledby="student-grades-heading" className="card mt-6" data-testid="student-grades">
      <H id="student-grades-heading" className="text-lg">
        {heading}
      </H>
      <p className="mt-1 text-sm">
        Total so far:{" "}
        <strong data-testid="student-total">{s.total === null ? "no lab counts yet" : `${formatScore(s.total)} %`}</strong>
        <span className="text-ink-soft"> (weighted; a lab counts once it is due or you submitted it)</span>
      </p>
      {gradebook.labs.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">No labs are published yet.</p>
      ) : (
        <table className="mt-3 w-full text-sm">
          <caption className="sr-only">Counted score of each lab</caption>
          <thead>
            <tr className="text-left text-ink-soft">
              <th scope="col" className="py-1 pr-3 font-normal">Lab</th>
              <th scope="col" className="py-1 pr-3 font-normal">Due</th>
              <th scope="col" className="py-1 pr-3 font-normal">Counted score</th>
              <th scope="col" className="py-1 font-normal">Notes</th>
            </tr>
          </thead>
          <tbody>
            {gradebook.labs.map((l) => {
              const c = s.cells[l.id];
              const held = heldLabIds.includes(l.id);
              return (
                <tr key={l.id} className="border-t border-ink/10">
                  <th scope="row" className="py-1 pr-3 text-left font-medium">
                    <Link href={`/labs/${l.id}`}>{l.title}</Link>
                  </th>
                  <td className="py-1 pr-3">{l.dueAt ? new Date(l.dueAt).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" }) : "–"}</td>
                  <td className="py-1 pr-3 tabular-nums">
                    {held ? (
                      <span className="text-ink-soft">graded, not yet released</span>
                    ) : c ? (
                      <Link href={`/attempts/${c.attemptId}`}>
                        {formatScore(c.score)} / {formatScore(c.maxScore)}
                      </Link>
                    ) : (
                      "–"
                    )}
                  </td>
                  <td className="py-1 text-ink-soft">
                    {held ? "" : [...cellMarkers(c, gradebook.students[0]?.exceptions?.[l.id]).map((m) => m.label), ...(c && c.attempts > 1 ? [`${c.attempts} attempts`] : [])].join("; ")}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
    </section>
  );
}
