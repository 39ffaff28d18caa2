import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { db } from "@/db";
import { listMembers } from "@/db/queries/courses";
import { forPage, refused, requireCourseRole, STAFF } from "@/lib/auth/access";
import { RosterEditor } from "@/components/course/roster-editor";
import { RosterImport } from "@/components/course/roster-import";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId, STAFF), `/courses/${courseId}/roster`);
  if (refused(access)) forbidden();
  const members = await listMembers(db, courseId);
  const counts = { instructor: 0, ta: 0, student: 0 };
  for (const m of members) counts[m.role]++;
  const canEdit = access.role === "instructor";
  const rows = members.map(({ userId, name, email, role, section }) => ({ userId, name, email, role, section }));
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}`}>← {access.course.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl">Roster</h1>
      <p className="mt-1 mb-6 text-sm text-ink-soft">
        {counts.student} students, {counts.ta} teaching assistants, {counts.instructor} instructor{counts.instructor === 1 ? "" : "s"}.
        {canEdit ? " Removing someone keeps their attempts; they come back if the person is added again." : " Only the instructor can change the roster."}
      </p>
      <RosterEditor courseId={courseId} members={rows} canEdit={canEdit} />
      {canEdit ? <RosterImport courseId={courseId} /> : null}
    </>
  );
}
