import Link from "next/link";
import { forPage, isStaff, refused, requireCourseRole } from "@/lib/auth/access";
import { roleLabel } from "@/lib/roles";
import { Refusal } from "@/components/shell/refusal";

export default async function CoursePage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId), `/courses/${courseId}`);
  if (refused(access)) return <Refusal message={access.refused} backHref="/" />;
  const { course, role } = access;
  return (
    <>
      <p className="text-xs font-semibold uppercase tracking-wide text-copper">
        {course.code} · {course.term} · {course.institution}
      </p>
      <h1 className="mt-1 text-3xl">{course.title}</h1>
      <p className="mt-2 text-sm text-ink-soft">You are in this course as: {roleLabel[role]}.</p>
      <nav aria-label="Course" className="mt-6 flex flex-wrap gap-3">
        <Link className="btn-quiet" href={`/courses/${course.id}/lessons`}>Lessons</Link>
        <Link className="btn-quiet" href={`/courses/${course.id}/labs`}>Bench labs</Link>
        {isStaff(role) ? (
          <Link className="btn-quiet" href={`/courses/${course.id}/roster`}>Roster</Link>
        ) : null}
      </nav>
      <section className="mt-8 grid gap-4 sm:grid-cols-2">
        <div className="card">
          <h2 className="text-lg">
            <Link href={`/courses/${course.id}/lessons`}>Lessons</Link>
          </h2>
          <p className="mt-1 text-sm text-ink-soft">Read them in order; each prepares one or more bench labs.</p>
        </div>
        <div className="card">
          <h2 className="text-lg">
            <Link href={`/courses/${course.id}/labs`}>Bench labs</Link>
          </h2>
          <p className="mt-1 text-sm text-ink-soft">Your own circuit values, your readings, graded against the physics.</p>
        </div>
      </section>
      {isStaff(role) && role === "instructor" ? (
        <p className="mt-6 text-sm text-ink-soft">
          Join code for students: <code className="rounded bg-paper-sunk px-2 py-0.5 font-mono">{course.joinCode}</code>
        </p>
      ) : null}
    </>
  );
}
