"use client";
// Chooses a new password with the e-mailed link. On success every session is signed out, this one too.
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormMessage } from "@/components/ui/field";
import { useHydrated } from "@/components/ui/use-hydrated";
import { api, isApiError } from "@/lib/http/client";
import { resetConfirmSchema, type ResetConfirmInput } from "@/lib/validation/mail";

export function ResetPasswordForm({ token }: { token: string }) {
  const hydrated = useHydrated();
  const [done, setDone] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<ResetConfirmInput>({ resolver: zodResolver(resetConfirmSchema), defaultValues: { token } });
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const r = await api<{ message: string }>("/api/password-reset/confirm", { method: "POST", body: values });
      setDone(r.message);
    } catch (e) {
      setFailure(isApiError(e) && e.status > 0 ? e.message : "The request did not reach the server. Try again.");
    }
  });
  if (done) {
    return (
      <div role="status">
        <p className="rounded-md bg-trace-pale p-3 text-sm text-trace">{done}</p>
        <p className="mt-4">
          <Link className="btn-primary" href="/signin">
            Sign in
          </Link>
        </p>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Choose a new password">
      <FormMessage message={failure} />
      <input type="hidden" {...register("token")} />
      <Field label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={formState.errors.password?.message} {...register("password")} />
      <Field label="New password again" type="password" autoComplete="new-password" error={formState.errors.confirm?.message} {...register("confirm")} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting || !hydrated}>
        {formState.isSubmitting ? "Saving…" : "Save the new password"}
      </button>
    </form>
  );
}
