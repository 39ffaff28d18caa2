import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { forPage, refused, STAFF } from "@/lib/auth/access";
import { drawVariant } from "@/lib/grader";
import { handoutFromParams } from "@/lib/labs/handout";
import { labAccess } from "@/lib/labs/attempts";
import { Handout } from "@/components/labs/handout";

export const metadata: Metadata = { title: "Lab preview" };

function sampleNumber(v: string | string[] | undefined): number {
  const n = Number(Array.isArray(v) ? v[0] : v);
  return Number.isInteger(n) && n >= 1 && n <= 1_000_000 ? n : 1;
}

export default async function LabPreviewPage({ params, searchParams }: { params: Promise<{ labId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { labId } = await params;
  const n = sampleNumber((await searchParams).sample);
  const found = await forPage(labAccess(labId, STAFF), `/labs/${labId}/preview`);
  if (refused(found)) forbidden();
  const { lab, access } = found;
  let handout: ReturnType<typeof handoutFromParams> | null = null;
  let problem: string | null = null;
  try {
    handout = handoutFromParams(lab, drawVariant(lab.spec, `preview:${n}`));
  } catch (e) {
    problem = (e as Error).message;
  }
  return (
    <>
      <div className="no-print mb-6 rounded-card border border-trace/40 bg-trace-pale p-4" role="region" aria-label="Preview controls">
        <p className="font-semibold text-trace">
          Preview as a student sees it{lab.status === "draft" ? " (draft: students do not see this lab yet)" : ""}
        </p>
        <p className="mt-1 text-sm" data-testid="preview-sample">
          Sample student {n}. Each real student gets values of their own, drawn the same way and kept.
        </p>
        <nav aria-label="Preview" className="mt-3 flex flex-wrap gap-3">
          <Link className="btn-quiet no-underline hover:no-underline" href={`/labs/${lab.id}/preview?sample=${n + 1}`}>
            Draw another
          </Link>
          {access.role === "instructor" ? (
            <Link className="btn-quiet no-underline hover:no-underline" href={`/labs/${lab.id}/edit`}>
              Back to editing
            </Link>
          ) : null}
          <Link className="btn-quiet no-underline hover:no-underline" href={`/courses/${lab.courseId}/labs`}>
            All labs
          </Link>
        </nav>
      </div>
      {handout ? (
        <Handout handout={handout} />
      ) : (
        <section className="card" role="alert">
          <h1 className="text-xl">This lab cannot draw values</h1>
          <p className="mt-2 text-ink-soft">{problem}</p>
        </section>
      )}
    </>
  );
}
