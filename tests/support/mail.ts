// Mail helpers for tests: an SMTP server that keeps what it receives in memory (started and stopped by
// the test itself), a free port, and a small course with one published lab and one student.
import net from "node:net";
import { simpleParser, type ParsedMail } from "mailparser";
import { SMTPServer } from "smtp-server";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { insertLab } from "@/db/queries/labs";
import type { PublicUser } from "@/db/queries/users";
import type { CourseAccess } from "@/lib/auth/access";
import { findLab } from "@/db/queries/labs";
import { toLab, withIds } from "@/lib/labs/grading";
import type { VariantSpec } from "@/lib/grader";
import { fixedCircuitLab } from "../http/fixtures";

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

export interface Catcher {
  messages: ParsedMail[];
  close(): Promise<void>;
}

/** A local SMTP server on `port` that parses and keeps every message it accepts. */
export async function startCatcher(port: number): Promise<Catcher> {
  const messages: ParsedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["AUTH", "STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((m) => {
          messages.push(m);
          callback();
        })
        .catch(callback);
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  return { messages, close: () => new Promise<void>((r) => server.close(() => r())) };
}

export async function until<T>(what: () => Promise<T> | T, ok: (v: T) => boolean, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await what();
    if (ok(v) || Date.now() > end) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The fixed circuit the mail tests grade: 3.3 V supply, 1 kΩ load, 10 Ω shunt. */
export const FIXED_SPEC: VariantSpec = {
  template: "shunt-burden",
  parameters: {
    supplyVoltage: { mode: "fixed", value: 3.3 },
    loadResistance: { mode: "fixed", value: 1000 },
    shuntResistance: { mode: "fixed", value: 10 },
  },
};

/** Two questions: the current without the meter (2 points) and the current the meter shows (3 points). */
export const FIXED_QUESTIONS = [
  { quantity: "trueCurrent", kind: "prediction", points: 2 },
  { quantity: "indicatedCurrent", kind: "prediction", points: 3 },
] as const;

/** A lab on the mail tests' circuit as the API takes it: open since yesterday, due in a week, no late penalty. */
export function fixedLabBody(title: string) {
  return fixedCircuitLab({ title, spec: FIXED_SPEC, questions: FIXED_QUESTIONS, safetyNotes: "Set the bench supply's current limit first." });
}

/**
 * A course with one student and a published shunt-and-burden lab with fixed values: 3.3 V supply,
 * 1 kΩ load, 10 Ω shunt. Two questions: the true current (2 points) and the indicated current (3 points).
 */
export async function smallCourse(db: Kysely<Database>, opts: { held?: boolean; students?: number } = {}) {
  const course = await db
    .insertInto("courses")
    .values({ code: "MAIL-101", title: "Mail test course", term: "T1", institution: "Test college", join_code: `M-${Date.now()}` })
    .returning([
      "id",
      "code",
      "title",
      "term",
      "institution",
      "join_code as joinCode",
      "joining_open as joiningOpen",
      "default_late_penalty_percent_per_day as defaultLatePenaltyPercentPerDay",
      "default_late_floor_percent as defaultLateFloorPercent",
    ])
    .executeTakeFirstOrThrow();
  const instructor = await db
    .insertInto("users")
    .values({ email: `instructor.${course.id.slice(0, 8)}@test.example`, name: "Ines Marlow", password_hash: null })
    .returning(["id", "email", "name", "is_admin as isAdmin"])
    .executeTakeFirstOrThrow();
  await db.insertInto("memberships").values({ course_id: course.id, user_id: instructor.id, role: "instructor", section: null }).execute();
  const students: PublicUser[] = [];
  for (let i = 0; i < (opts.students ?? 1); i++) {
    const s = await db
      .insertInto("users")
      .values({ email: `student${i}.${course.id.slice(0, 8)}@test.example`, name: `Student ${i + 1} Harrow`, password_hash: null })
      .returning(["id", "email", "name", "is_admin as isAdmin"])
      .executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ course_id: course.id, user_id: s.id, role: "student", section: null }).execute();
    students.push(s);
  }
  const labId = await insertLab(
    db,
    course.id,
    instructor.id,
    {
      title: "Burden on a fixed circuit",
      templateKey: "shunt-burden",
      spec: FIXED_SPEC,
      questions: withIds(FIXED_QUESTIONS.map((q) => ({ ...q }))),
      policy: { relativeTolerance: 0.01, closeMultiple: 2, closeCredit: 0.5, instrumentAccuracyPercent: 0.5 },
      attemptsAllowed: 3,
      counting: "best",
      opensAt: null,
      dueAt: null,
      latePenaltyPercentPerDay: 0,
      lateFloorPercent: 0,
      showExpected: "after_attempt",
      instructions: "",
      safetyNotes: "",
    },
    "published",
  );
  if (opts.held) await db.updateTable("labs").set({ grades_held: true }).where("id", "=", labId).execute();
  const lab = toLab((await findLab(db, labId))!);
  const access = (user: PublicUser, role: "student" | "instructor" = "student"): CourseAccess => ({ user, course, role, section: null });
  return { course, instructor, students, lab, access };
}
