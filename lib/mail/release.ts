// Holding and releasing a lab's grades. While held, students see "graded, not yet released" and no grade
// e-mail goes out; releasing sends each student who has an attempt one message with their counted
// score (the best or last attempt, as the lab counts), queued in the releasing transaction.
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { listAttempts } from "@/db/queries/attempts";
import { lockLabHold, setGradesHeld } from "@/db/queries/labs";
import { notFound } from "@/lib/errors";
import { countingAttempt } from "@/lib/labs/policy";
import { queueGradeMail } from "./grade";

export async function setLabGradesHeld(db: Kysely<Database>, labId: string, held: boolean, now = new Date()) {
  return db.transaction().execute(async (trx) => {
    const lab = await lockLabHold(trx, labId);
    if (!lab) throw notFound("That lab");
    if (held || !lab.gradesHeld) {
      await setGradesHeld(trx, labId, held, null);
      return { held, messages: 0 };
    }
    await setGradesHeld(trx, labId, false, now);
    const byStudent = new Map<string, Awaited<ReturnType<typeof listAttempts>>>();
    for (const a of await listAttempts(trx, labId)) byStudent.set(a.userId, [...(byStudent.get(a.userId) ?? []), a]);
    let messages = 0;
    for (const [userId, attempts] of byStudent) {
      const counted = countingAttempt(attempts, lab.counting);
      if (!counted) continue;
      const r = await queueGradeMail(trx, { attemptId: counted.id, eventKey: `released:${labId}:${userId}:${now.getTime()}`, kind: "released" });
      if (r.queued) messages++;
    }
    return { held: false, messages };
  });
}
