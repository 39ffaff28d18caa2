"use client";
// The feedback on one attempt. The page builds the attempt on the server (the same presentAttempt the
// JSON API uses) and hands it over; after a review request it is fetched again from the API. The history
// and the files are fetched in the browser. The worked solutions arrive already typeset (KaTeX on the
// server) as a LaTeX → HTML map.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { api } from "@/lib/http/client";
import { utcDate } from "@/lib/dates";
import { GradeTimeline } from "@/components/review/grade-timeline";
import { StaffReview } from "@/components/review/staff-review";
import { BenchReplay } from "@/components/labs/bench/bench-replay";
import { Files } from "./files";
import { Graded } from "./graded";
import { ReviewForm } from "./review-form";
import { loadError, type AttemptView, type HistoryItem } from "./types";
import { points, verdictSummary } from "./verdict";

export type { AttemptView };

export interface FeedbackProps {
  /** the attempt as GET /api/attempts/{id} would return it */
  attempt: AttemptView;
  studentId: string;
  studentName: string | null;
  isOwner: boolean;
  typed: Record<string, string | null>;
  solutionHtml: Record<string, string>;
  /** the staff's review page: scope captures inline, the regrade and answer forms; its queue's address */
  reviewQueueHref?: string;
}

export function FeedbackView({ attempt: initial, studentId, studentName, isOwner, typed, solutionHtml, reviewQueueHref }: FeedbackProps) {
  const queryClient = useQueryClient();
  const attemptKey = ["attempt", initial.id];
  const { data: attempt } = useQuery({
    queryKey: attemptKey,
    queryFn: ({ signal }) => api<{ attempt: AttemptView }>(`/api/attempts/${initial.id}`, { signal }).then((b) => b.attempt),
    initialData: initial,
  });
  const history = useQuery({
    queryKey: ["lab-attempts", attempt.labId, studentId],
    queryFn: ({ signal }) => api<{ attempts: HistoryItem[] }>(`/api/labs/${attempt.labId}/attempts`, { signal }),
    select: (b) => b.attempts.filter((a) => !a.studentId || a.studentId === studentId).sort((a, b) => a.number - b.number),
  });

  return (
    <>
      <p className="no-print text-sm">
        {reviewQueueHref ? <Link href={reviewQueueHref}>← Back to the review queue</Link> : <Link href={`/labs/${attempt.labId}`}>← Back to the lab</Link>}
      </p>
      <p role="status" className="sr-only">
        {`Graded: ${points(attempt.score)} of ${points(attempt.maxScore)} points.`}
      </p>
      <Graded attempt={attempt} typed={typed} solutionHtml={solutionHtml} studentName={studentName} />

      {reviewQueueHref ? <StaffReview attempt={attempt} /> : null}
      {reviewQueueHref && attempt.simulated ? <BenchReplay labId={attempt.labId} studentId={studentId} /> : null}

      <Files attempt={attempt} inline={Boolean(reviewQueueHref)} />

      <section aria-labelledby="history-heading" className="no-print mt-8">
        <h2 id="history-heading" className="text-xl">
          {isOwner ? "Your attempts at this lab" : "This student's attempts at this lab"}
        </h2>
        {history.isPending ? (
          <p className="mt-2 text-sm text-ink-soft">Loading…</p>
        ) : history.isError ? (
          <p className="mt-2 text-sm text-verdict-wrong">{loadError(history.error, "the attempt history")}</p>
        ) : (
          <ol className="mt-2 space-y-1 text-sm" data-testid="attempt-history">
            {history.data.map((h) => (
              <li key={h.id}>
                {h.id === attempt.id ? (
                  <span aria-current="page" className="font-semibold">
                    Attempt {h.number}: {points(h.score)} of {points(h.maxScore)} points (this one)
                  </span>
                ) : (
                  <Link href={`/attempts/${h.id}`}>
                    Attempt {h.number}: {points(h.score)} of {points(h.maxScore)} points
                  </Link>
                )}{" "}
                <span className="text-ink-soft">
                  ({verdictSummary(h.results)}; {utcDate(h.submittedAt)})
                </span>
              </li>
            ))}
          </ol>
        )}
      </section>

      {reviewQueueHref ? null : <Review attempt={attempt} isOwner={isOwner} onRequested={() => void queryClient.invalidateQueries({ queryKey: attemptKey })} />}

      <GradeTimeline attemptId={attempt.id} />
    </>
  );
}

function Review({ attempt, isOwner, onRequested }: { attempt: AttemptView; isOwner: boolean; onRequested: () => void }) {
  return (
    <section aria-labelledby="review-heading" className="no-print card mt-8" data-testid="review">
      <h2 id="review-heading" className="text-xl">
        Review
      </h2>
      {attempt.reviewRequestedAt ? (
        <>
          <div role="status">
            <p className="mt-2 text-sm">
              {isOwner ? "You asked" : "The student asked"} for a review on {utcDate(attempt.reviewRequestedAt)}.
              {attempt.reviewOpen ? " The course staff will look at it; a changed grade shows here." : ""}
            </p>
            {attempt.reviewMessage ? <blockquote className="mt-2 border-l-4 border-ink/20 pl-3 text-sm whitespace-pre-line">{attempt.reviewMessage}</blockquote> : null}
            {attempt.reviewAnswer && attempt.reviewAnsweredAt ? (
              <div className="mt-3 rounded-md border border-trace/30 bg-trace-pale p-3 text-sm" data-testid="review-answer">
                <p className="font-semibold">
                  {attempt.reviewOpen ? "The staff's earlier answer" : "The staff's answer"} ({utcDate(attempt.reviewAnsweredAt)})
                </p>
                <p className="mt-1 whitespace-pre-line">{attempt.reviewAnswer}</p>
                {attempt.changedByStaff ? <p className="mt-1 text-ink-soft">The staff changed points on this attempt; each change and its reason are in the grade history below.</p> : null}
              </div>
            ) : null}
          </div>
          {/* Answered: the owner may ask again with a new message, which reopens the request (the earlier
              answer stays shown). While a request waits for its answer the form stays hidden. */}
          {isOwner && !attempt.reviewOpen ? (
            <>
              <p className="mt-4 text-sm text-ink-soft">If the answer leaves something open, ask again: your new message reopens the request.</p>
              <ReviewForm attemptId={attempt.id} onRequested={onRequested} again />
            </>
          ) : null}
        </>
      ) : isOwner ? (
        <>
          <p className="mt-2 text-sm text-ink-soft">If you think a question was judged wrongly, tell the course staff what to look at.</p>
          <ReviewForm attemptId={attempt.id} onRequested={onRequested} />
        </>
      ) : (
        <p className="mt-2 text-sm text-ink-soft">No review has been requested for this attempt.</p>
      )}
    </section>
  );
}
