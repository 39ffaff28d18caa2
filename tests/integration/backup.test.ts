// The backup drill: `npm run db:backup` dumps the database (its last line is the file), `npm run
// db:restore FILE DATABASE` restores it into a scratch database, and the copy has the same number of
// rows in every table and the same grades (an md5 checksum over every attempt's score and every grade
// event, in id order). Runs the two scripts as a person would, against real PostgreSQL.
import { execFile } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { sql, type Kysely } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { createDb, db } from "@/db";
import type { Database } from "@/db/types";
import { stopBoss } from "@/lib/jobs/queue";
import { overrideQuestion } from "@/lib/labs/rescore";
import { submitAttempt } from "@/lib/labs/attempts";
import { smallCourse } from "../support/mail";

const run = promisify(execFile);
const root = path.resolve(import.meta.dirname, "../..");
const tsx = path.join(root, "node_modules/.bin/tsx");
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "shuntwise-backup-"));
const scratch = `restore_check_${Date.now().toString(36)}`;
let copy: Kysely<Database> | undefined;

afterAll(async () => {
  await copy?.destroy();
  await stopBoss();
  await sql.raw(`drop database if exists "${scratch}" with (force)`).execute(db);
  fs.rmSync(dataDir, { recursive: true, force: true });
});

async function script(args: string[]): Promise<string[]> {
  const { stdout } = await run(tsx, ["scripts/backup.ts", ...args], {
    cwd: root,
    env: { ...process.env, SHUNTWISE_DATA_DIR: dataDir },
    timeout: 120_000,
  });
  return stdout.trim().split("\n");
}

/** Rows in every table of the app's schema and the job queue's. */
async function counts(d: Kysely<Database>): Promise<Record<string, number>> {
  const tables = await sql<{ name: string }>`
    select schemaname || '.' || tablename as name from pg_tables where schemaname in ('public', 'pgboss') order by 1`.execute(d);
  const out: Record<string, number> = {};
  for (const t of tables.rows) {
    const [schema, table] = t.name.split(".");
    out[t.name] = Number((await sql<{ n: string }>`select count(*) as n from ${sql.table(`${schema}.${table}`)}`.execute(d)).rows[0].n);
  }
  return out;
}

/** md5 over every grade: each attempt's points and score, each grade event's before and after. */
async function gradeChecksums(d: Kysely<Database>) {
  const attempts = await sql<{ md5: string }>`
    select md5(coalesce(string_agg(concat_ws(':', id, user_id, lab_id, number, raw_score, max_score, score, lab_version), ',' order by id), '')) as md5 from attempts`.execute(d);
  const events = await sql<{ md5: string }>`
    select md5(coalesce(string_agg(concat_ws(':', id, attempt_id, question_id, kind, actor_id, points_before, points_after, score_before, score_after, reason, created_at), ',' order by id), '')) as md5 from grade_events`.execute(d);
  return { attempts: attempts.rows[0].md5, gradeEvents: events.rows[0].md5 };
}

describe("backup and restore", () => {
  it("restores a backup into a scratch database with every row and every grade as they were", async () => {
    const { lab, students, access, instructor } = await smallCourse(db, { students: 3 });
    const answers = ["3.3 mA", "3.2 mA", "1 A"];
    const attemptIds: string[] = [];
    for (const [i, s] of students.entries()) {
      const { attemptId } = await submitAttempt(lab, access(s), { idempotencyKey: `backup-${i}`, readings: { q1: answers[i], q2: "3.27 mA" }, measured: {}, uploadIds: [] });
      attemptIds.push(attemptId);
    }
    await db.transaction().execute((trx) => overrideQuestion(trx, attemptIds[2], { questionId: "q1", points: 1, reason: "Partly right on the bench" }, instructor.id));

    const backupLines = await script(["backup"]);
    const file = backupLines.at(-1)!;
    expect(path.isAbsolute(file)).toBe(true);
    expect(file.startsWith(path.join(dataDir, "backups"))).toBe(true);
    expect(fs.statSync(file).size).toBeGreaterThan(0);

    // a change after the backup is not in the copy
    const before = { counts: await counts(db), grades: await gradeChecksums(db) };
    await db.updateTable("attempts").set({ score: 0 }).where("id", "=", attemptIds[0]).execute();
    expect((await gradeChecksums(db)).attempts).not.toBe(before.grades.attempts);

    const restoreLines = await script(["restore", file, scratch]);
    expect(restoreLines.at(-1)).toContain(scratch);
    const url = new URL(process.env.DATABASE_URL!);
    url.pathname = `/${scratch}`;
    copy = createDb(url.toString(), 2);
    const restored = { counts: await counts(copy), grades: await gradeChecksums(copy) };
    expect(restored.counts["public.attempts"]).toBe(3);
    expect(restored.counts["public.grade_events"]).toBe(4);
    expect(restored).toEqual(before);
  });
});
