// Joining a course with its join code (sign-up). Roster changes by staff live in roster.ts.
import "server-only";
import { db } from "@/db";
import { findCourseByJoinCode, upsertMembership } from "@/db/queries/courses";
import { findUserByEmail, insertUser } from "@/db/queries/users";
import { hashPassword } from "@/lib/auth/password";
import { AppError } from "@/lib/errors";
import type { z } from "zod";
import type { signUpSchema } from "@/lib/validation/auth";

/** Creates a student account and its membership of the course whose join code was given, in one transaction. */
export async function signUpStudent(input: z.output<typeof signUpSchema>) {
  const course = await findCourseByJoinCode(db, input.joinCode);
  if (!course) throw new AppError("bad_request", "That join code does not match any course.", { joinCode: ["That join code does not match any course."] });
  if (!course.joiningOpen) {
    const message = "This course is not taking new students at the moment. Ask your instructor.";
    throw new AppError("bad_request", message, { joinCode: [message] });
  }
  if (await findUserByEmail(db, input.email)) {
    throw emailTaken();
  }
  const passwordHash = await hashPassword(input.password);
  try {
    return await db.transaction().execute(async (trx) => {
      const user = await insertUser(trx, { email: input.email, name: input.name, passwordHash });
      await upsertMembership(trx, { courseId: course.id, userId: user.id, role: "student" });
      return { user, course, role: "student" as const };
    });
  } catch (e) {
    // the same address signed up a moment ago, between the check above and this insert
    if ((e as { code?: string }).code === "23505") throw emailTaken();
    throw e;
  }
}

function emailTaken(): AppError {
  const message = "An account already uses that e-mail address. Sign in instead.";
  return new AppError("conflict", message, { email: [message] });
}
