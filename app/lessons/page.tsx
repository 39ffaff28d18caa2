// Index of lessons in the global order (a course's own selection and opening dates come from its page).
import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { listLessons } from "@/lib/lessons";
import { currentUser } from "@/lib/auth/access";
import { readableLessonSlugs } from "@/lib/courses/lesson-plan";
import { AppHeader } from "@/components/shell/app-header";

export const metadata: Metadata = { title: "Lessons" };

export default async function LessonsIndex() {
  const user = await currentUser();
  if (!user) redirect("/signin?next=%2Flessons");
  // only the lessons one of the reader's courses shows and has opened (staff and the site admin: all)
  const readable = await readableLessonSlugs(user);
  const lessons = listLessons().filter((l) => readable.has(l.slug));
  return (
    <>
    <AppHeader user={user} />
    <main className="mx-auto max-w-3xl px-4 py-8">
      <h1 className="mt-0 text-3xl">Measuring small currents: lessons</h1>
      <p className="text-ink-soft">Short lessons, from bench safety to an uncertainty budget, as your courses open them. Each ends with questions you can check in the page.</p>
      <ol className="mt-6 list-none space-y-4 p-0">
        {lessons.map((l) => (
          <li key={l.slug} className="card">
            <p className="m-0 text-sm text-copper">
              Lesson {l.order} · about {l.minutes} minutes
            </p>
            <h2 className="mt-1 mb-1 text-xl">
              <Link href={`/lessons/${l.slug}`}>{l.title}</Link>
            </h2>
            <p className="m-0 text-ink-soft">{l.summary}</p>
          </li>
        ))}
      </ol>
    </main>
    </>
  );
}
