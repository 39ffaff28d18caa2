import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { db } from "@/db";
import { gradebook } from "@/db/queries/gradebook";
import { forPage, refused, requireCourseRole, STAFF } from "@/lib/auth/access";
import { uuidSchema } from "@/lib/validation/common";
import { StudentGrades } from "@/components/gradebook/student-grades";

export const metadata: Metadata = { title: "Student grades" };

// One student's row of the gradebook, for the staff (the gradebook's row link).
export default async function StudentGradesPage({ params }: { params: Promise<{ courseId: string; userId: string }> }) {
  const { courseId, userId } = await params;
  const access = await forPage(requireCourseRole(courseId, STAFF), `/courses/${courseId}/gradebook/students/${userId}`);
  if (refused(access)) forbidden();
  if (!uuidSchema.safeParse(userId).success) notFound();
  const book = await gradebook(db, courseId, userId);
  const s = book.students[0];
  if (!s) notFound();
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}/gradebook`}>← Gradebook</Link>
      </p>
      <h1 className="mt-2 text-3xl">{s.name}</h1>
      <p className="mt-1 text-sm text-ink-soft">
        {s.email}
        {s.section ? ` · section ${s.section}` : ""}
      </p>
      <StudentGrades gradebook={book} heading="Counted scores" />
    </>
  );
}
