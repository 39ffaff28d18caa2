"use server";
// The "Check yourself" server action: only for signed-in people, like every action of the app.
import { currentUser } from "@/lib/auth/access";
import { AppError } from "@/lib/errors";
import { checkLessonAnswer, type CheckResult } from "@/lib/lessons/check";
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
  return checkLessonAnswer(questionId, answer);
}
