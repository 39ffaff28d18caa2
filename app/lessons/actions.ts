"use server";
// The "Check yourself" server action: only for signed-in people, like every action of the app.
import { currentUser } from "@/lib/auth/access";
import { checkLessonAnswer, type CheckResult } from "@/lib/lessons/check";

export type { CheckResult };

export async function checkAnswer(questionId: string, answer: string): Promise<CheckResult> {
  if (!(await currentUser())) return { ok: false, message: "Sign in to check your answers." };
  return checkLessonAnswer(questionId, answer);
}
