import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db";
import { gradebookOutline, gradebookStatistics } from "@/db/queries/gradebook";
import { coursePage, STAFF } from "@/lib/auth/access";
import { CoursePageHeading } from "@/components/course/page-heading";
import { listLessons } from "@/lib/lessons";
import { GradebookStatistics } from "@/components/gradebook/statistics";
import { GradebookTable } from "@/components/gradebook/gradebook-table";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Gradebook" };

// The instructor's gradebook (TAs read it): the table is fetched in the browser from the gradebook API;
// the statistics (one statement) are rendered here. Students get 403, outsiders 404.
export default async function GradebookPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await coursePage(courseId, `/courses/${courseId}/gradebook`, STAFF);
  const isInstructor = access.role === "instructor";
  const [book, stats] = await Promise.all([gradebookOutline(db, courseId), gradebookStatistics(db, courseId)]);
  return (
    <>
      <CoursePageHeading backHref={`/courses/${courseId}`} backLabel={access.course.title} title="Gradebook" />
      <p className="mt-1 text-sm text-ink-soft">
        {book.students} students, {book.labs.length} published labs. The total weighs each lab by{" "}
        {book.labs.some((l) => l.weight !== null) ? "the weights set" : "its points"}
        {isInstructor ? (
          <>
            {" "}(<Link href={`/courses/${courseId}/settings#lab-weights`}>set the lab weights in the course settings</Link>).
          </>
        ) : (
          ". Teaching assistants read the gradebook; the instructor exports it and sets the weights."
        )}
      </p>
      <QueryProvider>
        <GradebookTable courseId={courseId} canExport={isInstructor} />
      </QueryProvider>
      <GradebookStatistics labs={book.labs} labStats={stats.labs} questionStats={stats.questions} lessons={listLessons()} />
    </>
  );
}
