"use client";
// Asks for a password link. Whatever the address, the answer is the same, so the form cannot be used to
// find out who has an account.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormMessage } from "@/components/ui/field";
import { useHydrated } from "@/components/ui/use-hydrated";
import { api, isApiError } from "@/lib/http/client";
import { resetRequestSchema, type ResetRequestInput } from "@/lib/validation/mail";

export function ForgotPasswordForm() {
  const hydrated = useHydrated();
  const [done, setDone] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<ResetRequestInput>({ resolver: zodResolver(resetRequestSchema) });
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const r = await api<{ message: string }>("/api/password-reset", { method: "POST", body: values });
      setDone(r.message);
    } catch (e) {
      setFailure(isApiError(e) && e.status > 0 ? e.message : "The request did not reach the server. Try again.");
    }
  });
  if (done) {
    return (
      <p role="status" className="rounded-md bg-trace-pale p-3 text-sm text-trace">
        {done}
      </p>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Ask for a password link">
      <FormMessage message={failure} />
      <Field label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register("email")} />
      <button type="submit" className="btn-primary w-full" disabled={formState.isSubmitting || !hydrated}>
        {formState.isSubmitting ? "Sending…" : "Send me a link"}
      </button>
    </form>
  );
}
