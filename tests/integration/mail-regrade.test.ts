// Staff regrades and review answers: queued as lib/labs/review.ts queues them (in the transaction that
// stores the change), sent whatever the student's graded-mail setting, saying what changed, by whom and why.
import { afterAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { findOutbox } from "@/db/queries/mail-outbox";
import { requestReview } from "@/db/queries/attempts";
import { stopBoss } from "@/lib/jobs/queue";
import type { Transaction } from "kysely";
import type { Database } from "@/db/types";
import { answerReviewRequest, overrideQuestion, recomputeAttempt } from "@/lib/labs/rescore";
import { queueGradeMail } from "@/lib/mail/grade";
import { submitAttempt } from "@/lib/labs/attempts";
import { transport } from "@/lib/mail/transport";
import { handleMailJobs } from "@/lib/mail/worker";
import { freePort, smallCourse, startCatcher } from "../support/mail";

afterAll(async () => {
  await stopBoss();
});

type Kind = "override" | "rerun";
/** The staff change and its message in one transaction, as the review routes do it. */
async function staffChange(kind: Kind, change: (trx: Transaction<Database>) => Promise<{ eventId: string; scoreBefore: number }>, attemptId: string, reason: string) {
  await db.transaction().execute(async (trx) => {
    const r = await change(trx);
    await queueGradeMail(trx, { attemptId, eventKey: `${kind}:${r.eventId}`, kind, change: { scoreBefore: r.scoreBefore, reason, by: "Ines Marlow" } });
  });
}

const rows = () => db.selectFrom("mail_outbox").select(["id", "kind", "key", "to_address", "data"]).orderBy("created_at").execute();

describe("regrade e-mails", () => {
  it("an override, a re-run and a review answer each queue one message, sent even to a student who turned graded e-mails off", async () => {
    const { lab, students, access, instructor } = await smallCourse(db);
    await db.updateTable("users").set({ grade_mail: false }).where("id", "=", students[0].id).execute();
    // 3.3 V / 1 kΩ = 3.3 mA (Ohm's law): 2 points; "1 A" for the metered current: 0 of 3
    const { attemptId } = await submitAttempt(lab, access(students[0]), { idempotencyKey: "r1", readings: { q1: "3.3 mA", q2: "1 A" }, measured: {}, uploadIds: [] });
    expect(await rows()).toHaveLength(0); // graded e-mails are off

    // a rolled-back override queues nothing
    await staffChange(
      "override",
      async (trx) => {
        await overrideQuestion(trx, attemptId, { questionId: "q2", points: 1.5, reason: "Right method" }, instructor.id);
        throw new Error("roll back");
      },
      attemptId,
      "Right method",
    ).catch(() => undefined);
    expect(await rows()).toHaveLength(0);

    const reason = "Right method, slipped a digit";
    await staffChange("override", (trx) => overrideQuestion(trx, attemptId, { questionId: "q2", points: 1.5, reason }, instructor.id), attemptId, reason);
    await staffChange("rerun", (trx) => recomputeAttempt(trx, lab, attemptId, [], { kind: "rerun", actorId: instructor.id, reason: "Grader fix" }), attemptId, "Grader fix");
    await requestReview(db, attemptId, "Please look at question 2 again");
    const answer = "Your reading was a thousand times too large; the points stand.";
    await db.transaction().execute(async (trx) => {
      const eventId = await answerReviewRequest(trx, attemptId, answer, instructor.id);
      await queueGradeMail(trx, { attemptId, eventKey: `review_answer:${eventId}`, kind: "review_answer", answer });
    });
    const queued = await rows();
    expect(queued.map((r) => r.kind)).toEqual(["override", "rerun", "review_answer"]);
    expect(new Set(queued.map((r) => r.to_address))).toEqual(new Set([students[0].email]));

    const port = await freePort();
    const smtp = await startCatcher(port);
    try {
      for (const r of queued) {
        await handleMailJobs([{ id: r.id, name: "mail-send", data: { outboxId: r.id }, retryCount: 0, retryLimit: 3 } as Parameters<typeof handleMailJobs>[0][number]], {
          transport: transport(`smtp://127.0.0.1:${port}`),
        });
        expect((await findOutbox(db, r.id))?.status).toBe("sent");
      }
      expect(smtp.messages).toHaveLength(3);
      const [override, rerun, answer] = smtp.messages;
      expect(override.text).toContain("What changed: 2 → 3.5 points, by Ines Marlow.");
      expect(override.text).toContain("Reason: Right method, slipped a digit");
      expect(override.subject).toContain("regraded by the staff");
      // the re-run puts the grader's points back: 3.5 → 2
      expect(rerun.text).toContain("What changed: 3.5 → 2 points, by Ines Marlow.");
      expect(answer.text).toContain("Answer from the staff: Your reading was a thousand times too large; the points stand.");
    } finally {
      await smtp.close();
    }
  });
});
