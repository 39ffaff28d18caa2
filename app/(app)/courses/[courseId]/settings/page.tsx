import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db";
import { labWeights } from "@/db/queries/gradebook";
import { coursePage } from "@/lib/auth/access";
import { CoursePageHeading } from "@/components/course/page-heading";
import { WeightsForm } from "@/components/gradebook/weights-form";
import { CopyCourseForm, CourseSettingsForm, JoinCodePanel } from "@/components/course/settings-form";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Course settings" };

export default async function CourseSettingsPage({ params, searchParams }: { params: Promise<{ courseId: string }>; searchParams: Promise<{ copied?: string }> }) {
  const { courseId } = await params;
  const access = await coursePage(courseId, `/courses/${courseId}/settings`, ["instructor"]);
  const { course } = access;
  const copied = (await searchParams).copied;
  const weights = await labWeights(db, courseId);
  return (
    <>
      <CoursePageHeading backHref={`/courses/${courseId}`} backLabel={course.title} title="Course settings" />
      <p className="mt-1 mb-6 text-sm text-ink-soft">{course.code} · {course.institution}</p>
      {copied !== undefined ? (
        <p role="status" className="mb-6 rounded-md bg-trace-pale p-3 text-sm text-trace">
          This is the new copy: its {Number(copied) || 0} lab{Number(copied) === 1 ? " is a draft" : "s are drafts"} until you publish them. Check the dates, then open joining when the term starts.
        </p>
      ) : null}
      <div className="grid gap-6">
        <CourseSettingsForm
          courseId={courseId}
          initial={{
            title: course.title,
            term: course.term,
            joiningOpen: course.joiningOpen,
            defaultLatePenaltyPercentPerDay: course.defaultLatePenaltyPercentPerDay,
            defaultLateFloorPercent: course.defaultLateFloorPercent,
          }}
        />
        <JoinCodePanel key={course.joinCode} courseId={courseId} joinCode={course.joinCode} joiningOpen={course.joiningOpen} />
        <section id="lab-weights" aria-labelledby="lab-weights-heading" className="card">
          <h2 id="lab-weights-heading" className="text-xl">
            Lab weights
          </h2>
          <p className="mb-3 text-sm text-ink-soft">
            The gradebook&apos;s total and its export use these. <Link href={`/courses/${courseId}/gradebook`}>Open the gradebook</Link>
          </p>
          <QueryProvider>
            <WeightsForm courseId={courseId} labs={weights} />
          </QueryProvider>
        </section>
        <CopyCourseForm courseId={courseId} code={course.code} />
      </div>
    </>
  );
}
