// The feedback on one attempt as the server renders it for the attempt page and the staff's review page:
// the attempt as GET /api/attempts/{id} returns it, the solutions it may show typeset on the server, and
// for staff the student's name.
import type { AttemptRow } from "@/db/queries/attempts";
import { asJson } from "@/lib/http/client";
import { isStaff, type CourseAccess } from "@/lib/auth/access";
import type { Lab } from "@/lib/labs/grading";
import { attemptsFor, attemptsUsed, presentAttempt } from "@/lib/labs/attempts";
import { QueryProvider } from "@/components/providers/query-provider";
import { FeedbackView } from "./feedback-view";
import { typeset } from "./typeset";

/** `reviewQueueHref`: shown from the review queue, as staff reviewing it (never as its owner). */
export async function AttemptFeedback({ attempt, lab, access, reviewQueueHref }: { attempt: AttemptRow; lab: Lab; access: CourseAccess; reviewQueueHref?: string }) {
  const staff = isStaff(access.role);
  const isOwner = !reviewQueueHref && attempt.userId === access.user.id;
  const presented = presentAttempt(attempt, lab, staff, await attemptsUsed(attempt));
  const studentName = staff && !isOwner ? ((await attemptsFor(lab, access, new Date(), attempt.userId))[0]?.studentName ?? null) : null;
  return (
    <QueryProvider>
      <FeedbackView
        attempt={asJson(presented)}
        studentId={attempt.userId}
        studentName={studentName}
        isOwner={isOwner}
        typed={(attempt.readings ?? {}) as Record<string, string | null>}
        solutionHtml={typeset(presented.results.flatMap((r) => r.solution ?? []))}
        reviewQueueHref={reviewQueueHref}
      />
    </QueryProvider>
  );
}
