// Changing a lab. The patch is merged into the lab and the whole is validated with the builder's schema,
// so a PATCH can never leave a lab the grader cannot use. Changes that affect grades of a published lab
// with attempts bump its version and recompute every attempt in a background job.
import "server-only";
import { db } from "@/db";
import { countLabAttempts } from "@/db/queries/attempts";
import { updateLab } from "@/db/queries/labs";
import { AppError } from "@/lib/errors";
import { enqueue, QUEUES } from "@/lib/jobs/queue";
import { gradePolicySchema } from "@/lib/grader";
import type { z } from "zod";
import { labInputSchema, type labPatchSchema, type LabData } from "@/lib/validation/labs";
import { parseOr400 } from "@/lib/validation/zod-errors";
import { gradingKey } from "./changes";
import { startRegrade } from "./regrade";
import { type Lab, withIds } from "./grading";

/** Everything a grade depends on, normalised: a PATCH that leaves it unchanged recomputes nothing. */
function gradingKeyOf(l: LabData): string {
  return gradingKey(l, { questions: withIds, policy: (p) => gradePolicySchema.parse(p ?? {}) });
}

export function labAsInput(lab: Lab) {
  return {
    title: lab.title,
    templateKey: lab.templateKey,
    spec: lab.spec,
    questions: lab.questions,
    policy: lab.policy,
    attemptsAllowed: lab.attemptsAllowed,
    counting: lab.counting,
    opensAt: lab.opensAt ? lab.opensAt.toISOString() : null,
    dueAt: lab.dueAt ? lab.dueAt.toISOString() : null,
    closesAt: lab.closesAt ? lab.closesAt.toISOString() : null,
    latePenaltyPercentPerDay: lab.latePenaltyPercentPerDay,
    lateFloorPercent: lab.lateFloorPercent,
    showExpected: lab.showExpected,
    instructions: lab.instructions,
    safetyNotes: lab.safetyNotes,
    bench: lab.bench,
  };
}


export type LabPatch = z.output<typeof labPatchSchema>;

export async function editLab(lab: Lab, patch: LabPatch): Promise<{ regrade: { id: string; total: number } | null }> {
  const { status, ...fields } = patch as Record<string, unknown> & { status?: "draft" | "published" };
  const merged = parseOr400(labInputSchema, { ...labAsInput(lab), ...fields });
  const attempts = await countLabAttempts(db, lab.id);

  if (fields.templateKey !== undefined && merged.templateKey !== lab.templateKey && attempts > 0) {
    throw new AppError("conflict", "Students have already submitted attempts, so the circuit template can no longer change.", {
      templateKey: ["The template cannot change once attempts exist."],
    });
  }
  if (status === "draft" && lab.status === "published" && attempts > 0) {
    throw new AppError("conflict", "A lab with attempts cannot go back to draft.", { status: ["A lab with attempts cannot go back to draft."] });
  }
  const gradingChanged = gradingKeyOf(merged) !== gradingKeyOf(parseOr400(labInputSchema, labAsInput(lab)));
  const recompute = gradingChanged && lab.status === "published" && attempts > 0;

  const changed: Record<string, unknown> = {};
  for (const k of Object.keys(fields)) changed[k] = (merged as Record<string, unknown>)[k];
  if ("questions" in changed) changed.questions = withIds(merged.questions);
  // the edit, its recomputation row and the job commit together or not at all: a job that cannot be
  // queued rolls the edit back (the instructor sees an error and can save again), so no recomputation
  // is ever left "queued" without a job
  return db.transaction().execute(async (trx) => {
    await updateLab(trx, lab.id, { ...changed, ...(status ? { status } : {}) }, recompute);
    // publishing draws every student's circuit in one job (lib/labs/draws.ts), queued with the change
    if (status === "published" && lab.status !== "published") await enqueue(QUEUES.draws, { labId: lab.id }, { singletonKey: `draws:${lab.id}`, trx });
    if (!recompute) return { regrade: null };
    const regrade = await startRegrade(lab.id, lab.version + 1, attempts, trx);
    await enqueue(QUEUES.regrade, { regradeId: regrade.id }, { singletonKey: regrade.id, trx });
    return { regrade };
  });
}

