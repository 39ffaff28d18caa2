import Link from "next/link";
import { forbidden } from "next/navigation";
import { Suspense } from "react";
import { db } from "@/db";
import { benchOf } from "@/db/queries/benches";
import { ownGrades } from "@/db/queries/gradebook";
import { StudentGrades } from "@/components/gradebook/student-grades";
import { forPage, isStaff, refused, requireCourseRole } from "@/lib/auth/access";
import { staffHome, studentHome } from "@/lib/courses/home";
import { openReviewCount } from "@/lib/labs/review";
import { labsForCourse } from "@/lib/labs/attempts";
import { roleLabel } from "@/lib/auth/roles";
import { NextLabDue, OpenLabs, Panel, when } from "@/components/course/home-parts";
import { DataTable, type Column } from "@/components/ui/table";

export default async function CoursePage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId), `/courses/${courseId}`);
  if (refused(access)) forbidden();
  const { course, role } = access;
  const staff = isStaff(role);
  const now = new Date();
  const openReviews = await openReviewCount(access);
  return (
    <>
      <p className="text-xs font-semibold uppercase tracking-wide text-copper">
        {course.code} · {course.term} · {course.institution}
      </p>
      <h1 className="mt-1 text-3xl">{course.title}</h1>
      <p className="mt-2 text-sm text-ink-soft">You are in this course as: {roleLabel[role]}.</p>
      {access.section ? <p className="text-sm text-ink-soft">Your section: {access.section}.</p> : null}
      <nav aria-label="Course" className="mt-6 flex flex-wrap gap-3">
        <Link className="btn-quiet" href={`/courses/${course.id}/lessons`}>Lessons</Link>
        <Link className="btn-quiet" href={`/courses/${course.id}/labs`}>Bench labs</Link>
        {staff ? <Link className="btn-quiet" href={`/courses/${course.id}/gradebook`}>Gradebook</Link> : null}
        {staff ? <Link className="btn-quiet" href={`/courses/${course.id}/roster`}>Roster</Link> : null}
        {staff ? <Link className="btn-quiet" href={`/courses/${course.id}/benches`}>Benches</Link> : null}
        {staff ? (
          <Link className="btn-quiet" href={`/courses/${course.id}/reviews`} data-testid="review-queue-link">
            Review queue{openReviews ? ` (${openReviews} open)` : ""}
          </Link>
        ) : null}
        {role === "instructor" ? <Link className="btn-quiet" href={`/courses/${course.id}/settings`}>Settings</Link> : null}
      </nav>
      <Suspense fallback={<p className="mt-8 text-sm text-ink-faint">Looking at what is next…</p>}>
        {staff ? <StaffHome courseId={course.id} joinCode={course.joinCode} joiningOpen={course.joiningOpen} now={now} /> : <StudentHome access={access} now={now} />}
      </Suspense>
    </>
  );
}

async function StudentHome({ access, now }: { access: Parameters<typeof labsForCourse>[0]; now: Date }) {
  const labs = await labsForCourse(access);
  const [{ summary, reviews, lesson }, own, bench] = await Promise.all([
    studentHome(access.course.id, access.user.id, labs, now),
    ownGrades(db, access.course.id, access.user.id),
    benchOf(db, access.course.id, access.user.id),
  ]);
  const courseId = access.course.id;
  return (
    <div className="mt-8 grid gap-4 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <NextLabDue summary={summary} />
      </div>
      <OpenLabs summary={summary} now={now} />
      <YourBench bench={bench} userId={access.user.id} />
      <Panel title="Next lesson" id="next-lesson">
        {lesson.current ? (
          <p>
            {lesson.current.latest ? "Read " : "Start with "}
            <Link href={`/lessons/${lesson.current.slug}?course=${courseId}`}>{lesson.current.title}</Link>
            {lesson.current.latest ? ", the latest lesson to open." : "."}
          </p>
        ) : null}
        {lesson.upcoming ? (
          <p className="mt-1 text-ink-soft">
            Coming next: {lesson.upcoming.title}
            {lesson.upcoming.opensAt ? `, opens ${when(lesson.upcoming.opensAt)}` : ""}.
          </p>
        ) : (
          <p className="mt-1 text-ink-soft">Every lesson of the plan is open to you.</p>
        )}
        <p className="mt-2">
          <Link href={`/courses/${courseId}/lessons`}>The whole lesson plan</Link>
        </p>
      </Panel>
      <div className="sm:col-span-2">
        <StudentGrades gradebook={own.gradebook} heldLabIds={own.heldLabIds} heading="Your scores" />
      </div>
      <Panel title="Answers to your review requests" id="reviews">
        {reviews.length === 0 ? (
          <p className="text-ink-soft">You have not asked for a review. From an attempt&apos;s feedback you can ask the staff to look again.</p>
        ) : (
          <ul className="space-y-1">
            {reviews.map((r) => (
              <li key={r.attemptId}>
                <Link href={`/attempts/${r.attemptId}`}>{r.labTitle}, attempt {r.number}</Link>:{" "}
                {r.answeredAt && r.requestedAt && new Date(r.answeredAt) >= new Date(r.requestedAt) ? (
                  <>
                    answered {when(r.answeredAt)}
                    {r.answer ? <span className="mt-0.5 block border-l-2 border-trace/40 pl-2 text-ink-soft">{r.answer}</span> : null}
                  </>
                ) : (
                  <>asked {when(r.requestedAt)}, waiting for an answer</>
                )}
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </div>
  );
}

function YourBench({ bench, userId }: { bench: Awaited<ReturnType<typeof benchOf>>; userId: string }) {
  const partners = bench?.members.filter((m) => m.userId !== userId) ?? [];
  return (
    <Panel title="Your bench" id="bench">
      {bench ? (
        <p data-testid="your-bench">
          You sit at <strong>{bench.name}</strong>
          {bench.section ? ` (section ${bench.section})` : ""}
          {partners.length ? <>, with {partners.map((p) => p.name).join(" and ")}.</> : ", alone for now."}
        </p>
      ) : (
        <p className="text-ink-soft" data-testid="your-bench">You have no bench yet; the instructor seats you before the first bench lab.</p>
      )}
    </Panel>
  );
}

type Closing = Awaited<ReturnType<typeof staffHome>>["closing"][number];
const closingColumns: Column<Closing>[] = [
  { header: "Lab", cell: (l) => <Link href={`/labs/${l.id}`}>{l.title}</Link> },
  { header: "Due", cell: (l) => (l.dueAt ? when(l.dueAt) : "no due date") },
  { header: "Closes", cell: (l) => when(l.closesAt) },
  { header: "Submitted", numeric: true, className: "font-mono", cell: (l) => l.submitted },
  { header: "Missing", numeric: true, className: "font-mono", cell: (l) => l.missing },
];

async function StaffHome({ courseId, joinCode, joiningOpen, now }: { courseId: string; joinCode: string; joiningOpen: boolean; now: Date }) {
  const { reviews, closing, nextLater, regrades, drafts } = await staffHome(courseId, now);
  return (
    <div className="mt-8 grid gap-4 sm:grid-cols-2">
      <Panel title={`Open review requests (${reviews.length})`} id="open-reviews">
        {reviews.length === 0 ? (
          <p className="text-ink-soft">No student is waiting for a review.</p>
        ) : (
          <ul className="space-y-1">
            {reviews.slice(0, 8).map((r) => (
              <li key={r.attemptId}>
                <Link href={`/attempts/${r.attemptId}`}>{r.studentName}: {r.labTitle}, attempt {r.number}</Link>{" "}
                <span className="text-ink-faint">asked {when(r.requestedAt)}</span>
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <Panel title="Labs closing this week" id="closing">
        {closing.length === 0 ? (
          <p className="text-ink-soft">
            No published lab stops taking attempts in the next seven days.
            {nextLater ? (
              <>
                {" "}Next: <Link href={`/labs/${nextLater.id}`}>{nextLater.title}</Link>, closes {when(nextLater.closesAt)}, {nextLater.submitted} submitted, {nextLater.missing} missing so far.
              </>
            ) : null}
          </p>
        ) : (
          <DataTable caption="Labs that stop taking attempts in the next seven days" className="min-w-full" density="tight" columns={closingColumns} rows={closing} rowKey={(l) => l.id} />
        )}
      </Panel>
      <Panel title="Drafts to finish" id="drafts">
        {drafts.length === 0 ? (
          <p className="text-ink-soft">Every lab is published.</p>
        ) : (
          <ul className="space-y-1">
            {drafts.map((d) => (
              <li key={d.id}>
                <Link href={`/labs/${d.id}`}>{d.title}</Link> <span className="text-ink-faint">(draft, students cannot see it)</span>
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <Panel title="Recomputing grades" id="regrades">
        {regrades.length === 0 ? (
          <p className="text-ink-soft">No recomputation is running.</p>
        ) : (
          <ul className="space-y-1">
            {regrades.map((r) => (
              <li key={r.id}>
                <Link href={`/labs/${r.labId}`}>{r.title}</Link>: {r.status === "queued" ? "waiting to start" : `${r.done} of ${r.total} attempts recomputed`}
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <Panel title="Join code" id="join-code">
        <p>
          <code className="rounded bg-paper-sunk px-2 py-0.5 font-mono text-base">{joinCode}</code>
        </p>
        <p className="mt-1 text-ink-soft">{joiningOpen ? "Students join with it on the sign-up page." : "Joining is closed; the instructor can open it in the settings."}</p>
      </Panel>
    </div>
  );
}
