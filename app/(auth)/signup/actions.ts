"use server";

import { headers } from "next/headers";
import { signUpStudent } from "@/lib/courses/joining";
import { clientAddress, throttle } from "@/lib/security/throttle";
import type { SignUpState } from "@/components/auth/sign-up-form";
import { AppError } from "@/lib/errors";
import { signUpSchema } from "@/lib/validation/auth";
import { controlCharacterFields, fieldErrors } from "@/lib/validation/zod-errors";

export async function signUpAction(input: unknown): Promise<SignUpState> {
  const control = controlCharacterFields(input);
  if (Object.keys(control).length) return { ok: false, message: "Check the highlighted fields.", fields: control };
  const parsed = signUpSchema.safeParse(input);
  if (!parsed.success) return { ok: false, message: "Check the highlighted fields.", fields: fieldErrors(parsed.error) };
  try {
    // join codes cannot be guessed by trying many: every try counts against the caller's address
    await throttle([["signUpAddress", clientAddress(await headers())]]);
    const { course } = await signUpStudent(parsed.data);
    return { ok: true, courseId: course.id };
  } catch (e) {
    if (e instanceof AppError) return { ok: false, message: e.message, fields: e.fields };
    throw e;
  }
}
