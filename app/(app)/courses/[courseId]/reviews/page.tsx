import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { db } from "@/db";
import { listSections } from "@/db/queries/reviews";
import { forPage, refused, requireCourseRole, STAFF } from "@/lib/auth/access";
import { labsForCourse } from "@/lib/labs/attempts";
import { ReviewQueue } from "@/components/review/review-queue";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Review queue" };

// The course's review requests for its teaching assistants and instructor; the list itself is fetched in
// the browser so it stays current.
export default async function ReviewQueuePage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId, STAFF), `/courses/${courseId}/reviews`);
  if (refused(access)) forbidden();
  const [labs, sections] = await Promise.all([labsForCourse(access), listSections(db, access.course.id)]);
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${access.course.id}`}>← {access.course.code}</Link>
      </p>
      <h1 className="mt-2 text-3xl">Review queue</h1>
      <p className="mt-1 text-sm text-ink-soft">Students&apos; requests to look at a grade again. Open a request to see the attempt beside the expected values, change points with a reason, and answer.</p>
      <QueryProvider>
        <ReviewQueue courseId={access.course.id} labs={labs.map((l) => ({ id: l.id, title: l.title }))} sections={sections} />
      </QueryProvider>
    </>
  );
}
