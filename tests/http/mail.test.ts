// Graded e-mail against the test server: its worker sends through the local SMTP stand-in, and the
// development mailbox API shows what arrived. Also who may read the mailbox and the outbox.
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/scripts/seed/demo";
import { e2eDb } from "../support/db";
import { Client } from "../support/http";
import { clientFor, courseWithPeople } from "./fixtures";
import { fixedLabBody } from "../support/mail";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let admin: Client;
let as: Record<"instructor" | "student" | "ta", Client>;

type Message = { id: string; to: string; subject: string; text: string; html: string; date: string };

async function mailFor(to: string, until: (m: Message[]) => boolean, ms = 30_000): Promise<Message[]> {
  const end = Date.now() + ms;
  for (;;) {
    const r = await admin.json(`/api/dev/mail?to=${encodeURIComponent(to)}`);
    expect(r.status).toBe(200);
    if (until(r.body.messages) || Date.now() > end) return r.body.messages;
    await new Promise((res) => setTimeout(res, 500));
  }
}

/** A published lab on a fixed circuit: 3.3 V, 1 kΩ load, 10 Ω shunt; two questions worth 2 and 3 points. */
async function fixedLab(): Promise<string> {
  const created = await as.instructor.post(`/api/courses/${f.courseId}/labs`, fixedLabBody("Fixed circuit for mail"));
  expect(created.status).toBe(201);
  const id = created.body.lab.id as string;
  const pub = await as.instructor.json(`/api/labs/${id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ status: "published" }) });
  expect(pub.status).toBe(200);
  return id;
}

beforeAll(async () => {
  f = await courseWithPeople();
  as = { instructor: await clientFor(f.people.instructor.email), student: await clientFor(f.people.student.email), ta: await clientFor(f.people.ta.email) };
  admin = new Client();
  expect(await admin.signIn("admin@larkmoor-tech.example", DEMO_PASSWORD)).toBe(true);
});

describe("graded e-mail through the app's worker", () => {
  it("a submitted attempt sends its student one message with the score and a link that opens the attempt for its owner only", async () => {
    const labId = await fixedLab();
    const h = await as.student.json(`/api/labs/${labId}/handout`);
    const [q1, q2] = h.body.handout.questions.map((q: { id: string }) => q.id);
    // Ohm's law: 3.3 V / 1 kΩ = 3.3 mA (correct, 2 points); "1 A" for the metered current is wrong (0 of 3)
    const r = await as.student.post(`/api/labs/${labId}/attempts`, { idempotencyKey: `mail-${Date.now()}`, readings: { [q1]: "3.3 mA", [q2]: "1 A" } });
    expect(r.status).toBe(201);
    const attemptId = r.body.attempt.id as string;

    const messages = await mailFor(f.people.student.email, (m) => m.some((x) => x.text.includes(attemptId)));
    await new Promise((res) => setTimeout(res, 2000)); // a duplicate would arrive in this time
    const mine = (await mailFor(f.people.student.email, () => true)).filter((m) => m.text.includes(attemptId));
    expect(messages.length).toBeGreaterThan(0);
    expect(mine).toHaveLength(1);
    expect(mine[0].subject).toContain("2 / 5");
    expect(mine[0].text).toContain("Score: 2 / 5 points");
    expect(mine[0].html).toContain("Open the attempt");
    const link = /https?:\/\/[^\s"<>]+\/attempts\/[0-9a-f-]{36}/.exec(mine[0].text)?.[0];
    expect(link).toBeDefined();
    const path = new URL(link!).pathname;
    expect(path).toBe(`/attempts/${attemptId}`);
    const page = await as.student.fetch(path);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Fixed circuit for mail");
    const outsider = await clientFor(f.people.outsider.email);
    // the page streams behind a loading state, so the refusal is the not-found page's content
    const theirs = await (await outsider.fetch(path)).text();
    expect(theirs).toContain("Not found");
    expect(theirs).not.toContain("Fixed circuit for mail");
    expect((await outsider.json(`/api/attempts/${attemptId}`)).status).toBe(404);
  });
});

describe("the demo's messages", () => {
  it("the seed's graded e-mails reach the mailbox once the app's worker runs", async () => {
    const got = await mailFor("student.one@larkmoor-tech.example", (m) => m.length > 0);
    expect(got.length).toBeGreaterThan(0);
    expect(got[0].subject).toMatch(/^ELM-214: /);
    expect(got[0].text).toMatch(/Score: [\d.]+ \/ [\d.]+ points/);
  });
});

describe("held grades over HTTP", () => {
  it("students see 'graded, not yet released' and get no message until the instructor releases", async () => {
    const labId = await fixedLab();
    const put = (c: Client, body: unknown) => c.json(`/api/labs/${labId}/grades-held`, { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
    expect((await put(as.student, { held: true })).status).toBe(403);
    expect((await put(as.ta, { held: true })).status).toBe(403);
    const bad = await put(as.instructor, { held: "yes" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("held");
    expect((await put(as.instructor, { held: true })).body).toMatchObject({ lab: { id: labId, gradesHeld: true } });

    const h = await as.student.json(`/api/labs/${labId}/handout`);
    const [q1, q2] = h.body.handout.questions.map((q: { id: string }) => q.id);
    // 3.3 V / 1 kΩ = 3.3 mA; 3.3 V / 1010 Ω = 3.267 mA (Ohm's law): all 5 points
    const r = await as.student.post(`/api/labs/${labId}/attempts`, { idempotencyKey: `held-${Date.now()}`, readings: { [q1]: "3.3 mA", [q2]: "3.267 mA" } });
    expect(r.status).toBe(201);
    expect(r.body.attempt).toMatchObject({ status: "held", notice: "Graded, not yet released" });
    expect(r.body.attempt.score).toBeUndefined();
    const attemptId = r.body.attempt.id as string;
    const one = await as.student.json(`/api/attempts/${attemptId}`);
    expect(one.body.attempt.status).toBe("held");
    expect(one.body.attempt.results).toBeUndefined();
    const list = await as.student.json(`/api/labs/${labId}/attempts`);
    expect(list.body.attempts.every((a: { status: string; score?: number }) => a.status === "held" && a.score === undefined)).toBe(true);
    expect(await (await as.student.fetch(`/attempts/${attemptId}`)).text()).toContain("graded, not yet released");
    expect((await as.instructor.json(`/api/attempts/${attemptId}`)).body.attempt.score).toBe(5); // staff see the grade

    await new Promise((res) => setTimeout(res, 2000));
    expect((await mailFor(f.people.student.email, () => true)).filter((m) => m.text.includes(attemptId))).toHaveLength(0);
    const release = await put(as.instructor, { held: false });
    expect(release.body).toMatchObject({ lab: { gradesHeld: false }, released: 1 });
    const got = (await mailFor(f.people.student.email, (m) => m.some((x) => x.text.includes(attemptId)))).filter((m) => m.text.includes(attemptId));
    expect(got).toHaveLength(1);
    expect(got[0].text).toContain("Counted score: 5 / 5 points");
    expect((await as.student.json(`/api/attempts/${attemptId}`)).body.attempt.score).toBe(5);
  });
});

describe("who may read the mailbox and the outbox", () => {
  it("the mailbox API answers site admins only, and names a bad address", async () => {
    expect((await new Client().json("/api/dev/mail?to=a@b.example")).status).toBe(401);
    expect((await as.student.json("/api/dev/mail?to=a@b.example")).status).toBe(403);
    const bad = await admin.json("/api/dev/mail?to=not-an-address");
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("to");
    const ok = await admin.json("/api/dev/mail?to=nobody@nowhere.example");
    expect(ok.body).toEqual({ messages: [] });
    // the page refuses with 403; the browser draws app/(app)/dev/forbidden.tsx inside the app's shell
    const refused = await as.student.fetch("/dev/mailbox");
    expect(refused.status).toBe(403);
    const page = await refused.text();
    expect(page).toContain("NEXT_HTTP_ERROR_FALLBACK;403");
    expect(page).toContain("Only a site administrator");
  });

  it("the outbox shows counts and failures to admins; a failed message can be sent again and then arrives", async () => {
    expect((await new Client().json("/api/admin/outbox")).status).toBe(401);
    expect((await as.instructor.json("/api/admin/outbox")).status).toBe(403);
    const db = e2eDb();
    const to = `failed.${Date.now()}@test.example`;
    let id: string;
    try {
      const row = await db
        .insertInto("mail_outbox")
        .values({
          key: `test-failed:${to}`,
          kind: "password_reset",
          to_address: to,
          data: JSON.stringify({ purpose: "reset", name: "Failing Fern", tokenPath: "/reset-password/expired", minutes: 30 }),
          status: "failed",
          tries: 13,
          last_error: "connect ECONNREFUSED 127.0.0.1:25",
          failed_at: new Date(),
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      id = row.id;
    } finally {
      await db.destroy();
    }
    const summary = await admin.json("/api/admin/outbox");
    expect(summary.status).toBe(200);
    expect(summary.body.days[0]).toMatchObject({ day: new Date().toISOString().slice(0, 10) });
    expect(summary.body.days[0].failed).toBeGreaterThanOrEqual(1);
    expect(summary.body.failures.find((x: { id: string }) => x.id === id)).toMatchObject({ to, error: "connect ECONNREFUSED 127.0.0.1:25" });
    expect((await as.instructor.post(`/api/admin/outbox/${id}/resend`, {})).status).toBe(403);
    const again = await admin.post(`/api/admin/outbox/${id}/resend`, {});
    expect(again.status).toBe(200);
    expect((await admin.post(`/api/admin/outbox/${id}/resend`, {})).status).toBe(409);
    expect((await admin.post(`/api/admin/outbox/00000000-0000-4000-8000-000000000000/resend`, {})).status).toBe(404);
    const got = await mailFor(to, (m) => m.length > 0);
    expect(got).toHaveLength(1);
    expect(got[0].subject).toBe("Choose a new Shuntwise password");
  });
});
