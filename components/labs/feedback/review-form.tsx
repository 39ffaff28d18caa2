"use client";
// "Ask for a review": a message to the course staff about one graded attempt.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useId } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";
import { reviewRequestSchema } from "@/lib/validation/labs";

type Values = z.input<typeof reviewRequestSchema>;
type Sent = z.output<typeof reviewRequestSchema>;

function failureText(e: unknown): string {
  if (!isApiError(e) || e.status === 0) return "Your request did not reach the server. Check your connection and send it again; your message is still here.";
  return e.serverMessage ?? `The request failed (HTTP ${e.status}).`;
}

/** `again`: the staff answered an earlier request; sending reopens it with the new message. */
export function ReviewForm({ attemptId, onRequested, again = false }: { attemptId: string; onRequested: () => void; again?: boolean }) {
  const id = useId();
  const { register, handleSubmit, formState, setError } = useForm<Values, unknown, Sent>({
    resolver: zodResolver(reviewRequestSchema),
    defaultValues: { message: "" },
  });
  const send = useMutation({
    mutationFn: (values: Sent) => api(`/api/attempts/${attemptId}/review`, { method: "POST", body: values }),
    onSuccess: onRequested,
    onError: (e) => {
      const first = isApiError(e) ? e.fields?.message?.[0] : undefined;
      if (first) setError("message", { type: "server", message: first });
    },
  });
  const error = formState.errors.message?.message;

  const onSubmit = handleSubmit(async (values) => {
    await send.mutateAsync(values).catch(() => undefined);
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={again ? "Ask for a review again" : "Ask for a review"} className="mt-3">
      <FormMessage message={send.isError ? failureText(send.error) : null} />
      <label htmlFor={id} className="field-label">
        {again ? "What is still open after the answer?" : "What should the staff look at again?"}
      </label>
      <textarea
        id={id}
        rows={4}
        className="field-input"
        aria-invalid={error ? true : undefined}
        aria-describedby={`${id}-hint ${id}-error`}
        {...register("message")}
      />
      <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
        Say which question and why, for example what you measured and how. A teaching assistant reads it beside your readings.
      </p>
      <p id={`${id}-error`} className="field-error" aria-live="polite">
        {error ? `Your message: ${error}` : ""}
      </p>
      <button type="submit" className="btn-quiet mt-2" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Sending…" : again ? "Ask again" : "Ask for a review"}
      </button>
    </form>
  );
}
