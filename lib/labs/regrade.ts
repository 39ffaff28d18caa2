// Recomputes every attempt of a lab after a published lab changed. Runs as a job; the lab_regrades row
// records its progress for the lab page's progress bar. Late penalties already applied and staff points
// are kept; each attempt's recomputation is a row of its grade history.
import { db } from "@/db";
import type { Db } from "@/db/types";
import { listAttempts } from "@/db/queries/attempts";
import { findLab } from "@/db/queries/labs";
import { findUploads } from "@/db/queries/uploads";
import { queueGradeMail } from "@/lib/mail/grade";
import { toLab, type StoredTrace } from "./grading";
import { recomputeAttempt } from "./rescore";

export async function startRegrade(labId: string, labVersion: number, total: number, trx: Db = db): Promise<{ id: string; total: number }> {
  const row = await trx
    .insertInto("lab_regrades")
    .values({ lab_id: labId, lab_version: labVersion, total })
    .returning("id")
    .executeTakeFirstOrThrow();
  return { id: row.id, total };
}

export async function latestRegrade(labId: string) {
  return db
    .selectFrom("lab_regrades")
    .select(["id", "status", "total", "done", "created_at as createdAt", "finished_at as finishedAt"])
    .where("lab_id", "=", labId)
    .orderBy("created_at", "desc")
    .limit(1)
    .executeTakeFirst();
}

export async function runRegrade(regradeId: string): Promise<void> {
  const job = await db.selectFrom("lab_regrades").selectAll().where("id", "=", regradeId).executeTakeFirst();
  if (!job || job.status === "done") return;
  const row = await findLab(db, job.lab_id);
  if (!row) return;
  const lab = toLab(row);
  const attempts = await listAttempts(db, lab.id);
  await db.updateTable("lab_regrades").set({ status: "running", total: attempts.length, done: 0 }).where("id", "=", regradeId).execute();
  // every attached trace's analysis, read once for the whole lab
  const uploads = new Map((await findUploads(db, [...new Set(attempts.flatMap((a) => a.uploadIds))])).map((u) => [u.id, u]));
  try {
    let done = 0;
    for (const a of attempts) {
      // graded (or already recomputed, when a job is retried) with this version of the lab: nothing to do
      if (a.labVersion === lab.version) {
        done++;
        continue;
      }
      const traces = a.uploadIds
        .map((id) => uploads.get(id))
        .filter((u) => u?.kind === "trace" && u.analysis)
        .map((u) => u!.analysis as StoredTrace);
      // one transaction per attempt, on the locked row: a staff change made meanwhile is kept, not lost.
      // The student's message is queued in the same transaction, when the score changed.
      await db.transaction().execute(async (trx) => {
        const r = await recomputeAttempt(trx, lab, a.id, traces, { kind: "recomputed" });
        if (r.score === a.score && r.rawScore === a.rawScore) return;
        await queueGradeMail(trx, {
          attemptId: a.id,
          eventKey: `recomputed:${a.id}:v${lab.version}`,
          kind: "recomputed",
          change: { scoreBefore: a.score, reason: "The instructor changed how this lab is graded, so your attempt was graded again." },
        });
      });
      done++;
      if (done % 10 === 0 || done === attempts.length) {
        await db.updateTable("lab_regrades").set({ done }).where("id", "=", regradeId).execute();
      }
    }
    await db.updateTable("lab_regrades").set({ status: "done", done, finished_at: new Date() }).where("id", "=", regradeId).execute();
  } catch (e) {
    await db.updateTable("lab_regrades").set({ status: "failed", finished_at: new Date() }).where("id", "=", regradeId).execute();
    throw e;
  }
}
