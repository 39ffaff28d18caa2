import type { Metadata } from "next";
import { asJson } from "@/lib/api-client";
import { forPage, isStaff, refused } from "@/lib/auth/access";
import { attemptAccess, attemptsFor, attemptsUsed, HELD_NOTICE, presentAttempt } from "@/lib/labs/service";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { FeedbackView } from "@/components/labs/feedback/feedback-view";
import { typeset } from "@/components/labs/feedback/typeset";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Feedback" };

export default async function AttemptPage({ params }: { params: Promise<{ attemptId: string }> }) {
  const { attemptId } = await params;
  const found = await forPage(attemptAccess(attemptId), `/attempts/${attemptId}`);
  if (refused(found)) forbidden();
  const { attempt, lab, access } = found;
  const staff = isStaff(access.role);
  const isOwner = attempt.userId === access.user.id;
  if (!staff && lab.gradesHeld) {
    return (
      <>
        <p className="text-sm">
          <Link href={`/labs/${lab.id}`}>← Back to the lab</Link>
        </p>
        <section className="card mt-4" aria-labelledby="held-heading">
          <p className="text-xs font-semibold uppercase tracking-wide text-copper">{lab.title}</p>
          <h1 id="held-heading" className="mt-1 text-2xl">
            Attempt {attempt.number}: {HELD_NOTICE.toLowerCase()}
          </h1>
          <p className="mt-2 text-ink-soft" role="status">
            Your readings were received and graded. Your instructor releases the grades of this lab all at once; you will get an e-mail
            with your score when they do, and the feedback appears here.
          </p>
        </section>
      </>
    );
  }
  // The attempt as GET /api/attempts/{id} returns it; the server also typesets the solutions it may show.
  const presented = presentAttempt(attempt, lab, staff, await attemptsUsed(attempt));
  const lines = presented.results.flatMap((r) => r.solution ?? []);
  let studentName: string | null = null;
  if (staff && !isOwner) {
    const all = await attemptsFor(lab, access);
    studentName = all.find((a) => a.id === attempt.id)?.studentName ?? null;
  }
  return (
    <QueryProvider>
      <FeedbackView
        attempt={asJson(presented)}
        studentId={attempt.userId}
        studentName={studentName}
        isOwner={isOwner}
        typed={(attempt.readings ?? {}) as Record<string, string | null>}
        solutionHtml={typeset(lines)}
      />
    </QueryProvider>
  );
}
