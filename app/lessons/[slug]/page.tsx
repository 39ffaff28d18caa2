// A lesson page: one per MDX file, math typeset at build time by rehype-katex (no KaTeX code reaches the
// browser), calculators hydrated as client components. Rendered per request: the server checks that one
// of the reader's courses shows the lesson and has opened it (staff and the site admin read every lesson);
// anyone else gets the not-found page. The proxy only redirects early.
import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { getLesson, lessonContents, neighbours } from "@/lib/lessons";
import { currentUser } from "@/lib/auth/access";
import { lessonAccess } from "@/lib/courses/lesson-plan";
import { lessonComponents } from "@/components/lesson/mdx";
import { CourseLessonNav } from "@/components/lesson/CourseLessonNav";
import { AppHeader } from "@/components/shell/app-header";

type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const lesson = getLesson((await params).slug);
  return lesson ? { title: lesson.title, description: lesson.summary } : {};
}

export default async function LessonPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const lesson = getLesson(slug);
  if (!lesson) notFound();
  const user = await currentUser();
  if (!user) redirect(`/signin?next=${encodeURIComponent(`/lessons/${slug}`)}`);
  const access = await lessonAccess(user, slug);
  if (!access.readable) notFound();
  const wanted = (await searchParams).course;
  const fromCourse = access.courses.find((c) => c.id === wanted) ?? null;
  const course = fromCourse ?? access.courses[0] ?? null;
  const { default: Content } = await import(`@/content/lessons/${slug}.mdx`);
  const toc = lessonContents(slug);
  const { previous, next } = neighbours(slug);

  return (
    <>
    <AppHeader user={user} course={course} current="lessons" />
    <div className="mx-auto max-w-6xl px-4 py-8 print:max-w-none print:p-0">
      <nav aria-label="Breadcrumb" className="no-print mb-4 text-sm">
        <Link href="/lessons">All lessons</Link> <span aria-hidden="true">/</span> <span>Lesson {lesson.order}</span>
      </nav>
      <div className="lg:grid lg:grid-cols-[1fr_15rem] lg:gap-10">
        <article className="min-w-0 max-w-3xl" aria-labelledby="lesson-title">
          <header className="mb-6 border-b border-ink/10 pb-4">
            <p className="m-0 text-sm font-semibold tracking-wide text-copper uppercase">
              Lesson {lesson.order} · about {lesson.minutes} minutes
            </p>
            <h1 id="lesson-title" className="mt-1 mb-2 text-3xl">
              {lesson.title}
            </h1>
            <p className="my-2 text-lg text-ink-soft">{lesson.summary}</p>
            <h2 className="mt-4 mb-1 text-base">After this lesson you can</h2>
            <ul className="my-1 list-disc space-y-1 pl-6">
              {lesson.objectives.map((o) => (
                <li key={o}>{o}</li>
              ))}
            </ul>
          </header>
          {fromCourse ? <CourseLessonNav slug={slug} course={fromCourse} /> : null}
          <Content components={lessonComponents} />
          <nav aria-label="Lesson sequence" className="no-print mt-12 flex flex-wrap justify-between gap-4 border-t border-ink/10 pt-4">
            {previous ? (
              <Link href={`/lessons/${previous.slug}`} rel="prev" className="btn-quiet">
                ← Lesson {previous.order}: {previous.title}
              </Link>
            ) : (
              <span />
            )}
            {next && (
              <Link href={`/lessons/${next.slug}`} rel="next" className="btn-quiet">
                Lesson {next.order}: {next.title} →
              </Link>
            )}
          </nav>
        </article>
        <aside className="no-print order-first mb-6 lg:order-none lg:mb-0">
          <nav aria-label="On this page" className="lg:sticky lg:top-6">
            <h2 className="mt-0 mb-2 text-sm font-semibold tracking-wide text-ink-soft uppercase">On this page</h2>
            <ol className="m-0 list-none space-y-1 p-0 text-sm">
              {toc.map((h) => (
                <li key={h.id}>
                  <a href={`#${h.id}`}>{h.text}</a>
                </li>
              ))}
            </ol>
          </nav>
        </aside>
      </div>
    </div>
    </>
  );
}
