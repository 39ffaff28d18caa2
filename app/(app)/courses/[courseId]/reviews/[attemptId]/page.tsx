import type { Metadata } from "next";
import { forbidden, notFound } from "next/navigation";
import { asJson } from "@/lib/api-client";
import { forPage, refused } from "@/lib/auth/access";
import { staffAttemptAccess } from "@/lib/labs/review";
import { attemptsFor, attemptsUsed, presentAttempt } from "@/lib/labs/service";
import { FeedbackView } from "@/components/labs/feedback/feedback-view";
import { typeset } from "@/components/labs/feedback/typeset";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Review an attempt" };

// The staff's review of one attempt: the answers beside the expected values and the grader's reasoning,
// the circuit and files, the student's other attempts and message, the regrade and answer forms, the history.
export default async function ReviewAttemptPage({ params }: { params: Promise<{ courseId: string; attemptId: string }> }) {
  const { courseId, attemptId } = await params;
  const here = `/courses/${courseId}/reviews/${attemptId}`;
  const found = await forPage(staffAttemptAccess(attemptId), here);
  if (refused(found)) forbidden();
  const { attempt, lab, access } = found;
  if (lab.courseId !== courseId) notFound();
  const presented = presentAttempt(attempt, lab, true, await attemptsUsed(attempt));
  const studentName = (await attemptsFor(lab, access, new Date(), attempt.userId))[0]?.studentName ?? null;
  return (
    <QueryProvider>
      <FeedbackView
        attempt={asJson(presented)}
        studentId={attempt.userId}
        studentName={studentName}
        isOwner={false}
        typed={(attempt.readings ?? {}) as Record<string, string | null>}
        solutionHtml={typeset(presented.results.flatMap((r) => r.solution ?? []))}
        reviewQueueHref={`/courses/${courseId}/reviews`}
      />
    </QueryProvider>
  );
}
