"use server";
// The "Check yourself" server action: only for signed-in people who can read the question's lesson.
import { currentUser } from "@/lib/auth/access";
import { AppError } from "@/lib/errors";
import { checkLessonAnswer, type CheckResult } from "@/lib/lessons/check";
import { getQuestion } from "@/lib/lessons/questions";
import { lessonAccess } from "@/lib/courses/lesson-plan";
import { throttle } from "@/lib/security/throttle";

export type { CheckResult };

export async function checkAnswer(questionId: string, answer: string): Promise<CheckResult> {
  const user = await currentUser();
  if (!user) return { ok: false, message: "Sign in to check your answers." };
  try {
    await throttle([["checkUser", user.id]]);
  } catch (e) {
    if (e instanceof AppError) return { ok: false, message: e.message };
    throw e;
  }
  // the same rule as the lesson page: a question of a lesson the caller cannot read (hidden, not yet
  // open, or in none of their courses) is answered as if it did not exist
  const q = typeof questionId === "string" ? getQuestion(questionId) : undefined;
  if (q && !(await lessonAccess(user, q.lesson)).readable) return { ok: false, message: "This question no longer exists; reload the page." };
  return checkLessonAnswer(questionId, answer);
}
