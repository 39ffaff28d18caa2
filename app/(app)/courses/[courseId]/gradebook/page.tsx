import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { forPage, refused, requireCourseRole, STAFF } from "@/lib/auth/access";

export const metadata: Metadata = { title: "Gradebook" };

export default async function GradebookPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId, STAFF), `/courses/${courseId}/gradebook`);
  if (refused(access)) forbidden();
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}`}>← {access.course.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl">Gradebook</h1>
    </>
  );
}
