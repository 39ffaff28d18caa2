// Creating courses (site admin), copying a course into a new term and changing its settings
// (instructor). Callers authorize first.
import "server-only";
import { randomInt } from "node:crypto";
import type { z } from "zod";
import { db } from "@/db";
import { copyCourseLessons } from "@/db/queries/course-lessons";
import { courseCodeTaken, findCourse, insertCourse, setJoinCode, updateCourseSettings, upsertMembership } from "@/db/queries/courses";
import { copyLabs } from "@/db/queries/labs";
import { findUserByEmail, insertUser } from "@/db/queries/users";
import { AppError, notFound } from "@/lib/errors";
import { queuePasswordMail } from "@/lib/mail/tokens";
import type { copyCourseSchema, courseSettingsSchema, createCourseSchema } from "@/lib/validation/courses";

// No 0/O, 1/I/L: a join code is read aloud and copied from a projector.
const ALPHABET = "ABCDEFGHJKMNPQRSTUVWXYZ23456789";

/** A new join code such as `ELM214-7KQX`: the course code's letters and digits, then four random characters. */
export function newJoinCode(courseCode: string): string {
  const prefix = courseCode.toUpperCase().replace(/[^A-Z0-9]/g, "").slice(0, 8) || "JOIN";
  let tail = "";
  for (let i = 0; i < 4; i++) tail += ALPHABET[randomInt(ALPHABET.length)];
  return `${prefix}-${tail}`;
}

const isUniqueViolation = (e: unknown, constraint?: string) =>
  (e as { code?: string }).code === "23505" && (!constraint || (e as { constraint?: string }).constraint === constraint);

function codeTaken(): AppError {
  const message = "Another course already uses that code.";
  return new AppError("conflict", message, { code: [message] });
}

/** Runs `make` with a fresh join code, trying again on the rare clash with an existing one. */
async function withJoinCode<T>(courseCode: string, make: (joinCode: string) => Promise<T>): Promise<T> {
  for (let i = 0; ; i++) {
    try {
      return await make(newJoinCode(courseCode));
    } catch (e) {
      if (isUniqueViolation(e, "courses_join_code_key") && i < 5) continue;
      if (isUniqueViolation(e, "courses_code_key")) throw codeTaken();
      throw e;
    }
  }
}

/**
 * Creates a course and makes the person with the given e-mail its first instructor. Without an account for
 * that address, one is created without a password and an invitation with a set-password link is queued.
 */
export async function createCourse(input: z.output<typeof createCourseSchema>) {
  if (await courseCodeTaken(db, input.code)) throw codeTaken();
  const existing = await findUserByEmail(db, input.instructorEmail);
  if (!existing && !input.instructorName) {
    const message = "No account uses that e-mail address yet: give the instructor's name so an account can be created.";
    throw new AppError("bad_request", message, { instructorName: [message] });
  }
  return withJoinCode(input.code, (joinCode) =>
    db.transaction().execute(async (trx) => {
      const courseId = await insertCourse(trx, { code: input.code, title: input.title, term: input.term, institution: input.institution, joinCode });
      let instructor = existing;
      if (!instructor) {
        instructor = await insertUser(trx, { email: input.instructorEmail, name: input.instructorName, passwordHash: null });
        await queuePasswordMail(trx, instructor, "set");
      }
      await upsertMembership(trx, { courseId, userId: instructor.id, role: "instructor" });
      return { course: { id: courseId, code: input.code, title: input.title, term: input.term, institution: input.institution, joinCode }, instructor: { id: instructor.id, email: instructor.email, name: instructor.name, invited: !existing } };
    }),
  );
}

const DAY_MS = 24 * 3600 * 1000;

/**
 * Copies a course into a new term: the lesson plan and every lab (as drafts), with all dates moved by
 * `shiftDays`; no members (except the copying instructor), variants or attempts.
 */
export async function copyCourse(fromCourseId: string, by: { id: string }, input: z.output<typeof copyCourseSchema>) {
  const from = await findCourse(db, fromCourseId);
  if (!from) throw notFound("That course");
  if (await courseCodeTaken(db, input.code)) throw codeTaken();
  const shiftMs = input.shiftDays * DAY_MS;
  return withJoinCode(input.code, (joinCode) =>
    db.transaction().execute(async (trx) => {
      const courseId = await insertCourse(trx, {
        code: input.code,
        title: input.title ?? from.title,
        term: input.term,
        institution: from.institution,
        joinCode,
        defaultLatePenaltyPercentPerDay: from.defaultLatePenaltyPercentPerDay,
        defaultLateFloorPercent: from.defaultLateFloorPercent,
        copiedFrom: from.id,
      });
      await upsertMembership(trx, { courseId, userId: by.id, role: "instructor" });
      await copyCourseLessons(trx, from.id, courseId, shiftMs);
      const labs = await copyLabs(trx, from.id, courseId, by.id, shiftMs);
      return { course: { id: courseId, code: input.code, title: input.title ?? from.title, term: input.term, institution: from.institution, joinCode }, labs };
    }),
  );
}

export async function changeCourseSettings(courseId: string, input: z.output<typeof courseSettingsSchema>) {
  await updateCourseSettings(db, courseId, input);
  const c = (await findCourse(db, courseId))!;
  return { course: c };
}

export async function regenerateJoinCode(courseId: string, courseCode: string): Promise<string> {
  return withJoinCode(courseCode, async (joinCode) => {
    await setJoinCode(db, courseId, joinCode);
    return joinCode;
  });
}
