// Jobs that cannot get stuck, against real PostgreSQL: a lab edit, its recomputation row and its job
// commit together (a job that cannot be queued rolls the edit back), and a job queue that could not
// start (the database not up yet at boot) is started again instead of staying broken.
import net from "node:net";
import { sql } from "kysely";
import { afterAll, afterEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db";
import { findLab } from "@/db/queries/labs";
import { boss, QUEUES, stopBoss } from "@/lib/jobs/queue";
import { editLab } from "@/lib/labs/edit";
import { toLab } from "@/lib/labs/grading";
import { submitAttempt } from "@/lib/labs/attempts";
import { startWorkersRetrying, UPLOAD_SWEEP_CRON } from "@/lib/jobs/workers";
import { freePort, smallCourse, until } from "../support/mail";

afterEach(async () => {
  vi.restoreAllMocks();
  await stopBoss();
});

afterAll(async () => {
  await stopBoss();
});

async function regradeJobs(labId: string): Promise<number> {
  const r = await sql<{ n: number }>`
    select count(*)::int as n from pgboss.job j join lab_regrades r on r.id::text = j.data->>'regradeId'
    where j.name = ${QUEUES.regrade} and r.lab_id = ${labId}`.execute(db);
  return r.rows[0].n;
}

/** A published lab with one attempt, so that a change to its grading starts a recomputation. */
async function labWithAttempt() {
  const { lab, students, access } = await smallCourse(db);
  await submitAttempt(lab, access(students[0]), { idempotencyKey: `jobs-${lab.id}`, readings: { q1: "3.3 mA" }, measured: {}, uploadIds: [] });
  return toLab((await findLab(db, lab.id))!);
}

describe("a lab edit that changes grades", () => {
  it("is rolled back, with no recomputation row, when its job cannot be queued", async () => {
    const lab = await labWithAttempt();
    const b = await boss();
    await b.deleteQueue(QUEUES.regrade); // the queue is gone: pg-boss accepts no job for it
    try {
      await expect(editLab(lab, { policy: { relativeTolerance: 0.05 }, title: "Renamed in the failed edit" } as Parameters<typeof editLab>[1])).rejects.toThrow(/did not accept the job/);
      const after = (await findLab(db, lab.id))!;
      expect(after.version).toBe(lab.version);
      expect(after.title).toBe(lab.title);
      expect((after.policy as { relativeTolerance: number }).relativeTolerance).toBe(0.01);
      expect(await db.selectFrom("lab_regrades").select("id").where("lab_id", "=", lab.id).execute()).toHaveLength(0);
    } finally {
      await b.createQueue(QUEUES.regrade);
    }
  });

  it("commits the edit, one queued recomputation row and its one job together when the queue takes it", async () => {
    const lab = await labWithAttempt();
    await boss();
    const { regrade } = await editLab(lab, { policy: { relativeTolerance: 0.05 } });
    expect(regrade).not.toBeNull();
    expect((await findLab(db, lab.id))!.version).toBe(lab.version + 1);
    const rows = await db.selectFrom("lab_regrades").select(["id", "status", "lab_version"]).where("lab_id", "=", lab.id).execute();
    expect(rows).toEqual([{ id: regrade!.id, status: "queued", lab_version: lab.version + 1 }]);
    expect(await regradeJobs(lab.id)).toBe(1);
  });
});

describe("starting the job queue", () => {
  it("tries again after a failed start instead of keeping the failure", async () => {
    const port = await freePort(); // nothing listens there
    await expect(boss(`postgres://postgres@127.0.0.1:${port}/nowhere`)).rejects.toThrow(/ECONNREFUSED|connect/);
    const b = await boss(process.env.DATABASE_URL);
    expect(await b.getQueue(QUEUES.regrade)).toBeTruthy();
  });

  it("starts the workers once the database answers, without a restart", async () => {
    // the workers are pointed at a port where the database is not reachable yet, as at a boot that
    // comes before PostgreSQL; later a relay to the real database opens on that port
    const target = new URL(process.env.DATABASE_URL!);
    const port = await freePort();
    const url = new URL(process.env.DATABASE_URL!);
    url.port = String(port);
    const errors = vi.spyOn(console, "error").mockImplementation(() => {});
    let started = false;
    const starting = startWorkersRetrying({ connectionString: url.toString(), delayMs: 200 }).then(() => (started = true));
    await until(() => errors.mock.calls.filter((c) => String(c[0]).includes("could not start the job workers")).length, (n) => n >= 2);
    expect(started).toBe(false);

    const sockets = new Set<net.Socket>();
    const relay = net.createServer((client) => {
      const upstream = net.connect(Number(target.port), target.hostname);
      for (const s of [client, upstream]) {
        sockets.add(s);
        s.on("error", () => client.destroy());
        s.on("close", () => sockets.delete(s));
      }
      upstream.on("error", () => client.destroy());
      client.on("error", () => upstream.destroy());
      client.pipe(upstream).pipe(client);
    });
    await new Promise<void>((r) => relay.listen(port, "127.0.0.1", () => r()));
    try {
      await until(() => started, (s) => s, 25_000);
      expect(started).toBe(true);
      const b = await boss();
      const schedules = await b.getSchedules();
      expect(schedules.find((s) => s.name === QUEUES.uploadSweep)?.cron).toBe(UPLOAD_SWEEP_CRON);
      await starting;
    } finally {
      await stopBoss();
      for (const s of sockets) s.destroy();
      await new Promise<void>((r) => relay.close(() => r()));
    }
  });
});
