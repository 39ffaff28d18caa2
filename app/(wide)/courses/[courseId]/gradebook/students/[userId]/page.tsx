import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { gradebook } from "@/db/queries/gradebook";
import { coursePage, STAFF } from "@/lib/auth/access";
import { CoursePageHeading } from "@/components/course/page-heading";
import { uuidSchema } from "@/lib/validation/common";
import { StudentGrades } from "@/components/gradebook/student-grades";

export const metadata: Metadata = { title: "Student grades" };

// One student's row of the gradebook, for the staff (the gradebook's row link).
export default async function StudentGradesPage({ params }: { params: Promise<{ courseId: string; userId: string }> }) {
  const { courseId, userId } = await params;
  await coursePage(courseId, `/courses/${courseId}/gradebook/students/${userId}`, STAFF);
  if (!uuidSchema.safeParse(userId).success) notFound();
  const book = await gradebook(db, courseId, userId);
  const s = book.students[0];
  if (!s) notFound();
  return (
    <>
      <CoursePageHeading backHref={`/courses/${courseId}/gradebook`} backLabel="Gradebook" title={s.name} />
      <p className="mt-1 text-sm text-ink-soft">
        {s.email}
        {s.section ? ` · section ${s.section}` : ""}
      </p>
      <StudentGrades gradebook={book} heading="Counted scores" />
    </>
  );
}
