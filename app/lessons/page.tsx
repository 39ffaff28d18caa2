// Index of lessons in the global order (a course's own selection and opening dates come from its page).
import type { Metadata } from "next";
import Link from "next/link";
import { listLessons } from "@/lib/lessons";

export const metadata: Metadata = { title: "Lessons" };

export default function LessonsIndex() {
  const lessons = listLessons();
  return (
    <main className="mx-auto max-w-3xl px-4 py-8">
      <h1 className="mt-0 text-3xl">Measuring small currents: lessons</h1>
      <p className="text-ink-soft">Eleven short lessons, from bench safety to an uncertainty budget. Each ends with questions you can check in the page.</p>
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
  );
}
