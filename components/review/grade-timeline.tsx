"use client";
// An attempt's grade history as a timeline, oldest first: the first grade, recomputations after lab
// edits, the staff's changes with their reasons, re-runs and answers to review requests.
import { useQuery } from "@tanstack/react-query";
import { api, type Jsonified } from "@/lib/http/client";
import type { PresentedEvent } from "@/lib/labs/review";
import { utcDate } from "@/lib/dates";
import { loadError } from "../labs/feedback/types";
import { points } from "../labs/feedback/verdict";

export type EventView = Jsonified<PresentedEvent>;

export const historyKey = (attemptId: string) => ["grade-history", attemptId] as const;

function what(e: EventView): string {
  const who = e.actor?.name ?? "The grader";
  switch (e.kind) {
    case "graded":
      return "Graded by the grader";
    case "recomputed":
      return "Graded again after the lab was edited";
    case "override":
      return `${who} set the points of question ${e.question ?? e.questionId}`;
    case "rerun":
      return `${who} re-ran the grader`;
    case "review_answer":
      return `${who} answered the review request`;
    case "exception":
      return `${who} changed the student's own dates or attempts (late penalty applied again)`;
  }
}

function change(e: EventView): string | null {
  if (e.kind === "review_answer") return null;
  const parts: string[] = [];
  if (e.kind === "override" && e.pointsBefore !== null && e.pointsAfter !== null) parts.push(`question: ${points(e.pointsBefore)} → ${points(e.pointsAfter)} points`);
  if (e.scoreBefore === null && e.scoreAfter !== null) parts.push(`score ${points(e.scoreAfter)}`);
  else if (e.scoreBefore !== null && e.scoreAfter !== null) parts.push(e.scoreBefore === e.scoreAfter ? `score unchanged at ${points(e.scoreAfter)}` : `score ${points(e.scoreBefore)} → ${points(e.scoreAfter)}`);
  return parts.join("; ");
}

export function GradeTimeline({ attemptId }: { attemptId: string }) {
  const q = useQuery({
    queryKey: historyKey(attemptId),
    queryFn: ({ signal }) => api<{ events: EventView[] }>(`/api/attempts/${attemptId}/history`, { signal }).then((b) => b.events),
  });
  return (
    <section aria-labelledby="timeline-heading" className="mt-8">
      <h2 id="timeline-heading" className="text-xl">
        Grade history
      </h2>
      <p className="mt-1 text-sm text-ink-soft">Every change to this grade, who made it and why. Nothing here can be edited or removed.</p>
      {q.isPending ? (
        <p className="mt-2 text-sm text-ink-soft">Loading…</p>
      ) : q.isError ? (
        <p className="mt-2 text-sm text-verdict-wrong">{loadError(q.error, "the grade history")}</p>
      ) : (
        <ol className="mt-3 space-y-3 border-l-2 border-ink/15 pl-4" data-testid="grade-timeline">
          {q.data.map((e) => (
            <li key={e.id} data-kind={e.kind} className="text-sm">
              <p>
                <span className="font-semibold">{what(e)}</span> <span className="text-ink-soft">· {utcDate(e.at)}</span>
              </p>
              {change(e) ? <p className="tabular-nums">{change(e)}</p> : null}
              {e.reason ? <p className="whitespace-pre-line text-ink-soft">{e.kind === "review_answer" ? "Answer: " : "Reason: "}{e.reason}</p> : null}
              {e.graderVersion && e.kind !== "review_answer" ? <p className="text-xs text-ink-faint">Grader version {e.graderVersion}</p> : null}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
