import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { BenchEditor } from "@/components/benches/bench-editor";
import { QueryProvider } from "@/components/providers/query-provider";
import { forPage, refused, requireCourseRole, STAFF } from "@/lib/auth/access";
import { arrangement } from "@/lib/benches/service";
import { MAX_AT_BENCH } from "@/lib/validation/benches";

export const metadata: Metadata = { title: "Benches" };

export default async function BenchesPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId, STAFF), `/courses/${courseId}/benches`);
  if (refused(access)) forbidden();
  const { benches, unseated } = await arrangement(courseId);
  const canEdit = access.role === "instructor";
  // every student of the course, seated or not, with their section
  const students = [
    ...benches.flatMap((b) => b.members.map((m) => ({ userId: m.userId, name: m.name, section: m.section ?? null }))),
    ...unseated,
  ].sort((a, b) => a.name.localeCompare(b.name, "en"));
  const seated = students.length - unseated.length;
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}`}>← {access.course.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl">Benches</h1>
      <p className="mt-1 mb-6 text-sm text-ink-soft">
        {benches.length} bench{benches.length === 1 ? "" : "es"}, {seated} of {students.length} students seated. One to {MAX_AT_BENCH} students work at a bench; partners of a
        bench lab share one circuit and one set of attempts.
        {canEdit ? " Changes take effect when you save; attempts already made keep the bench they were made at." : " Only the instructor can change the benches."}
      </p>
      <QueryProvider>
        <BenchEditor courseId={courseId} students={students} initial={benches.map((b) => ({ name: b.name, section: b.section, memberIds: b.members.map((m) => m.userId) }))} canEdit={canEdit} />
      </QueryProvider>
    </>
  );
}
