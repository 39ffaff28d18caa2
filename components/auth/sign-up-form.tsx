"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormMessage } from "@/components/ui/field";
import type { FieldErrors } from "@/lib/errors";
import { signUpSchema, type SignUpInput } from "@/lib/validation/auth";

/** What the sign-up server action answers (app/(auth)/signup/actions.ts, passed in by the page). */
export type SignUpState = { ok: true; courseId: string } | { ok: false; message: string; fields?: FieldErrors };

export function SignUpForm({ joinCode, signUpAction }: { joinCode?: string; signUpAction: (input: unknown) => Promise<SignUpState> }) {
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
    defaultValues: { joinCode: joinCode ?? "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const result = await signUpAction(values);
    if (!result.ok) {
      setMessage(result.message);
      for (const [field, errors] of Object.entries(result.fields ?? {})) {
        if (field in values) setError(field as keyof SignUpInput, { message: errors[0] });
      }
      return;
    }
    await signIn("credentials", { email: values.email, password: values.password, redirect: false });
    // A full navigation, so no page prefetched while signed out is reused.
    // eslint-disable-next-line @next/next/no-location-assign-relative-destination
    window.location.assign(`/courses/${result.courseId}`);
  });

  const e = formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create your account">
      <FormMessage message={message} />
      <Field label="Your name" autoComplete="name" error={e.name?.message} {...register("name")} />
      <Field label="E-mail" type="email" autoComplete="email" error={e.email?.message} {...register("email")} />
      <Field label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." error={e.password?.message} {...register("password")} />
      <Field label="Course join code" autoComplete="off" hint="Your instructor gives this out in the first session." error={e.joinCode?.message} {...register("joinCode")} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Creating your account…" : "Create account and join"}
      </button>
    </form>
  );
}
