// Pages that are not there for the caller answer with the not-found page AND status 404 (not a 200 that
// streams the not-found page after a loading skeleton): every course, lab and attempt page for someone
// outside the course, another student's attempt, and the development mailbox on a server that does not
// use the local mail stand-in. Plain fetches, no browser: the status is what a crawler or a script sees.
import net from "node:net";
import type { ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startNext, waitForHttp } from "../../scripts/lib/server";
import type { Client } from "../support/http";
import { addPerson, clientFor, courseWithPeople, fixedCircuitLab, publishedLab, sendAs } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "student" | "student2" | "outsider", Client>;
let labId: string;
let attemptId: string;

beforeAll(async () => {
  f = await courseWithPeople();
  const { email } = await addPerson("student2", { courseId: f.courseId, name: "Second student" });
  as = {
    instructor: await clientFor(f.people.instructor.email),
    student: await clientFor(f.people.student.email),
    student2: await clientFor(email),
    outsider: await clientFor(f.people.outsider.email),
  };
  labId = await publishedLab(
    sendAs(as.instructor),
    f.courseId,
    fixedCircuitLab({ title: "Not-found check", questions: [{ quantity: "indicatedCurrent", kind: "prediction", points: 4 }], safetyNotes: "Set the current limit first." }),
  );
  const sub = await as.student.post(`/api/labs/${labId}/attempts`, { idempotencyKey: `nf-${Date.now()}`, readings: { q1: "10.42 mA" } });
  expect(sub.status).toBe(201);
  attemptId = sub.body.attempt.id;
});

async function expectNotFound(c: Client, path: string) {
  const res = await c.fetch(path);
  const html = await res.text();
  expect(res.status, path).toBe(404);
  expect(html, path).toContain("Not found");
}

describe("pages that are not there for the caller", () => {
  it("answer 404 to another student for an attempt, while its owner reads it (200)", async () => {
    expect((await as.student.fetch(`/attempts/${attemptId}`)).status).toBe(200);
    await expectNotFound(as.student2, `/attempts/${attemptId}`);
    await expectNotFound(as.outsider, `/attempts/${attemptId}`);
    await expectNotFound(as.student, "/attempts/00000000-0000-4000-8000-000000000000");
  });

  it("answer 404 to someone outside the course on every course and lab page, while the instructor reads them (200)", async () => {
    const pages = [
      `/courses/${f.courseId}`,
      `/courses/${f.courseId}/labs`,
      `/courses/${f.courseId}/labs/new`,
      `/courses/${f.courseId}/lessons`,
      `/courses/${f.courseId}/roster`,
      `/courses/${f.courseId}/settings`,
      `/courses/${f.courseId}/reviews`,
      `/courses/${f.courseId}/reviews/${attemptId}`,
      `/labs/${labId}`,
      `/labs/${labId}/edit`,
      `/labs/${labId}/parts`,
      `/labs/${labId}/preview`,
    ];
    for (const path of pages) {
      expect((await as.instructor.fetch(path)).status, path).toBe(200);
      await expectNotFound(as.outsider, path);
    }
    await expectNotFound(as.outsider, "/courses/not-a-uuid");
    await expectNotFound(as.outsider, "/labs/00000000-0000-4000-8000-000000000000");
  });
});

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

// Two servers on the same build and database: one without the local mail stand-in, one with it but in
// production without SHUNTWISE_DEV_MAILBOX=1 (the mailbox shows every account's reset links)
for (const setting of ["without the local mail stand-in", "with the stand-in's folder, in production, without SHUNTWISE_DEV_MAILBOX"] as const) {
  describe(`the development mailbox on a server ${setting}`, () => {
    let server: ChildProcess | undefined;
    let url: string;

    beforeAll(async () => {
      const port = await freePort();
      url = `http://127.0.0.1:${port}`;
      const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production", DATABASE_URL: process.env.E2E_DATABASE_URL, SHUNTWISE_NO_WORKERS: "1", APP_URL: url, NEXTAUTH_URL: url };
      delete env.SHUNTWISE_DEV_MAILBOX;
      if (setting === "without the local mail stand-in") delete env.SHUNTWISE_MAIL_DIR;
      else expect(env.SHUNTWISE_MAIL_DIR).toBeTruthy();
      server = startNext({ distDir: process.env.SHUNTWISE_TEST_DIST_DIR ?? ".next-test", port, host: "127.0.0.1", env, quiet: true });
      await waitForHttp(`${url}/api/health`, server);
    }, 120_000);

    afterAll(async () => {
      if (!server || server.exitCode !== null) return;
      const exited = new Promise((r) => server!.once("exit", r));
      server.kill("SIGTERM");
      await exited;
    });

    it("answers 404 for the page and its JSON", async () => {
      const page = await fetch(`${url}/dev/mailbox`, { redirect: "manual" });
      expect(page.status).toBe(404);
      expect(await page.text()).toContain("Not found");
      expect((await fetch(`${url}/api/dev/mail`)).status).toBe(404);
    });
  });
}
