import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db";
import { listMembers } from "@/db/queries/courses";
import { forPage, refused, requireCourseRole, STAFF } from "@/lib/auth/access";
import { roleLabel } from "@/lib/roles";
import { RosterEditor } from "@/components/course/roster-editor";
import { RosterImport } from "@/components/course/roster-import";
import { Refusal } from "@/components/shell/refusal";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId, STAFF), `/courses/${courseId}/roster`);
  if (refused(access)) return <Refusal message={access.refused} backHref={`/courses/${courseId}`} />;
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
      {canEdit ? (
        <>
          <RosterEditor courseId={courseId} members={rows} />
          <RosterImport courseId={courseId} />
        </>
      ) : (
        <div className="card overflow-x-auto p-0">
          <table className="min-w-full text-sm">
            <caption className="sr-only">Course members</caption>
            <thead className="bg-paper-sunk text-left">
              <tr>
                <th scope="col" className="px-4 py-2">Name</th>
                <th scope="col" className="px-4 py-2">E-mail</th>
                <th scope="col" className="px-4 py-2">Role</th>
                <th scope="col" className="px-4 py-2">Section</th>
              </tr>
            </thead>
            <tbody>
              {members.map((m) => (
                <tr key={m.userId} className="border-t border-ink/10">
                  <td className="px-4 py-2">{m.name}</td>
                  <td className="px-4 py-2 font-mono text-xs">{m.email}</td>
                  <td className="px-4 py-2">{roleLabel[m.role]}</td>
                  <td className="px-4 py-2">{m.section ?? "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
