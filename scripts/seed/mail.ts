// A few graded e-mails for the demo: the two demo student logins' attempts in the graded labs, and a
// staff regrade when the history has one. They are queued like any other message (one per event key,
// so seeding again adds none) and the app's worker delivers them to the local mailbox once it runs.
import type { Kysely, Transaction } from "kysely";
import { boss, stopBoss } from "../../lib/jobs/queue";
import { queueGradeMail } from "../../lib/mail/grade";
import type { Database } from "../../db/types";

export async function seedMail(db: Kysely<Database>, databaseUrl: string, studentIds: string[]): Promise<number> {
  await boss(databaseUrl);
  try {
    return await db.transaction().execute(async (trx: Transaction<Database>) => {
      const attempts = await trx
        .selectFrom("attempts")
        .select(["id", "user_id"])
        .where("user_id", "in", studentIds)
        .orderBy("submitted_at", "desc")
        .limit(4)
        .execute();
      let queued = 0;
      for (const a of attempts) {
        const r = await queueGradeMail(trx, { attemptId: a.id, eventKey: `graded:${a.id}`, kind: "graded" });
        if (r.queued) queued++;
      }
      const regrade = await trx
        .selectFrom("grade_events as e")
        .innerJoin("attempts as a", "a.id", "e.attempt_id")
        .leftJoin("users as u", "u.id", "e.actor_id")
        .select(["e.id", "e.attempt_id as attemptId", "e.score_before as scoreBefore", "e.reason", "u.name as actor"])
        .where("e.kind", "=", "override")
        // the demo logins' own (other students' regrades, such as those on labs 10 to 13, send nothing)
        .where("a.user_id", "in", studentIds)
        .orderBy("e.created_at", "desc")
        .limit(1)
        .executeTakeFirst();
      if (regrade) {
        const r = await queueGradeMail(trx, {
          attemptId: regrade.attemptId,
          eventKey: `override:${regrade.id}`,
          kind: "override",
          change: { scoreBefore: regrade.scoreBefore ?? 0, reason: regrade.reason, by: regrade.actor },
        });
        if (r.queued) queued++;
      }
      return queued;
    });
  } finally {
    await stopBoss();
  }
}
