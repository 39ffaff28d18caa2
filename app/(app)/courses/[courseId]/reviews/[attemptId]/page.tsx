import type { Metadata } from "next";
import { forbidden, notFound } from "next/navigation";
import { forPage, refused } from "@/lib/auth/access";
import { staffAttemptAccess } from "@/lib/labs/review";
import { AttemptFeedback } from "@/components/labs/feedback/attempt-feedback";

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
  return <AttemptFeedback attempt={attempt} lab={lab} access={access} reviewQueueHref={`/courses/${courseId}/reviews`} />;
}
