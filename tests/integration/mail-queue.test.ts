// Graded e-mail through pg-boss and SMTP: queued in the grade's transaction, retried with backoff while
// the mail server is down, sent exactly once. The SMTP server here is the test's own, so the test can
// stop and start it; the worker is the app's (lib/mail/worker.ts) with a 1 s first retry delay.
import { sql } from "kysely";
import { simpleParser, type ParsedMail } from "mailparser";
import { SMTPServer } from "smtp-server";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { findOutboxByKey } from "@/db/queries/mail-outbox";
import { insertAttempt } from "@/db/queries/attempts";
import { boss, QUEUES } from "@/lib/jobs/queue";
import { attemptRecord, gradeForLab } from "@/lib/labs/grading";
import { submitAttempt, variantFor } from "@/lib/labs/attempts";
import { publicUrl } from "@/lib/mail/config";
import { queueGradeMail } from "@/lib/mail/grade";
import { queueMail } from "@/lib/mail/queue";
import { transport } from "@/lib/mail/transport";
import { handleMailJobs, startMailWorker } from "@/lib/mail/worker";
import { freePort, smallCourse, startCatcher, until, type Catcher } from "../support/mail";

process.env.SHUNTWISE_MAIL_RETRY_DELAY = "1";
process.env.NEXTAUTH_SECRET ??= "integration-test-secret";

const catchers: Catcher[] = [];
let workerId: string | null = null;

beforeAll(async () => {
  await boss();
});

afterEach(async () => {
  if (workerId) await (await boss()).offWork(QUEUES.mail);
  workerId = null;
  await Promise.all(catchers.splice(0).map((c) => c.close()));
});

afterAll(async () => {
  await (await boss()).stop({ graceful: false, wait: true });
});

async function jobsFor(outboxId: string): Promise<number> {
  const r = await sql<{ n: number }>`select count(*)::int as n from pgboss.job where name = ${QUEUES.mail} and data->>'outboxId' = ${outboxId}`.execute(db);
  return r.rows[0].n;
}

// Expected currents from Ohm's law (I = V / R): 3.3 V across 1 kΩ is 3.3 mA; the question answered
// with "1 A" is wrong. Points: 2 for the first question, 0 for the second, out of 2 + 3 = 5.
const READINGS = { q1: "3.3 mA", q2: "1 A" };

describe("graded e-mail", () => {
  it("with the SMTP server down, retries with backoff and delivers exactly one message once it is back", async () => {
    const port = await freePort();
    const { lab, students, access, course } = await smallCourse(db);
    workerId = await startMailWorker(await boss(), { transport: transport(`smtp://127.0.0.1:${port}`), pollingIntervalSeconds: 0.5 });

    const { attemptId } = await submitAttempt(lab, access(students[0]), { idempotencyKey: "k-1", readings: READINGS, measured: {}, uploadIds: [] });
    const failing = await until(() => findOutboxByKey(db, `graded:${attemptId}`), (r) => (r?.tries ?? 0) >= 1);
    expect(failing?.status).toBe("queued");
    expect(failing?.lastError).toMatch(/ECONNREFUSED|connect/i);

    const smtp = await startCatcher(port);
    catchers.push(smtp);
    await until(() => smtp.messages.length, (n) => n >= 1, 25_000);
    await new Promise((r) => setTimeout(r, 3000)); // a late duplicate would arrive in this time
    expect(smtp.messages).toHaveLength(1);
    const m = smtp.messages[0];
    expect(m.to && !Array.isArray(m.to) ? m.to.text : "").toBe(students[0].email);
    expect(m.subject).toContain(course.code);
    expect(m.subject).toContain("2 / 5");
    expect(m.text).toContain("Score: 2 / 5 points");
    expect(m.text).toContain("1. Current without the meter: correct, 2 / 2");
    expect(m.html).toContain(`${publicUrl()}/attempts/${attemptId}`);
    expect(m.text).toContain(`${publicUrl()}/attempts/${attemptId}`);

    const sent = await findOutboxByKey(db, `graded:${attemptId}`);
    expect(sent?.status).toBe("sent");
    expect(sent?.messageId).toBe(m.messageId);
  });

  it("after the last retry the message is marked failed with the SMTP error, for the admin outbox", async () => {
    const port = await freePort(); // nothing listens there
    const { lab, students, access } = await smallCourse(db);
    workerId = await startMailWorker(await boss(), { transport: transport(`smtp://127.0.0.1:${port}`), pollingIntervalSeconds: 0.5 });
    process.env.SHUNTWISE_MAIL_RETRY_LIMIT = "1";
    try {
      const { attemptId } = await submitAttempt(lab, access(students[0]), { idempotencyKey: "k-f", readings: READINGS, measured: {}, uploadIds: [] });
      const row = await until(() => findOutboxByKey(db, `graded:${attemptId}`), (r) => r?.status === "failed", 25_000);
      expect(row?.status).toBe("failed");
      expect(row?.tries).toBe(2); // the first try and one retry
      expect(row?.lastError).toMatch(/ECONNREFUSED|connect/i);
      expect(row?.failedAt).toBeInstanceOf(Date);
    } finally {
      delete process.env.SHUNTWISE_MAIL_RETRY_LIMIT;
    }
  });

  it("sends one message when the same job runs twice, one after the other or at the same time", async () => {
    const port = await freePort();
    const smtp = await startCatcher(port);
    catchers.push(smtp);
    const { lab, students, access } = await smallCourse(db);
    const { attemptId } = await submitAttempt(lab, access(students[0]), { idempotencyKey: "k-2", readings: READINGS, measured: {}, uploadIds: [] });
    const row = (await findOutboxByKey(db, `graded:${attemptId}`))!;
    const job = { id: row.jobId!, name: QUEUES.mail, data: { outboxId: row.id }, retryCount: 0, retryLimit: 3 } as Parameters<typeof handleMailJobs>[0][number];
    const t = transport(`smtp://127.0.0.1:${port}`);
    await Promise.all([handleMailJobs([job], { transport: t }), handleMailJobs([job], { transport: t })]);
    await handleMailJobs([job], { transport: t });
    expect(smtp.messages).toHaveLength(1);
  });

  it("queues nothing for a grade whose transaction rolls back, and one job for one that commits", async () => {
    const { lab, students } = await smallCourse(db);
    const grade = async (rollBack: boolean) => {
      let outboxId = "";
      await db
        .transaction()
        .execute(async (trx) => {
          const params = await variantFor(lab, students[0].id, trx);
          const attemptId = await insertAttempt(
            trx,
            attemptRecord({
              lab,
              userId: students[0].id,
              number: 1,
              idempotencyKey: `rb-${rollBack}`,
              readings: READINGS,
              measured: { typed: {}, values: {} },
              uploadIds: [],
              params,
              result: gradeForLab(lab, params, READINGS, {}, []),
              submittedAt: new Date(),
            }),
          );
          const r = await queueGradeMail(trx, { attemptId, eventKey: `graded:${attemptId}`, kind: "graded" });
          if (r.queued) outboxId = r.id;
          if (rollBack) throw new Error("the grade could not be stored");
        })
        .catch(() => undefined);
      return outboxId;
    };
    const rolledBack = await grade(true);
    expect(rolledBack).not.toBe("");
    expect(await jobsFor(rolledBack)).toBe(0);
    expect(await db.selectFrom("mail_outbox").select("id").where("id", "=", rolledBack).execute()).toHaveLength(0);
    expect(await db.selectFrom("attempts").select("id").execute()).toHaveLength(0);

    const committed = await grade(false);
    expect(await jobsFor(committed)).toBe(1);
  });

  it("queues one message per key: the same event twice makes one outbox row and one job", async () => {
    const data = { purpose: "reset", name: "Ada Fenwick", tokenPath: "/reset-password/x", minutes: 30 };
    const first = await db.transaction().execute((trx) => queueMail(trx, { key: "same-event", kind: "password_reset", to: "ada@test.example", data }));
    const second = await db.transaction().execute((trx) => queueMail(trx, { key: "same-event", kind: "password_reset", to: "ada@test.example", data }));
    expect(first.queued).toBe(true);
    expect(second).toEqual({ id: first.id, queued: false });
    expect(await jobsFor(first.id)).toBe(1);
  });

  it("a burst of 20 graded attempts while the SMTP server is down: each student gets exactly one message once it is back", async () => {
    const port = await freePort();
    const { lab, students, access } = await smallCourse(db, { students: 20 });
    workerId = await startMailWorker(await boss(), { transport: transport(`smtp://127.0.0.1:${port}`), pollingIntervalSeconds: 0.5 });
    const attempts = await Promise.all(
      students.map((s, i) => submitAttempt(lab, access(s), { idempotencyKey: `burst-${i}`, readings: READINGS, measured: {}, uploadIds: [] })),
    );
    const keys = attempts.map((a) => `graded:${a.attemptId}`);
    const triedOnce = async () => (await db.selectFrom("mail_outbox").select("tries").where("key", "in", keys).execute()).filter((r) => r.tries >= 1).length;
    expect(await until(triedOnce, (n) => n >= 1)).toBeGreaterThanOrEqual(1); // the server was down for at least one try

    const smtp = await startCatcher(port);
    catchers.push(smtp);
    const sentCount = async () => (await db.selectFrom("mail_outbox").select("id").where("key", "in", keys).where("status", "=", "sent").execute()).length;
    expect(await until(sentCount, (n) => n === 20, 50_000)).toBe(20);
    // every job has finished (no retry left that could send again)
    const open = () => sql<{ n: number }>`select count(*)::int as n from pgboss.job j join mail_outbox o on o.id::text = j.data->>'outboxId'
      where j.name = ${QUEUES.mail} and o.key in (${sql.join(keys)}) and j.state not in ('completed', 'failed', 'cancelled')`.execute(db).then((r) => r.rows[0].n);
    expect(await until(open, (n) => n === 0, 20_000)).toBe(0);
    const to = smtp.messages.map((m) => (m.to && !Array.isArray(m.to) ? m.to.text : ""));
    expect(to.sort()).toEqual(students.map((s) => s.email).sort());
  }, 90_000);

  it("a server slower than the job's expiry still gets the message once: the retried job finds it sent", async () => {
    const port = await freePort();
    const messages: ParsedMail[] = [];
    let answered = 0;
    // accepts each message only after 4 s, while the job expires after 2 s
    const slow = new SMTPServer({
      authOptional: true,
      disabledCommands: ["AUTH", "STARTTLS"],
      logger: false,
      onData(stream, _session, callback) {
        simpleParser(stream).then((m) => {
          messages.push(m);
          setTimeout(() => {
            answered++;
            callback();
          }, 4000);
        }, callback);
      },
    });
    await new Promise<void>((r) => slow.listen(port, "127.0.0.1", () => r()));
    catchers.push({ messages, close: () => new Promise<void>((r) => slow.close(() => r())) });
    process.env.SHUNTWISE_MAIL_EXPIRE_SECONDS = "2";
    try {
      const { lab, students, access } = await smallCourse(db);
      workerId = await startMailWorker(await boss(), { transport: transport(`smtp://127.0.0.1:${port}`), pollingIntervalSeconds: 0.5 });
      const { attemptId } = await submitAttempt(lab, access(students[0]), { idempotencyKey: "k-slow", readings: READINGS, measured: {}, uploadIds: [] });
      const row = (await until(() => findOutboxByKey(db, `graded:${attemptId}`), (r) => r?.status === "sent", 25_000))!;
      expect(row.status).toBe("sent");
      // the job expired while the first send waited: pg-boss ran it again, and that run completed
      const runs = () => sql<{ state: string; retry_count: number }>`select state, retry_count from pgboss.job where name = ${QUEUES.mail} and data->>'outboxId' = ${row.id}`.execute(db).then((r) => r.rows);
      const done = await until(runs, (r) => r.length === 1 && r[0].state === "completed" && r[0].retry_count >= 1, 25_000);
      expect(done).toEqual([expect.objectContaining({ state: "completed" })]);
      expect(done[0].retry_count).toBeGreaterThanOrEqual(1);
      expect(messages).toHaveLength(1);
      expect(answered).toBe(1);
      expect(row.tries).toBe(1);
    } finally {
      delete process.env.SHUNTWISE_MAIL_EXPIRE_SECONDS;
    }
  }, 60_000);
});
