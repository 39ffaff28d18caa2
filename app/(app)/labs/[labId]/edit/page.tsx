import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { db } from "@/db";
import { countLabAttempts } from "@/db/queries/attempts";
import { forPage, refused } from "@/lib/auth/access";
import { labAsInput } from "@/lib/labs/edit";
import { latestRegrade } from "@/lib/labs/regrade";
import { labAccess } from "@/lib/labs/attempts";
import { LabBuilder, type StoredLabInput } from "@/components/labs/builder/lab-builder";
import { RegradeProgress } from "@/components/labs/regrade-progress";
import { QueryProvider } from "@/components/providers/query-provider";

export const metadata: Metadata = { title: "Edit lab" };

const NOTICES: Record<string, string> = {
  created: "Draft saved. Students do not see it until you publish it.",
  "draft-saved": "The lab was saved as a draft, but it could not be published; check the fields and publish again.",
};

export default async function EditLabPage({ params, searchParams }: { params: Promise<{ labId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { labId } = await params;
  const sp = await searchParams;
  const found = await forPage(labAccess(labId, ["instructor"]), `/labs/${labId}/edit`);
  if (refused(found)) forbidden();
  const { lab } = found;
  const attemptCount = await countLabAttempts(db, lab.id);
  const regrade = await latestRegrade(lab.id);
  const running = regrade && (regrade.status === "queued" || regrade.status === "running") ? regrade : null;
  const input = JSON.parse(JSON.stringify(labAsInput(lab))) as StoredLabInput;
  const notice = typeof sp.notice === "string" ? NOTICES[sp.notice] : undefined;
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${lab.courseId}/labs`}>← Bench labs</Link>
      </p>
      <h1 className="mt-2 mb-6 text-3xl">Edit lab: {lab.title}</h1>
      <QueryProvider>
        {running ? <RegradeProgress labId={lab.id} regradeId={running.id} total={running.total} /> : null}
        <LabBuilder courseId={lab.courseId} lab={{ id: lab.id, status: lab.status, attemptCount, input }} notice={notice} />
      </QueryProvider>
    </>
  );
}
