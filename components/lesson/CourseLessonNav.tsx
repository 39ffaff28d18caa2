// On a lesson page opened from a course (`?course=`), the previous and next lessons in that course's own
// plan, read on the server (the page is rendered per request anyway), so a lesson page needs no
// client-side data fetching. Without a course in the address, or one that does not grant the lesson,
// nothing is shown.
import Link from "next/link";
import { coursePlan, lessonsForStudents, type LessonCourse } from "@/lib/courses/lesson-plan";

export async function CourseLessonNav({ slug, course }: { slug: string; course: LessonCourse }) {
  const staff = course.role === "ta" || course.role === "instructor";
  const items = (staff ? await coursePlan(course.id) : await lessonsForStudents(course.id)).filter((l) => l.open);
  const i = items.findIndex((l) => l.slug === slug);
  if (i < 0) return null;
  const prev = items[i - 1];
  const next = items[i + 1];
  return (
    <nav aria-label="This course's lessons" className="no-print mt-6 flex flex-wrap justify-between gap-4 rounded-card bg-paper-sunk p-3 text-sm">
      {prev ? <Link href={`/lessons/${prev.slug}?course=${course.id}`}>← In your course: {prev.title}</Link> : <span />}
      <Link href={`/courses/${course.id}/lessons`}>Course lesson list</Link>
      {next ? <Link href={`/lessons/${next.slug}?course=${course.id}`}>In your course: {next.title} →</Link> : <span />}
    </nav>
  );
}
