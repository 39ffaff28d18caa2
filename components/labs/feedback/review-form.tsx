"use client";
// "Ask for a review": a message to the course staff about one graded attempt.
import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { reviewRequestSchema } from "@/lib/validation/labs";
import { apiError } from "../submit/read";

type Values = z.input<typeof reviewRequestSchema>;

export function ReviewForm({ attemptId, onRequested }: { attemptId: string; onRequested: () => void }) {
  const id = useId();
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Values, unknown, z.output<typeof reviewRequestSchema>>({
    resolver: zodResolver(reviewRequestSchema),
    defaultValues: { message: "" },
  });
  const error = formState.errors.message?.message;

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    let status = 0;
    let body: unknown = null;
    try {
      const res = await fetch(`/api/attempts/${attemptId}/review`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(values) });
      status = res.status;
      body = await res.json().catch(() => null);
    } catch {
      status = 0;
    }
    if (status === 201 || status === 200) {
      onRequested();
      return;
    }
    const err = apiError(body);
    if (err.fields?.message?.[0]) setError("message", { type: "server", message: err.fields.message[0] });
    setMessage(status === 0 ? "Your request did not reach the server. Check your connection and send it again; your message is still here." : (err.message ?? `The request failed (HTTP ${status}).`));
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Ask for a review" className="mt-3">
      <div role="alert" className={message ? "mb-3 rounded-md bg-verdict-wrong/10 p-3 text-sm text-verdict-wrong" : ""}>
        {message ?? ""}
      </div>
      <label htmlFor={id} className="field-label">
        What should the staff look at again?
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
        {formState.isSubmitting ? "Sending…" : "Ask for a review"}
      </button>
    </form>
  );
}
