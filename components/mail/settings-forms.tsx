"use client";

// The settings page's forms: graded-attempt e-mails on or off, a new password, sign out on every device.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { signOut } from "next-auth/react";
import { useForm } from "react-hook-form";
import { Field, FormMessage } from "@/components/ui/field";
import { useHydrated } from "@/components/ui/use-hydrated";
import { api, isApiError } from "@/lib/http/client";
import { changePasswordSchema, type ChangePasswordInput, type PreferencesInput } from "@/lib/validation/mail";

const failure = (e: unknown) => (isApiError(e) && e.status > 0 ? e.message : "The request did not reach the server. Try again.");

export function GradeMailForm({ initial }: { initial: boolean }) {
  const hydrated = useHydrated();
  const [on, setOn] = useState(initial);
  const save = useMutation({
    mutationFn: (body: PreferencesInput) => api<{ preferences: PreferencesInput }>("/api/me/preferences", { method: "PATCH", body }),
    onMutate: (body) => setOn(body.gradeMail), // the box follows the click; a failure puts it back
    onSuccess: (r) => setOn(r.preferences.gradeMail),
    onError: (_e, body) => setOn(!body.gradeMail),
  });
  return (
    <section aria-labelledby="mail-heading" className="card mt-6">
      <h2 id="mail-heading" className="text-xl">
        E-mail
      </h2>
      <FormMessage message={save.isError ? failure(save.error) : null} />
      <label className="mt-3 flex items-start gap-3">
        <input type="checkbox" className="mt-1 h-4 w-4" checked={on} disabled={save.isPending || !hydrated} onChange={(e) => save.mutate({ gradeMail: e.target.checked })} />
        <span>
          <span className="font-semibold">E-mail me when an attempt is graded</span>
          <span className="block text-sm text-ink-soft">
            Also when an instructor releases held grades. When the staff regrade an attempt or answer a review request you always get a
            message.
          </span>
        </span>
      </label>
      <p role="status" className="mt-2 text-sm text-ink-soft">
        {save.isSuccess ? (on ? "Graded-attempt e-mails are on." : "Graded-attempt e-mails are off.") : ""}
      </p>
    </section>
  );
}

export function ChangePasswordForm() {
  const hydrated = useHydrated();
  const { register, handleSubmit, formState, reset, setError } = useForm<ChangePasswordInput>({ resolver: zodResolver(changePasswordSchema) });
  const change = useMutation({
    mutationFn: (body: ChangePasswordInput) => api<{ message: string }>("/api/me/password", { method: "POST", body }),
    // the change ends every other session of the account; this one stays signed in
    onSuccess: () => reset({ currentPassword: "", newPassword: "", confirm: "" }),
    onError: (e) => {
      const f = isApiError(e) ? e.fields : undefined;
      if (f?.currentPassword) setError("currentPassword", { type: "server", message: f.currentPassword[0] });
    },
  });
  const onSubmit = handleSubmit(async (v) => {
    await change.mutateAsync(v).catch(() => undefined);
  });
  return (
    <section aria-labelledby="password-heading" className="card mt-6">
      <h2 id="password-heading" className="text-xl">
        Password
      </h2>
      <form onSubmit={onSubmit} noValidate aria-label="Change your password" className="mt-3 max-w-sm">
        <FormMessage message={change.isError && !(isApiError(change.error) && change.error.fields?.currentPassword) ? failure(change.error) : null} />
        <FormMessage tone="info" message={change.isSuccess ? change.data.message : null} />
        <Field label="Current password" type="password" autoComplete="current-password" error={formState.errors.currentPassword?.message} {...register("currentPassword")} />
        <Field label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={formState.errors.newPassword?.message} {...register("newPassword")} />
        <Field label="New password again" type="password" autoComplete="new-password" error={formState.errors.confirm?.message} {...register("confirm")} />
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting || !hydrated}>
          {formState.isSubmitting ? "Saving…" : "Change password"}
        </button>
      </form>
    </section>
  );
}

export function SignOutEverywhere() {
  const end = useMutation({
    mutationFn: () => api<{ signedOutAt: string }>("/api/me/sign-out-everywhere", { method: "POST", body: {} }),
    onSuccess: () => signOut({ callbackUrl: "/signin" }),
  });
  return (
    <section aria-labelledby="everywhere-heading" className="card mt-6">
      <h2 id="everywhere-heading" className="text-xl">
        Sign out on every device
      </h2>
      <p className="mt-2 max-w-prose text-sm text-ink-soft">
        After using a shared lab computer, or if you think someone else has your session: every device where you are signed in, this one too, is signed out.
      </p>
      <FormMessage message={end.isError ? failure(end.error) : null} />
      <button type="button" className="btn-quiet mt-3" disabled={end.isPending} onClick={() => end.mutate()}>
        {end.isPending ? "Signing out…" : "Sign out on every device"}
      </button>
    </section>
  );
}
