"use client";

// On a (static) lesson page opened from a course, the previous and next lessons in that course's own
// plan, fetched from the course's lesson list. Without a course in the address nothing is shown.
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";

type Item = { slug: string; title: string; open: boolean };

export function CourseLessonNav({ slug }: { slug: string }) {
  const course = useSearchParams().get("course");
  const valid = Boolean(course && /^[0-9a-f-]{36}$/i.test(course));
  const { data: items } = useQuery({
    queryKey: ["course-lessons", course],
    queryFn: ({ signal }) => api<{ lessons: Item[] }>(`/api/courses/${course}/lessons`, { signal }),
    select: (b) => b.lessons.filter((l) => l.open),
    enabled: valid,
    // Not being able to place the lesson in a course only hides this bar; no retry, no message.
    retry: false,
  });
  if (!valid || !items) return null;
  const i = items.findIndex((l) => l.slug === slug);
  if (i < 0) return null;
  const prev = items[i - 1];
  const next = items[i + 1];
  return (
    <nav aria-label="This course's lessons" className="no-print mt-6 flex flex-wrap justify-between gap-4 rounded-card bg-paper-sunk p-3 text-sm">
      {prev ? <Link href={`/lessons/${prev.slug}?course=${course}`}>← In your course: {prev.title}</Link> : <span />}
      <Link href={`/courses/${course}/lessons`}>Course lesson list</Link>
      {next ? <Link href={`/lessons/${next.slug}?course=${course}`}>In your course: {next.title} →</Link> : <span />}
    </nav>
  );
}
