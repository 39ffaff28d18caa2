// Uploads sent straight to the object-store stand-in in parts (issue 26), against real PostgreSQL and the
// stand-in started by npm test: an hour-long log arrives in parts (one sent twice, one connection cut and
// sent again), completes once, and its streamed analysis equals both the small-file path's on the same
// bytes and a reference computed here from the known currents; files larger than announced, of another
// type or past the quota are refused and nothing of them is left.
import { sql } from "kysely";
import { afterAll, afterEach, describe, expect, it } from "vitest";
import { db } from "@/db";
import { findUpload } from "@/db/queries/uploads";
import { stopBoss } from "@/lib/jobs/queue";
import { listKeys } from "@/lib/uploads/storage";
import { analyzeTrace, type TraceAnalysis } from "@/lib/trace";
import { analyseUpload } from "@/lib/uploads/analysis";
import { completeUpload, requestUpload } from "@/lib/uploads/direct";
import { readWindow } from "@/lib/uploads/samples";
import type { StoredSamples } from "@/db/types";
import { smallCourse } from "../support/mail";
import { putPart, putPartCut, sleepingNodeCsv } from "../support/direct-upload";

// the eight-byte PNG signature (ISO/IEC 15948, 5.2) followed by an IHDR chunk: 33 bytes
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde]);

afterEach(() => {
  delete process.env.SHUNTWISE_UPLOAD_QUOTA_BYTES;
});

afterAll(async () => {
  await stopBoss();
});

async function setup() {
  const { course, students, lab } = await smallCourse(db, { students: 1 });
  const owner = students[0];
  const ask = (name: string, size: number, type: "text/csv" | "image/png") =>
    requestUpload({ ownerId: owner.id, courseId: course.id, labId: lab.id, input: { labId: lab.id, name, size, type } });
  const stored = () => listKeys(`${course.id}/${owner.id}/`);
  return { course, owner, lab, ask, stored };
}

async function jobsFor(uploadId: string): Promise<number> {
  const r = await sql<{ n: string }>`select count(*) as n from pgboss.job where name = 'upload-analysis' and data->>'uploadId' = ${uploadId}`.execute(db);
  return Number(r.rows[0].n);
}

describe("an hour-long log sent in parts", () => {
  it("completes once after a part sent twice and a cut connection, and its streamed analysis equals the small-file path's and the reference", async () => {
    const { owner, ask, stored } = await setup();
    // PHYSICS.md §8 8a: 20 mA for 10 ms every 1 s, 2 µA asleep; one hour at 1,000 samples a second
    const rows = 3_600_001;
    const csv = sleepingNodeCsv(rows, 2e-6, 0.02, 10);
    expect(csv.byteLength).toBeGreaterThan(60e6);
    const asked = await ask("sleeping-node-hour.csv", csv.byteLength, "text/csv");
    expect(asked.parts.length).toBeGreaterThan(4);
    const part = (n: number) => csv.subarray((n - 1) * asked.partSize, n * asked.partSize);

    for (const p of asked.parts) {
      if (p.number === 3) await putPartCut(p.url, part(3)); // the connection drops half way
      await putPart(p.url, part(p.number));
      if (p.number === 2) await putPart(p.url, part(2)); // sent twice (a retry after a lost answer)
    }

    const both = await Promise.allSettled([completeUpload({ uploadId: asked.upload.id, ownerId: owner.id }), completeUpload({ uploadId: asked.upload.id, ownerId: owner.id })]);
    const done = both.filter((r) => r.status === "fulfilled");
    expect(done.length).toBeGreaterThanOrEqual(1);
    for (const r of both) if (r.status === "rejected") expect(r.reason.status).toBe(409);
    for (const r of done) expect(r.value.status).toBe("analysing");
    expect(await jobsFor(asked.upload.id)).toBe(1);
    // completing it again later answers the same and queues nothing more
    expect((await completeUpload({ uploadId: asked.upload.id, ownerId: owner.id })).size).toBe(csv.byteLength);
    expect(await jobsFor(asked.upload.id)).toBe(1);

    const params = { batteryCapacity: 220 * 3.6, usableFraction: 0.8 }; // 220 mAh (1 mAh = 3.6 C)
    await analyseUpload({ uploadId: asked.upload.id, params });
    const row = (await findUpload(db, asked.upload.id))!;
    expect(row.status).toBe("ready");
    expect(row.size).toBe(csv.byteLength);
    const streamed = row.analysis as TraceAnalysis;

    // the small-file path (the analysis in the request) on the same bytes
    expect(streamed).toEqual(await analyzeTrace(csv, params));

    // reference, common practice (PHYSICS.md §8): charge = ∫ i dt with each sample held 1 ms; the last
    // sample only closes the hour, so 3,600 whole periods of 10 active and 990 sleeping samples
    const charge = 3600 * (10 * 1e-3 * 0.02 + 990 * 1e-3 * 2e-6);
    const mean = charge / 3600; // 201.98 µA (8a: 202.0 µA)
    const close = (actual: number | null, expected: number, tolerance = 1e-9) => expect(Math.abs(actual! - expected) / expected).toBeLessThan(tolerance);
    expect(streamed.rows).toBe(rows);
    close(streamed.duration, 3600);
    close(streamed.totalCharge, charge);
    close(streamed.averageCurrent, mean);
    close(streamed.dutyCycle, 0.01);
    expect(streamed.wakes).toBe(3600);
    close(streamed.chargePerWake, 0.02 * 0.01); // Q = I_a·t_a = 200 µC (8a)
    close(streamed.sleepLevel, 2e-6, 1e-6); // (∫ i dt − active charge) ÷ sleep time: a difference of near numbers
    close(streamed.activeLevel, 0.02);
    close(streamed.batteryLife, (0.8 * 792) / mean); // battery life = capacity ÷ mean: 871.4 h (8b)
    expect(streamed.batteryLife! / 3600).toBeCloseTo(871.4, 1);

    // the compact samples: one second in the middle at full resolution, read back by time
    const samples = (await db.selectFrom("uploads").select("samples").where("id", "=", asked.upload.id).executeTakeFirstOrThrow()).samples as StoredSamples;
    const second = await readWindow(samples, 1800, 1801, 1000);
    expect(second.samples).toBe(1001);
    expect(second.t).toHaveLength(1001);
    expect(second.t[0]).toBeCloseTo(1800, 9);
    expect(second.i.filter((v) => v > 0.01)).toHaveLength(10);
    expect(Math.fround(second.i[500])).toBe(Math.fround(0.02));
    // the whole hour in 500 columns keeps every burst's top and the sleep floor
    const hour = await readWindow(samples, 0, 3600, 500);
    expect(hour.t.length).toBeLessThanOrEqual(1000);
    expect(Math.max(...hour.i)).toBeCloseTo(0.02, 9);
    expect(Math.min(...hour.i)).toBeCloseTo(2e-6, 12);

    // the object and its samples, nothing else (no part left behind)
    expect((await stored()).sort()).toEqual([row.storageKey, `${row.storageKey}.samples`].sort());
  }, 180_000);
});

describe("refusing a file on completion", () => {
  it("refuses a stored file larger than the size announced, and removes it and its row", async () => {
    const { owner, ask, stored } = await setup();
    const csv = sleepingNodeCsv(2000, 2e-6, 0.02, 10);
    const asked = await ask("short.csv", csv.byteLength - 100, "text/csv");
    await putPart(asked.parts[0].url, csv);
    const refused = await completeUpload({ uploadId: asked.upload.id, ownerId: owner.id }).catch((e) => e);
    expect(refused.status).toBe(400);
    expect(refused.fields).toHaveProperty("size");
    expect(refused.message).toMatch(/bytes/);
    expect(await stored()).toEqual([]);
    expect(await findUpload(db, asked.upload.id)).toBeUndefined();
  });

  it("refuses a PNG announced as a CSV trace with a 415, and removes it", async () => {
    const { owner, ask, stored } = await setup();
    const asked = await ask("trace.csv", PNG.byteLength, "text/csv");
    await putPart(asked.parts[0].url, PNG);
    const refused = await completeUpload({ uploadId: asked.upload.id, ownerId: owner.id }).catch((e) => e);
    expect(refused.status).toBe(415);
    expect(refused.fields).toHaveProperty("type");
    expect(await stored()).toEqual([]);
    expect(await findUpload(db, asked.upload.id)).toBeUndefined();
  });

  it("refuses a file that is neither image nor trace with a 415 naming file, and removes it", async () => {
    const { owner, ask, stored } = await setup();
    const zip = new Uint8Array([0x50, 0x4b, 0x03, 0x04, ...new Array(60).fill(0)]); // the local file header signature of a ZIP archive (APPNOTE 4.3.7)
    const asked = await ask("trace.csv", zip.byteLength, "text/csv");
    await putPart(asked.parts[0].url, zip);
    const refused = await completeUpload({ uploadId: asked.upload.id, ownerId: owner.id }).catch((e) => e);
    expect(refused.status).toBe(415);
    expect(refused.fields).toHaveProperty("file");
    expect(await stored()).toEqual([]);
  });

  it("refuses at completion a file past the quota (lowered meanwhile), and removes it", async () => {
    const { owner, ask, stored } = await setup();
    const csv = sleepingNodeCsv(2000, 2e-6, 0.02, 10);
    const asked = await ask("trace.csv", csv.byteLength, "text/csv");
    await putPart(asked.parts[0].url, csv);
    process.env.SHUNTWISE_UPLOAD_QUOTA_BYTES = String(csv.byteLength - 1);
    const refused = await completeUpload({ uploadId: asked.upload.id, ownerId: owner.id }).catch((e) => e);
    expect(refused.status).toBe(413);
    expect(refused.message).toMatch(/does not fit/);
    expect(await stored()).toEqual([]);
    expect(await findUpload(db, asked.upload.id)).toBeUndefined();
  });

  it("refuses when asked a file past the limit or the quota, naming size, and starts nothing", async () => {
    const { ask, stored } = await setup();
    const tooBig = await ask("huge.csv", 200 * 1024 * 1024 + 1, "text/csv").catch((e) => e);
    expect(tooBig.status).toBe(413);
    expect(tooBig.fields).toHaveProperty("size");
    const bigImage = await ask("scope.png", 10 * 1024 * 1024 + 1, "image/png").catch((e) => e);
    expect(bigImage.status).toBe(413);
    process.env.SHUNTWISE_UPLOAD_QUOTA_BYTES = String(1000);
    await ask("a.csv", 600, "text/csv");
    const over = await ask("b.csv", 600, "text/csv").catch((e) => e);
    expect(over.status).toBe(413);
    expect(over.fields).toHaveProperty("size");
    expect(await stored()).toEqual([]);
  });

  it("answers a completion before any part arrived with a 400 naming parts, and the upload can still be completed", async () => {
    const { owner, ask } = await setup();
    const asked = await ask("scope.png", PNG.byteLength, "image/png");
    const early = await completeUpload({ uploadId: asked.upload.id, ownerId: owner.id }).catch((e) => e);
    expect(early.status).toBe(400);
    expect(early.fields).toHaveProperty("parts");
    await putPart(asked.parts[0].url, PNG);
    const done = await completeUpload({ uploadId: asked.upload.id, ownerId: owner.id });
    expect(done.kind).toBe("image");
    await analyseUpload({ uploadId: asked.upload.id, params: null });
    const row = (await findUpload(db, asked.upload.id))!;
    expect(row.status).toBe("ready");
    expect(row.sha256).toMatch(/^[0-9a-f]{64}$/);
  });
});
