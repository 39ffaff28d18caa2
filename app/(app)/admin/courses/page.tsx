import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { db } from "@/db";
import { listAllCourses } from "@/db/queries/courses";
import { forPage, refused, requireAdmin } from "@/lib/auth/access";
import { AllCourses } from "@/components/course/all-courses";
import { CreateCourseForm } from "@/components/course/create-course-form";

export const metadata: Metadata = { title: "Courses" };

export default async function AdminCoursesPage() {
  const admin = await forPage(requireAdmin(), "/admin/courses");
  if (refused(admin)) forbidden();
  const courses = await listAllCourses(db);
  return (
    <>
      <h1 className="text-3xl">Every course</h1>
      <p className="mt-1 mb-6 text-sm text-ink-soft">{courses.length} course{courses.length === 1 ? "" : "s"} on this site. Open one to act as its instructor.</p>
      <AllCourses courses={courses} />
      <div className="mt-6">
        <CreateCourseForm />
      </div>
    </>
  );
}
