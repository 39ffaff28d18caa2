import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { forPage, isStaff, refused, requireCourseRole } from "@/lib/auth/access";
import { templates } from "@/lib/grader";
import { closeOf } from "@/lib/labs/policy";
import { labsForCourse } from "@/lib/labs/attempts";
import { DataTable, type Column } from "@/components/ui/table";
import { labState, STATE_LABEL } from "@/lib/labs/schedule";

export const metadata: Metadata = { title: "Bench labs" };

const NOTICES: Record<string, string> = {
  published: "The lab is published: students in the course can now open it.",
};

function when(d: Date | null): string {
  if (!d) return "—";
  return new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZoneName: "short" }).format(d);
}

type Row = { lab: Awaited<ReturnType<typeof labsForCourse>>[number]; closes: Date | null; state: ReturnType<typeof labState> };

function labColumns(staff: boolean, instructor: boolean): Column<Row>[] {
  const columns: Column<Row>[] = [
    {
      header: "Lab",
      cell: ({ lab }) => (
        <>
          {lab.status === "published" ? <Link href={`/labs/${lab.id}`}>{lab.title}</Link> : <span className="font-medium">{lab.title}</span>}
          <span className="block text-xs text-ink-faint">{templates[lab.templateKey]?.title}</span>
        </>
      ),
    },
    { header: "Opens", className: "whitespace-nowrap", cell: ({ lab }) => when(lab.opensAt) },
    { header: "Due", className: "whitespace-nowrap", cell: ({ lab }) => when(lab.dueAt) },
    { header: "Closes", className: "whitespace-nowrap", cellProps: () => ({ "data-testid": "lab-closes" }), cell: ({ closes }) => (closes ? when(closes) : "Never") },
    {
      header: "State",
      cell: ({ lab, state }) => (
        <>
          {staff && lab.status === "draft" ? (
            <span className="rounded-full border border-ink/30 px-2 py-0.5 text-xs font-semibold">Draft</span>
          ) : (
            <span className="rounded-full bg-paper-sunk px-2 py-0.5 text-xs font-semibold" data-state={state}>
              {STATE_LABEL[state]}
            </span>
          )}
          {staff && lab.status === "published" ? <span className="ml-1 text-xs text-ink-faint">published</span> : null}
        </>
      ),
    },
  ];
  if (staff) {
    columns.push({
      header: "Actions",
      srOnly: true,
      className: "whitespace-nowrap",
      cell: ({ lab }) => (
        <>
          {instructor ? (
            <Link href={`/labs/${lab.id}/edit`} aria-label={`Edit ${lab.title}`}>
              Edit
            </Link>
          ) : null}
          {instructor ? " · " : null}
          <Link href={`/labs/${lab.id}/preview`} aria-label={`Preview ${lab.title}`}>
            Preview
          </Link>
        </>
      ),
    });
  }
  return columns;
}

export default async function LabsPage({ params, searchParams }: { params: Promise<{ courseId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { courseId } = await params;
  const sp = await searchParams;
  const access = await forPage(requireCourseRole(courseId), `/courses/${courseId}/labs`);
  if (refused(access)) forbidden();
  const staff = isStaff(access.role);
  const instructor = access.role === "instructor";
  const labs = await labsForCourse(access);
  const now = new Date();
  const notice = typeof sp.notice === "string" ? NOTICES[sp.notice] : undefined;
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}`}>← {access.course.title}</Link>
      </p>
      <div className="mt-2 flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-3xl">Bench labs</h1>
        {instructor ? (
          <Link className="btn-primary no-underline hover:no-underline" href={`/courses/${courseId}/labs/new`}>
            New lab
          </Link>
        ) : null}
      </div>
      <p className="mt-1 text-sm text-ink-soft">
        {staff
          ? "All labs of the course, drafts included. Students see only published labs."
          : "Each lab gives you your own circuit values. Open a lab to read its handout and submit your readings."}
      </p>
      {notice ? (
        <p role="status" className="mt-4 rounded-md bg-trace-pale p-3 text-sm text-trace">
          {notice}
        </p>
      ) : null}
      {labs.length === 0 ? (
        <p className="card mt-6">{staff ? "No labs yet." : "No labs are published yet."}</p>
      ) : (
        <DataTable
          caption={`Labs of ${access.course.title}`}
          card="mt-6"
          testId="labs-table"
          columns={labColumns(staff, instructor)}
          rows={labs.map((lab) => {
            const closes = closeOf(lab);
            return { lab, closes, state: labState({ ...lab, closesAt: closes }, now) };
          })}
          rowKey={(r) => r.lab.id}
          rowProps={(r) => ({ className: "align-top", "data-lab": r.lab.id })}
        />
      )}
    </>
  );
}
