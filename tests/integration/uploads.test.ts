// Upload housekeeping against real PostgreSQL and the local object-store stand-in (S3_ENDPOINT, started
// by npm test): a row that cannot be written leaves no stored file, each person's storage has a quota,
// and uploads no attempt attaches are removed after a day, by the scheduled job too.
import { sql } from "kysely";
import { afterAll, afterEach, describe, expect, it } from "vitest";
import { db } from "@/db";
import { findUpload } from "@/db/queries/uploads";
import { boss, QUEUES, stopBoss } from "@/lib/jobs/queue";
import { submitAttempt } from "@/lib/labs/attempts";
import { listKeys } from "@/lib/uploads/storage";
import { acceptUpload, sweepUnattachedUploads } from "@/lib/uploads/accept";
import { startWorkers, UPLOAD_SWEEP_CRON } from "@/lib/jobs/workers";
import { smallCourse, until } from "../support/mail";

// the eight-byte PNG signature (ISO/IEC 15948, 5.2) followed by an IHDR chunk: 33 bytes
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde]);
const HOUR = 3600_000;

afterEach(() => {
  delete process.env.SHUNTWISE_UPLOAD_QUOTA_BYTES;
});

afterAll(async () => {
  await stopBoss();
});

async function setup() {
  const { course, students, lab, access } = await smallCourse(db, { students: 2 });
  const upload = (ownerIndex = 0, labId: string | null = lab.id) =>
    acceptUpload({ ownerId: students[ownerIndex].id, courseId: course.id, labId, fileName: "scope.png", bytes: PNG });
  const stored = (ownerIndex = 0) => listKeys(`${course.id}/${students[ownerIndex].id}/`);
  return { course, students, lab, access, upload, stored };
}

async function backDate(uploadId: string, hours: number) {
  await db.updateTable("uploads").set({ created_at: new Date(Date.now() - hours * HOUR) }).where("id", "=", uploadId).execute();
}

describe("storing an upload", () => {
  it("removes the stored file again when its row cannot be written", async () => {
    const { upload, stored } = await setup();
    const ok = await upload(0);
    expect(await stored(0)).toHaveLength(1);
    // a lab id that no lab has: the row breaks the uploads→labs foreign key
    const missingLab = "00000000-0000-4000-8000-000000000000";
    await expect(upload(0, missingLab)).rejects.toThrow(/foreign key/);
    const keys = await stored(0);
    expect(keys).toHaveLength(1);
    expect(keys[0]).toBe((await findUpload(db, ok.id))!.storageKey);
  });

  it("refuses a file that would take a person past their storage quota, with a 413 naming file, and stores nothing", async () => {
    process.env.SHUNTWISE_UPLOAD_QUOTA_BYTES = String(PNG.byteLength + 10); // room for one 33-byte file
    const { upload, stored } = await setup();
    await upload(0);
    const refused = await upload(0).catch((e) => e);
    expect(refused.status).toBe(413);
    expect(refused.fields).toHaveProperty("file");
    expect(refused.message).toMatch(/storage|does not fit/i);
    expect(await stored(0)).toHaveLength(1);
    // the quota is per person: the other student still has room
    await upload(1);
    expect(await stored(1)).toHaveLength(1);
  });

  it("lets exactly one of two uploads at once through when only one fits", async () => {
    process.env.SHUNTWISE_UPLOAD_QUOTA_BYTES = String(PNG.byteLength + 10);
    const { upload, stored, students } = await setup();
    const results = await Promise.allSettled([upload(0), upload(0), upload(0)]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(results.filter((r) => r.status === "rejected").map((r) => (r as PromiseRejectedResult).reason.status)).toEqual([413, 413]);
    expect(await stored(0)).toHaveLength(1);
    const rows = await db.selectFrom("uploads").select("id").where("owner_id", "=", students[0].id).execute();
    expect(rows).toHaveLength(1);
  });
});

describe("uploads never attached to an attempt", () => {
  it("are removed after a day, row and file; attached and recent ones stay", async () => {
    const { upload, stored, lab, students, access } = await setup();
    const old = await upload(0);
    const attached = await upload(0);
    const recent = await upload(0);
    await submitAttempt(lab, access(students[0]), { idempotencyKey: `sweep-${attached.id}`, readings: { q1: "3.3 mA" }, measured: {}, uploadIds: [attached.id] });
    await backDate(old.id, 25);
    await backDate(attached.id, 25);
    await backDate(recent.id, 23);
    const oldKey = (await findUpload(db, old.id))!.storageKey;
    expect(await stored(0)).toContain(oldKey);

    expect(await sweepUnattachedUploads()).toBe(1);
    expect(await findUpload(db, old.id)).toBeUndefined();
    expect(await findUpload(db, attached.id)).toBeDefined();
    expect(await findUpload(db, recent.id)).toBeDefined();
    const keys = await stored(0);
    expect(keys).toHaveLength(2);
    expect(keys).not.toContain(oldKey);
    expect(await sweepUnattachedUploads()).toBe(0);
  });

  it("are swept by the job the workers run, which is scheduled every hour", async () => {
    const { upload, stored } = await setup();
    const old = await upload(1);
    await backDate(old.id, 48);
    await startWorkers();
    const b = await boss();
    const schedules = await b.getSchedules();
    expect(schedules.find((s) => s.name === QUEUES.uploadSweep)?.cron).toBe(UPLOAD_SWEEP_CRON);
    await b.send(QUEUES.uploadSweep, {});
    await until(() => findUpload(db, old.id), (u) => u === undefined, 25_000);
    expect(await findUpload(db, old.id)).toBeUndefined();
    const completed = () => sql<{ n: number }>`select count(*)::int as n from pgboss.job where name = ${QUEUES.uploadSweep} and state = 'completed'`.execute(db).then((r) => r.rows[0].n);
    expect(await until(completed, (n) => n >= 1)).toBeGreaterThanOrEqual(1);
    expect(await stored(1)).toHaveLength(0);
  });
});
