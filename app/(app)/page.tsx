import Link from "next/link";
import { Suspense } from "react";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { listAllCourses, listCoursesForUser } from "@/db/queries/courses";
import { listLabs } from "@/db/queries/labs";
import { currentUser, isStaff } from "@/lib/auth/access";
import { staffHome, studentHome } from "@/lib/courses/home";
import { timeLeft } from "@/lib/courses/home-summary";
import { toLab } from "@/lib/labs/grading";
import { roleLabel } from "@/lib/auth/roles";
import { AllCourses } from "@/components/course/all-courses";
import { when } from "@/components/course/home-parts";

async function WhatNext({ courseId, userId, staff, now }: { courseId: string; userId: string; staff: boolean; now: Date }) {
  if (staff) {
    const { reviews, closing, nextLater, regrades, drafts } = await staffHome(courseId, now);
    const lines = [
      `${reviews.length} open review request${reviews.length === 1 ? "" : "s"}`,
      ...[...closing, ...(nextLater ? [nextLater] : [])].map((l) => `${l.title} closes ${when(l.closesAt)}: ${l.submitted} submitted, ${l.missing} missing`),
      ...regrades.map((r) => `recomputing ${r.title}: ${r.done} of ${r.total}`),
      ...(drafts.length ? [`${drafts.length} draft lab${drafts.length === 1 ? "" : "s"} to finish`] : []),
    ];
    return (
      <ul className="mt-3 space-y-1 text-sm">
        {lines.map((l) => (
          <li key={l}>{l}</li>
        ))}
      </ul>
    );
  }
  const labs = (await listLabs(db, courseId, { publishedOnly: true })).map(toLab);
  const { summary } = await studentHome(courseId, userId, labs, now);
  const n = summary.nextDue;
  return (
    <p className="mt-3 text-sm">
      {n ? (
        <>
          Next due: <Link href={`/labs/${n.lab.id}`}>{n.lab.title}</Link>, {timeLeft(n.msLeft)} left ({n.attemptsLeft} attempt{n.attemptsLeft === 1 ? "" : "s"} left).
        </>
      ) : summary.open.length ? (
        `${summary.open.length} open lab${summary.open.length === 1 ? "" : "s"} with attempts left.`
      ) : (
        "Nothing is due right now."
      )}
    </p>
  );
}

export default async function HomePage() {
  const user = await currentUser();
  if (!user) redirect("/signin");
  const courses = await listCoursesForUser(db, user.id);
  const now = new Date();
  return (
    <>
      <h1 className="text-3xl">{courses.length || !user.isAdmin ? "My courses" : "Site administration"}</h1>
      {courses.length === 0 && !user.isAdmin ? (
        <p className="mt-4 text-ink-soft">
          You are not in any course yet. Ask your instructor for the join code, then{" "}
          <Link href="/signup">join with it</Link>.
        </p>
      ) : null}
      {courses.length ? (
        <ul className="mt-6 grid gap-4 sm:grid-cols-2">
          {courses.map((c) => (
            <li key={c.id} className="card">
              <p className="text-xs font-semibold uppercase tracking-wide text-copper">{c.code} · {c.term}</p>
              <h2 className="mt-1 text-lg">
                <Link href={`/courses/${c.id}`}>{c.title}</Link>
              </h2>
              <p className="mt-1 text-sm text-ink-soft">{c.institution}</p>
              <p className="mt-3 inline-block rounded-full bg-paper-sunk px-3 py-0.5 text-xs font-medium">
                {roleLabel[c.role]}
                {c.section ? ` · section ${c.section}` : ""}
              </p>
              <Suspense fallback={<p className="mt-3 text-sm text-ink-faint">Looking at what is next…</p>}>
                <WhatNext courseId={c.id} userId={user.id} staff={isStaff(c.role)} now={now} />
              </Suspense>
            </li>
          ))}
        </ul>
      ) : null}
      {user.isAdmin ? (
        <Suspense fallback={<p className="mt-8 text-sm text-ink-faint">Counting every course…</p>}>
          <AdminPanel />
        </Suspense>
      ) : null}
    </>
  );
}

async function AdminPanel() {
  const courses = await listAllCourses(db);
  const withoutInstructor = courses.filter((c) => !c.instructors).length;
  return (
    <section className="mt-8" aria-labelledby="admin-title">
      <h2 id="admin-title" className="text-xl">Every course on the site</h2>
      <p className="mt-1 mb-3 text-sm text-ink-soft">
        {courses.length} course{courses.length === 1 ? "" : "s"}
        {withoutInstructor ? `, ${withoutInstructor} without an instructor` : ""}. <Link href="/admin/courses">Create a course</Link> for the next term or a new subject, or{" "}
        <Link href="/admin/users">find an account</Link> to disable it.
      </p>
      <AllCourses courses={courses} />
    </section>
  );
}
