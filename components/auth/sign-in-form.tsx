"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormMessage } from "@/components/ui/field";
import { signInSchema, type SignInInput } from "@/lib/validation/auth";

export const TOO_MANY = "Too many sign-in attempts in a short time. Wait a few minutes and try again, or reset your password.";
export const DISABLED = "This account is disabled. Contact the course staff to have it turned back on.";
export const BAD_CREDENTIALS = "That e-mail and password do not match an account. Check both and try again.";

/** `next`: where to go after signing in, already cleaned by the page (lib/auth/safe-next.ts) and used as it is. */
export function SignInForm({ next = "/" }: { next?: string }) {
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const res = await signIn("credentials", { ...values, redirect: false });
    if (res?.error === "TooManyRequests") {
      setMessage(TOO_MANY);
      return;
    }
    if (res?.error === "AccountDisabled") {
      setMessage(DISABLED);
      return;
    }
    if (!res || res.error) {
      setMessage(BAD_CREDENTIALS);
      return;
    }
    // A full navigation, so no page prefetched while signed out is reused.
    window.location.assign(next);
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Sign in">
      <FormMessage message={message} />
      <Field label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register("email")} />
      <Field label="Password" type="password" autoComplete="current-password" error={formState.errors.password?.message} {...register("password")} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
