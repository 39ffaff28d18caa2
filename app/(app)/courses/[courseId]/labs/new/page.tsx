import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { forPage, refused, requireCourseRole } from "@/lib/auth/access";
import { LabBuilder } from "@/components/labs/builder/lab-builder";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "New lab" };

export default async function NewLabPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId, ["instructor"]), `/courses/${courseId}/labs/new`);
  if (refused(access)) forbidden();
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}/labs`}>← Bench labs of {access.course.title}</Link>
      </p>
      <h1 className="mt-2 mb-6 text-3xl">New lab</h1>
      <QueryProvider>
        <LabBuilder
          courseId={courseId}
          latePolicy={{ latePenaltyPercentPerDay: access.course.defaultLatePenaltyPercentPerDay, lateFloorPercent: access.course.defaultLateFloorPercent }}
        />
      </QueryProvider>
    </>
  );
}
