// Drawing every student's circuit when a lab is published, in one background job (pg-boss queue
// `lab-draws`, queued in the publishing transaction). A student who joins later is drawn on their first
// open (lib/labs/attempts.ts variantFor). Draws are deterministic (seed `${labId}:${userId}`), so a circuit
// drawn by the job and one drawn on open are the same; one already stored is kept.
import "server-only";
import { db } from "@/db";
import { drawProgress, findLab, storeVariants, studentsWithoutVariant } from "@/db/queries/labs";
import { drawVariant } from "@/lib/grader";
import { toLab } from "./grading";

const CHUNK = 200;

/** Draws and stores the circuit of every student of the lab's course who has none; answers how many were stored. */
export async function drawForEveryone(labId: string): Promise<number> {
  const row = await findLab(db, labId);
  if (!row || row.status !== "published") return 0;
  const lab = toLab(row);
  const missing = await studentsWithoutVariant(db, lab.id, lab.courseId);
  let stored = 0;
  for (let i = 0; i < missing.length; i += CHUNK) {
    const rows = missing.slice(i, i + CHUNK).map((userId) => {
      const seed = `${lab.id}:${userId}`;
      return { userId, seed, params: drawVariant(lab.spec, seed) };
    });
    stored += await storeVariants(db, lab.id, rows);
  }
  return stored;
}

/** The publish job's progress: students with a stored circuit, of all the course's students. */
export async function draws(labId: string, courseId: string) {
  return drawProgress(db, labId, courseId);
}
