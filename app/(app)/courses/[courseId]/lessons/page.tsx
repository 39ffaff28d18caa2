import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { LessonPlanEditor } from "@/components/course/lesson-plan-editor";
import { forPage, refused, requireCourseRole } from "@/lib/auth/access";
import { coursePlan, lessonsForStudents } from "@/lib/courses/lesson-plan";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Lessons" };

const dateFmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

export default async function CourseLessonsPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId), `/courses/${courseId}/lessons`);
  if (refused(access)) forbidden();
  const lessons = await lessonsForStudents(courseId);
  const instructor = access.role === "instructor";
  const plan = instructor ? await coursePlan(courseId) : [];
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}`}>← {access.course.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl">Lessons</h1>
      <ol className="mt-6 space-y-3">
        {lessons.map((l, i) => (
          <li key={l.slug} className="card flex flex-wrap items-baseline gap-x-4 gap-y-1">
            <span className="font-mono text-sm text-ink-faint">{i + 1}.</span>
            {l.open ? (
              <Link href={`/lessons/${l.slug}?course=${courseId}`} className="text-lg font-semibold">
                {l.title}
              </Link>
            ) : (
              <span className="text-lg font-semibold text-ink-soft">{l.title}</span>
            )}
            <span className="text-sm text-ink-soft">about {l.minutes} minutes</span>
            {!l.open && l.opensAt ? <span className="text-sm text-caution">opens {dateFmt.format(l.opensAt)} UTC</span> : null}
          </li>
        ))}
      </ol>
      {instructor ? (
        <section className="mt-10" aria-labelledby="plan-heading">
          <h2 id="plan-heading" className="text-xl">
            Lesson plan
          </h2>
          <p className="mb-4 text-sm text-ink-soft">Tick the lessons this course shows, put them in order and set when each opens (leave empty to open at once).</p>
          <QueryProvider>
            <LessonPlanEditor
              courseId={courseId}
              initial={plan.map((l) => ({ slug: l.slug, title: l.title, visible: l.visible, opensAt: l.opensAt ? l.opensAt.toISOString() : null }))}
            />
          </QueryProvider>
        </section>
      ) : null}
    </>
  );
}
