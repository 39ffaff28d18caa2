// Held grades and the student's mail preference: while a lab's grades are held nothing is sent, and
// releasing sends each student one message with their counted score. The SMTP server is the test's own.
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { boss, QUEUES } from "@/lib/jobs/queue";
import { submitAttempt } from "@/lib/labs/attempts";
import { queueGradeMail } from "@/lib/mail/grade";
import { setLabGradesHeld } from "@/lib/mail/release";
import { transport } from "@/lib/mail/transport";
import { startMailWorker } from "@/lib/mail/worker";
import { freePort, smallCourse, startCatcher, until, type Catcher } from "../support/mail";

process.env.SHUNTWISE_MAIL_RETRY_DELAY = "1";

const catchers: Catcher[] = [];

beforeAll(async () => {
  await boss();
});
afterEach(async () => {
  await (await boss()).offWork(QUEUES.mail);
  await Promise.all(catchers.splice(0).map((c) => c.close()));
});
afterAll(async () => {
  await (await boss()).stop({ graceful: false, wait: true });
});

async function catcherAndWorker(): Promise<Catcher> {
  const port = await freePort();
  const smtp = await startCatcher(port);
  catchers.push(smtp);
  await startMailWorker(await boss(), { transport: transport(`smtp://127.0.0.1:${port}`), pollingIntervalSeconds: 0.5 });
  return smtp;
}

const outbox = () => db.selectFrom("mail_outbox").select(["key", "to_address", "kind"]).execute();

// Ohm's law on the fixed circuit (3.3 V, 1 kΩ load, 10 Ω shunt): I = 3.3 mA without the meter and
// 3.3 V / 1010 Ω = 3.267 mA with it. All right: 5 of 5 points; only the first: 2 of 5.
const ALL_RIGHT = { q1: "3.3 mA", q2: "3.267 mA" };
const FIRST_ONLY = { q1: "3.3 mA", q2: "1 A" };
const none = { measured: {}, uploadIds: [] };

describe("held grades", () => {
  it("send nothing while held; releasing sends one message per student with the counted score", async () => {
    const smtp = await catcherAndWorker();
    const { lab, students, access } = await smallCourse(db, { held: true, students: 2 });
    await submitAttempt(lab, access(students[0]), { idempotencyKey: "a1", readings: FIRST_ONLY, ...none });
    await submitAttempt(lab, access(students[0]), { idempotencyKey: "a2", readings: ALL_RIGHT, ...none });
    await submitAttempt(lab, access(students[1]), { idempotencyKey: "b1", readings: FIRST_ONLY, ...none });
    await new Promise((r) => setTimeout(r, 2000));
    expect(await outbox()).toHaveLength(0);
    expect(smtp.messages).toHaveLength(0);

    const released = await setLabGradesHeld(db, lab.id, false);
    expect(released).toEqual({ held: false, messages: 2 });
    await until(() => smtp.messages.length, (n) => n >= 2);
    await new Promise((r) => setTimeout(r, 2000));
    expect(smtp.messages).toHaveLength(2);
    const to = (i: number) => smtp.messages.find((m) => m.to && !Array.isArray(m.to) && m.to.text === students[i].email);
    // the lab counts the best attempt: 5 of 5 for the first student, 2 of 5 for the second
    expect(to(0)?.text).toContain("Counted score: 5 / 5 points");
    expect(to(1)?.text).toContain("Counted score: 2 / 5 points");

    // released: a new attempt is mailed at once; releasing again sends nothing more
    expect(await setLabGradesHeld(db, lab.id, false)).toEqual({ held: false, messages: 0 });
    await submitAttempt(lab, access(students[1]), { idempotencyKey: "b2", readings: ALL_RIGHT, ...none });
    await until(() => smtp.messages.length, (n) => n >= 3);
    expect(smtp.messages).toHaveLength(3);
  });
});

describe("graded e-mail preference", () => {
  it("a student who turned graded e-mails off gets none for a graded attempt, but a staff regrade is still sent", async () => {
    const { lab, students, access } = await smallCourse(db);
    await db.updateTable("users").set({ grade_mail: false }).where("id", "=", students[0].id).execute();
    const { attemptId } = await submitAttempt(lab, access(students[0]), { idempotencyKey: "p1", readings: FIRST_ONLY, ...none });
    expect(await outbox()).toHaveLength(0);
    const r = await db.transaction().execute((trx) =>
      queueGradeMail(trx, { attemptId, eventKey: `override:${attemptId}:1`, kind: "override", change: { scoreBefore: 2, reason: "Right method" } }),
    );
    expect(r.queued).toBe(true);
    expect(await outbox()).toEqual([{ key: `override:${attemptId}:1`, to_address: students[0].email, kind: "override" }]);
  });
});
