import type { Metadata } from "next";
import { forPage, isStaff, refused } from "@/lib/auth/access";
import { attemptAccess, HELD_NOTICE } from "@/lib/labs/attempts";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { AttemptFeedback } from "@/components/labs/feedback/attempt-feedback";

export const metadata: Metadata = { title: "Feedback" };

export default async function AttemptPage({ params }: { params: Promise<{ attemptId: string }> }) {
  const { attemptId } = await params;
  const found = await forPage(attemptAccess(attemptId), `/attempts/${attemptId}`);
  if (refused(found)) forbidden();
  const { attempt, lab, access } = found;
  const staff = isStaff(access.role);
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
  return <AttemptFeedback attempt={attempt} lab={lab} access={access} />;
}
