import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { forPage, isStaff, refused } from "@/lib/auth/access";
import { templates } from "@/lib/grader";
import { handoutFor } from "@/lib/labs/handout";
import { closeOf, expectedWhenText, isClosed, isOpen, lateDays } from "@/lib/labs/policy";
import { attemptsFor, HELD_NOTICE, labAccess, type Lab } from "@/lib/labs/attempts";
import { DataTable, type Column } from "@/components/ui/table";
import { HoldGrades } from "@/components/mail/hold-grades";
import { ExceptionsPanel } from "@/components/labs/exceptions-panel";
import { db } from "@/db";
import { listMembers } from "@/db/queries/courses";
import { labExceptions } from "@/db/queries/exceptions";
import { draws } from "@/lib/labs/draws";
import { Handout } from "@/components/labs/handout";
import type { FormMeasured, FormQuestion } from "@/components/labs/submit/read";
import { utcDate } from "@/lib/dates";
import { attemptsLeftText, lateRuleText } from "@/lib/labs/wording";
import { SubmissionForm } from "@/components/labs/submit/submission-form";
import { BenchLauncher } from "@/components/labs/bench/bench-launcher";
import { hasSimulatedBench } from "@/lib/simulation/circuits";
import { VERDICT_ORDER, VERDICTS, points, verdictCounts, verdictSummary } from "@/components/labs/feedback/verdict";

export const metadata: Metadata = { title: "Lab" };

type Attempts = Awaited<ReturnType<typeof attemptsFor>>;

const attemptColumns: Column<Attempts[number]>[] = [
  { header: "Student", rowHeader: true, cell: (a) => a.studentName },
  { header: "Attempt", className: "tabular-nums", cell: (a) => a.number },
  {
    header: "Submitted",
    cell: (a) => (
      <>
        {utcDate(a.submittedAt)}
        {a.lateDays > 0 ? <span className="block text-xs text-verdict-close">{a.lateDays} day{a.lateDays === 1 ? "" : "s"} late</span> : null}
      </>
    ),
  },
  { header: "Score", className: "tabular-nums", cell: (a) => `${points(a.score)} / ${points(a.maxScore)}` },
  {
    header: "Verdicts",
    cell: (a) => {
      const counts = verdictCounts(a.results);
      return (
        <ul className="flex flex-wrap gap-x-3 gap-y-1" aria-label="Verdicts">
          {VERDICT_ORDER.filter((k) => counts[k] > 0).map((k) => (
            <li key={k} className={VERDICTS[k].text}>
              <span aria-hidden="true">{VERDICTS[k].icon} </span>
              {counts[k]} {VERDICTS[k].word.toLowerCase()}
            </li>
          ))}
        </ul>
      );
    },
  },
  { header: "Review", cell: (a) => (a.reviewRequestedAt ? "Requested" : "—") },
  {
    header: "Feedback",
    srOnly: true,
    cell: (a) => (
      <Link href={`/attempts/${a.id}`} aria-label={`Feedback on attempt ${a.number} by ${a.studentName}`}>
        Feedback
      </Link>
    ),
  },
];


export default async function LabPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const here = `/labs/${labId}`;
  const found = await forPage(labAccess(labId), here);
  if (refused(found)) forbidden();
  const { lab, access } = found;
  const attempts = await attemptsFor(lab, access);
  const back = (
    <p className="no-print text-sm">
      <Link href={`/courses/${lab.courseId}`}>← {access.course.title}</Link>
    </p>
  );
  if (isStaff(access.role)) {
    return (
      <>
        {back}
        <StaffOverview lab={lab} attempts={attempts} canEdit={access.role === "instructor"} />
        <LabDrawsAndExceptions lab={lab} canEdit={access.role === "instructor"} />
      </>
    );
  }

  const handout = await handoutFor(lab, access.user.id);
  const now = new Date();
  const used = attempts.length;
  const open = isOpen(lab, now);
  const left = lab.attemptsAllowed - used;
  const questions: FormQuestion[] = handout.questions.map((q) => ({
    id: q.id,
    label: q.label,
    unit: q.unit,
    displayUnit: q.displayUnit,
    answerKind: q.answerKind,
    choices: q.choices,
    points: q.points,
  }));
  const components: FormMeasured[] = handout.parameters
    .filter((p) => p.kind === "resistor" && typeof p.value === "number")
    .map((p) => ({ key: p.key, label: p.label, unit: p.unit, displayUnit: p.displayUnit, shown: p.shown }));
  const ordered = [...attempts].sort((a, b) => b.number - a.number);
  const late = lateDays(lab, now);
  const closed = isClosed(lab, now);

  return (
    <>
      {back}
      <div className="mt-4">
        <Handout handout={handout} headingLevel={1} timeZone="UTC" />
      </div>

      <section aria-label="Your standing in this lab" className="no-print card mt-6">
        <p className="font-semibold" data-testid="attempts-left">
          {attemptsLeftText(used, lab.attemptsAllowed)}
        </p>
        <p className="mt-1 text-sm text-ink-soft">{lateRuleText({ ...lab, closesAt: closeOf(lab) })}</p>
        {lab.exception ? (
          <p className="mt-1 text-sm" data-testid="own-dates">
            These are your own dates{lab.exception.extraAttempts ? ` and attempts (${lab.exception.extraAttempts} extra)` : ""}, given by the instructor: {lab.exception.reason}
          </p>
        ) : null}
        {late && !closed ? (
          <p className="mt-1 text-sm font-semibold text-verdict-close">
            <span aria-hidden="true">! </span>
            The due date has passed: an attempt now is {late} day{late === 1 ? "" : "s"} late.
          </p>
        ) : null}
      </section>

      {ordered.length ? (
        <section aria-labelledby="previous-heading" className="no-print mt-6">
          <h2 id="previous-heading" className="text-xl">
            Your attempts
          </h2>
          <ul className="mt-2 space-y-1 text-sm">
            {ordered.map((a) => (
              <li key={a.id}>
                <Link href={`/attempts/${a.id}`}>
                  Attempt {a.number}: {lab.gradesHeld ? HELD_NOTICE.toLowerCase() : `${points(a.score)} of ${points(a.maxScore)} points`}
                </Link>{" "}
                <span className="text-ink-soft">
                  ({lab.gradesHeld ? "" : `${verdictSummary(a.results)}; `}submitted {utcDate(a.submittedAt)}
                  {a.lateDays > 0 ? `, ${a.lateDays} day${a.lateDays === 1 ? "" : "s"} late` : ""})
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section className="no-print mt-6">
        {!open ? (
          <p className="card" role="status">
            This lab opens on {utcDate(lab.opensAt)}. You can read the handout now and submit from then on.
          </p>
        ) : closed ? (
          <p className="card" role="status" data-testid="lab-closed">
            This lab closed on {utcDate(closeOf(lab))} and accepts no more attempts.
          </p>
        ) : left <= 0 ? (
          <p className="card" role="status">
            You have used all your attempts. Open an attempt above to see its feedback or to ask for a review.
          </p>
        ) : (
          <SubmissionForm labId={lab.id} questions={questions} components={components} bench={lab.bench} />
        )}
      </section>

      {lab.bench !== "real" && hasSimulatedBench(lab.templateKey) ? (
        <div className="no-print mt-6">
          <BenchLauncher labId={lab.id} />
        </div>
      ) : null}
    </>
  );
}

/** The staff's view of the publish job's draws and the students' exceptions (the instructor grants and removes them). */
async function LabDrawsAndExceptions({ lab, canEdit }: { lab: Lab; canEdit: boolean }) {
  const [exceptions, members, drawn] = await Promise.all([labExceptions(db, lab.id), canEdit ? listMembers(db, lab.courseId) : Promise.resolve([]), draws(lab.id, lab.courseId)]);
  return (
    <>
      {lab.status === "published" ? (
        <p className="card mt-6 text-sm" data-testid="draw-progress">
          Circuits drawn: {drawn.drawn} of {drawn.students} student{drawn.students === 1 ? "" : "s"}
          {drawn.drawn < drawn.students ? " (publishing draws them in the background; a student who joins later is drawn on first opening the lab)." : "."}
        </p>
      ) : null}
      <ExceptionsPanel
        labId={lab.id}
        canEdit={canEdit}
        students={members.filter((m) => m.role === "student").map((m) => ({ userId: m.userId, name: m.name }))}
        exceptions={exceptions.map((x) => ({
          userId: x.userId,
          studentName: x.studentName,
          dueAt: x.dueAt ? new Date(x.dueAt).toISOString() : null,
          closesAt: x.closesAt ? new Date(x.closesAt).toISOString() : null,
          extraAttempts: x.extraAttempts,
          reason: x.reason,
        }))}
      />
    </>
  );
}

function StaffOverview({ lab, attempts, canEdit }: { lab: Lab; attempts: Attempts; canEdit: boolean }) {
  const students = new Set(attempts.map((a) => a.studentId)).size;
  const sorted = [...attempts].sort((a, b) => a.studentName.localeCompare(b.studentName) || a.number - b.number);
  return (
    <>
      <p className="mt-2 text-xs font-semibold uppercase tracking-wide text-copper">{lab.status === "published" ? "Published" : "Draft"} · {templates[lab.templateKey].title}</p>
      <h1 className="mt-1 text-3xl">{lab.title}</h1>
      <nav aria-label="Lab" className="mt-4 flex flex-wrap gap-3">
        {canEdit ? (
          <Link className="btn-quiet" href={`/labs/${lab.id}/edit`}>
            Edit lab
          </Link>
        ) : null}
        <Link className="btn-quiet" href={`/labs/${lab.id}/preview`}>
          Preview as a student
        </Link>
        <Link className="btn-quiet" href={`/labs/${lab.id}/parts`}>
          Bench parts list
        </Link>
        <Link className="btn-quiet" href={`/labs/${lab.id}/kits`}>
          Kits to pack
        </Link>
      </nav>
      <dl className="card mt-6 grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-ink-soft">Opens</dt>
          <dd className="m-0">{lab.opensAt ? utcDate(lab.opensAt) : "As soon as it is published"}</dd>
        </div>
        <div>
          <dt className="text-ink-soft">Due and late rule</dt>
          <dd className="m-0">{lateRuleText({ ...lab, closesAt: closeOf(lab) })}</dd>
        </div>
        <div>
          <dt className="text-ink-soft">Attempts</dt>
          <dd className="m-0">
            {lab.attemptsAllowed} allowed; the {lab.counting} one counts
          </dd>
        </div>
        <div>
          <dt className="text-ink-soft">Expected values shown to students</dt>
          <dd className="m-0">{expectedWhenText(lab, utcDate)} Staff always see them.</dd>
        </div>
        <div>
          <dt className="text-ink-soft">Questions</dt>
          <dd className="m-0">
            {lab.questions.length} ({points(lab.questions.reduce((s, q) => s + q.points, 0))} points)
          </dd>
        </div>
        <div>
          <dt className="text-ink-soft">Submissions</dt>
          <dd className="m-0">
            {attempts.length} attempt{attempts.length === 1 ? "" : "s"} from {students} student{students === 1 ? "" : "s"}
          </dd>
        </div>
      </dl>

      {canEdit ? <HoldGrades labId={lab.id} held={lab.gradesHeld} /> : lab.gradesHeld ? <p className="card mt-6">Grades of this lab are held: students do not see their scores yet.</p> : null}

      <h2 className="mt-8 text-xl">All attempts</h2>
      {sorted.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">No attempts yet.</p>
      ) : (
        <DataTable
          caption="Attempts at this lab, by student"
          card="mt-3"
          testId="attempts-table"
          density="medium"
          columns={attemptColumns}
          rows={sorted}
          rowKey={(a) => a.id}
          rowProps={() => ({ className: "align-top" })}
        />
      )}
    </>
  );
}
