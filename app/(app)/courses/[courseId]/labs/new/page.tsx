import type { Metadata } from "next";
import { coursePage } from "@/lib/auth/access";
import { CoursePageHeading } from "@/components/course/page-heading";
import { LabBuilder } from "@/components/labs/builder/lab-builder";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "New lab" };

export default async function NewLabPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await coursePage(courseId, `/courses/${courseId}/labs/new`, ["instructor"]);
  return (
    <>
      <CoursePageHeading backHref={`/courses/${courseId}/labs`} backLabel={<>Bench labs of {access.course.title}</>} title="New lab" className="mt-2 mb-6 text-3xl" />
      <QueryProvider>
        <LabBuilder
          courseId={courseId}
          latePolicy={{ latePenaltyPercentPerDay: access.course.defaultLatePenaltyPercentPerDay, lateFloorPercent: access.course.defaultLateFloorPercent }}
        />
      </QueryProvider>
    </>
  );
}
