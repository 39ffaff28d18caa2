import type { Metadata } from "next";
import { db } from "@/db";
import { listMembers } from "@/db/queries/courses";
import { coursePage, STAFF } from "@/lib/auth/access";
import { CoursePageHeading } from "@/components/course/page-heading";
import { RosterEditor } from "@/components/course/roster-editor";
import { RosterImport } from "@/components/course/roster-import";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await coursePage(courseId, `/courses/${courseId}/roster`, STAFF);
  const members = await listMembers(db, courseId);
  const counts = { instructor: 0, ta: 0, student: 0 };
  for (const m of members) counts[m.role]++;
  const canEdit = access.role === "instructor";
  const rows = members.map(({ userId, name, email, role, section }) => ({ userId, name, email, role, section }));
  return (
    <>
      <CoursePageHeading backHref={`/courses/${courseId}`} backLabel={access.course.title} title="Roster" />
      <p className="mt-1 mb-6 text-sm text-ink-soft">
        {counts.student} students, {counts.ta} teaching assistants, {counts.instructor} instructor{counts.instructor === 1 ? "" : "s"}.
        {canEdit ? " Removing someone keeps their attempts; they come back if the person is added again." : " Only the instructor can change the roster."}
      </p>
      <RosterEditor courseId={courseId} members={rows} canEdit={canEdit} />
      {canEdit ? <RosterImport courseId={courseId} /> : null}
    </>
  );
}
