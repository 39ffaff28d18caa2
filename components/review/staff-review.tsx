"use client";
// The staff's side of a review: set one question's points with a reason, re-run the grader, answer the
// student. Each change goes through the JSON API and then refreshes the attempt and its grade history.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FieldFrame, FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";
import { formatQuantity, templates, type TemplateKey } from "@/lib/grader";
import { questionRegradeSchema, reviewAnswerSchema, rerunSchema } from "@/lib/validation/reviews";
import { utcDate } from "@/lib/dates";
import type { AttemptView } from "../labs/feedback/types";
import { points } from "../labs/feedback/verdict";
import { historyKey } from "./grade-timeline";

function failureText(e: unknown): string {
  if (!isApiError(e) || e.status === 0) return "The change did not reach the server. Check your connection and try again; what you typed is still here.";
  return e.serverMessage ?? `The change failed (HTTP ${e.status}).`;
}

function useRefresh(attemptId: string) {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: ["attempt", attemptId] });
    void qc.invalidateQueries({ queryKey: historyKey(attemptId) });
    void qc.invalidateQueries({ queryKey: ["reviews"] });
    void qc.invalidateQueries({ queryKey: ["lab-attempts"] });
  };
}

export function StaffReview({ attempt }: { attempt: AttemptView }) {
  return (
    <section aria-labelledby="staff-review-heading" className="no-print card mt-8" data-testid="staff-review">
      <h2 id="staff-review-heading" className="text-xl">
        Review this attempt
      </h2>
      {attempt.reviewRequestedAt ? (
        <div className="mt-2 text-sm">
          <p>
            The student asked for a review on {utcDate(attempt.reviewRequestedAt)}
            {attempt.reviewOpen ? "; it is waiting for an answer." : "."}
          </p>
          {attempt.reviewMessage ? <blockquote className="mt-2 border-l-4 border-ink/20 pl-3 whitespace-pre-line" data-testid="student-message">{attempt.reviewMessage}</blockquote> : null}
        </div>
      ) : (
        <p className="mt-2 text-sm text-ink-soft">The student has not asked for a review; you can still change the points, with a reason.</p>
      )}
      <CircuitValues attempt={attempt} />
      <QuestionRegrade attempt={attempt} />
      <Rerun attempt={attempt} />
      {attempt.reviewRequestedAt ? <AnswerForm attempt={attempt} /> : null}
    </section>
  );
}

function CircuitValues({ attempt }: { attempt: AttemptView }) {
  const specs = templates[attempt.templateKey as TemplateKey]?.parameters ?? [];
  const params = Object.entries((attempt.params ?? {}) as Record<string, unknown>);
  const label = (k: string) => specs.find((p) => p.key === k)?.label ?? k;
  const shown = (k: string, v: unknown) => {
    const unit = specs.find((p) => p.key === k)?.unit;
    return typeof v === "number" ? (unit ? formatQuantity(v, unit) : String(Number(v.toPrecision(6)))) : String(v);
  };
  const measured = Object.entries(attempt.typed.measured).filter(([, v]) => v && v.trim());
  return (
    <div className="mt-4 text-sm">
      <h3 className="text-lg">The student&apos;s circuit values</h3>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5" data-testid="circuit-values">
        {params.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-soft">{label(k)}</dt>
            <dd className="m-0 tabular-nums">{shown(k, v)}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-2">
        {measured.length ? (
          <>Measured component values (used instead of the nominal ones): {measured.map(([k, v]) => `${label(k)} ${v}`).join(", ")}.</>
        ) : (
          <span className="text-ink-soft">No measured component values were entered; the nominal values were used.</span>
        )}
      </p>
    </div>
  );
}

type RegradeIn = z.input<typeof questionRegradeSchema>;
type RegradeOut = z.output<typeof questionRegradeSchema>;

function QuestionRegrade({ attempt }: { attempt: AttemptView }) {
  const id = useId();
  const refresh = useRefresh(attempt.id);
  const [done, setDone] = useState<string | null>(null);
  const first = attempt.results[0];
  const { register, handleSubmit, formState, setError, reset, watch } = useForm<RegradeIn, unknown, RegradeOut>({
    resolver: zodResolver(questionRegradeSchema),
    defaultValues: { questionId: first?.questionId ?? "", points: first?.points ?? 0, reason: "" },
  });
  const chosen = attempt.results.find((r) => r.questionId === watch("questionId"));
  const save = useMutation({
    mutationFn: (body: RegradeOut) => api<{ attempt: AttemptView }>(`/api/attempts/${attempt.id}/regrades`, { method: "POST", body }),
    onSuccess: (r, body) => {
      setDone(`Saved: the question now has ${points(body.points)} points; the attempt ${points(r.attempt.score)} of ${points(r.attempt.maxScore)}.`);
      reset({ questionId: body.questionId, points: body.points, reason: "" });
      refresh();
    },
    onError: (e) => {
      for (const f of ["questionId", "points", "reason"] as const) {
        const m = isApiError(e) ? e.fields?.[f]?.[0] : undefined;
        if (m) setError(f, { type: "server", message: m });
      }
    },
  });
  const err = formState.errors;
  return (
    <form
      className="mt-6"
      aria-label="Change one question's points"
      noValidate
      onSubmit={handleSubmit(async (v) => {
        setDone(null);
        await save.mutateAsync(v).catch(() => undefined);
      })}
    >
      <h3 className="text-lg">Change one question&apos;s points</h3>
      <FormMessage message={save.isError ? failureText(save.error) : null} />
      <FormMessage tone="info" message={done} />
      <div className="grid gap-x-3 sm:grid-cols-[2fr_1fr]">
        <FieldFrame id={`${id}-q`} label="Question" error={err.questionId?.message}>
          {(control) => (
            <select className="field-input" {...control} {...register("questionId")}>
              {attempt.results.map((r, i) => (
                <option key={r.questionId} value={r.questionId}>
                  {i + 1}. {r.label} ({points(r.points)} of {points(r.maxPoints)})
                </option>
              ))}
            </select>
          )}
        </FieldFrame>
        <FieldFrame id={`${id}-p`} label="New points" hint={`0 to ${chosen ? points(chosen.maxPoints) : "the maximum"}, in halves.`} error={err.points?.message}>
          {(control) => <input type="number" step={0.5} min={0} max={chosen?.maxPoints} className="field-input" {...control} {...register("points", { valueAsNumber: true })} />}
        </FieldFrame>
      </div>
      <FieldFrame id={`${id}-r`} label="Reason (the student sees it)" error={err.reason?.message} className="">
        {(control) => <textarea rows={2} className="field-input" {...control} {...register("reason")} />}
      </FieldFrame>
      <button type="submit" className="btn-primary mt-2" disabled={save.isPending}>
        {save.isPending ? "Saving…" : "Save the points"}
      </button>
    </form>
  );
}

type RerunIn = z.input<typeof rerunSchema>;
type RerunOut = z.output<typeof rerunSchema>;

function Rerun({ attempt }: { attempt: AttemptView }) {
  const id = useId();
  const refresh = useRefresh(attempt.id);
  const { register, handleSubmit, formState, reset } = useForm<RerunIn, unknown, RerunOut>({ resolver: zodResolver(rerunSchema), defaultValues: { rerun: true, reason: "" } });
  const run = useMutation({
    mutationFn: (body: RerunOut) => api<{ attempt: AttemptView }>(`/api/attempts/${attempt.id}/regrades`, { method: "POST", body }),
    onSuccess: () => {
      reset({ rerun: true, reason: "" });
      refresh();
    },
  });
  return (
    <details className="mt-6">
      <summary className="cursor-pointer font-semibold">Re-run the grader on the stored readings</summary>
      <form
        className="mt-2"
        aria-label="Re-run the grader"
        noValidate
        onSubmit={handleSubmit(async (v) => {
          await run.mutateAsync(v).catch(() => undefined);
        })}
      >
        <p className="text-sm text-ink-soft">The grader grades the readings again with the lab as it is now. Points set by staff are replaced by the grader&apos;s.</p>
        <FormMessage message={run.isError ? failureText(run.error) : null} />
        <FormMessage tone="info" message={run.isSuccess ? `Graded again: ${points(run.data.attempt.score)} of ${points(run.data.attempt.maxScore)} points.` : null} />
        <FieldFrame id={`${id}-r`} label="Reason" error={formState.errors.reason?.message} className="">
          {(control) => <input className="field-input" {...control} {...register("reason")} />}
        </FieldFrame>
        <button type="submit" className="btn-quiet mt-2" disabled={run.isPending}>
          {run.isPending ? "Grading…" : "Re-run the grader"}
        </button>
      </form>
    </details>
  );
}

type AnswerIn = z.input<typeof reviewAnswerSchema>;
type AnswerOut = z.output<typeof reviewAnswerSchema>;

function AnswerForm({ attempt }: { attempt: AttemptView }) {
  const id = useId();
  const refresh = useRefresh(attempt.id);
  const { register, handleSubmit, formState, setError } = useForm<AnswerIn, unknown, AnswerOut>({
    resolver: zodResolver(reviewAnswerSchema),
    defaultValues: { message: attempt.reviewAnswer ?? "" },
  });
  const send = useMutation({
    mutationFn: (body: AnswerOut) => api(`/api/attempts/${attempt.id}/review/answer`, { method: "POST", body }),
    onSuccess: refresh,
    onError: (e) => {
      const m = isApiError(e) ? e.fields?.message?.[0] : undefined;
      if (m) setError("message", { type: "server", message: m });
    },
  });
  return (
    <form
      className="mt-6"
      aria-label="Answer the student"
      noValidate
      onSubmit={handleSubmit(async (v) => {
        await send.mutateAsync(v).catch(() => undefined);
      })}
    >
      <h3 className="text-lg">Answer the student</h3>
      {attempt.reviewAnsweredAt && !attempt.reviewOpen ? <p className="text-sm text-ink-soft">Answered on {utcDate(attempt.reviewAnsweredAt)}; a new answer replaces the one shown to the student (both stay in the history).</p> : null}
      <FormMessage message={send.isError ? failureText(send.error) : null} />
      <FormMessage tone="info" message={send.isSuccess ? "Answer sent; the request is closed." : null} />
      <FieldFrame id={id} label="Your answer" error={formState.errors.message?.message} className="">
        {(control) => <textarea rows={4} className="field-input" {...control} {...register("message")} />}
      </FieldFrame>
      <button type="submit" className="btn-primary mt-2" disabled={send.isPending}>
        {send.isPending ? "Sending…" : "Send the answer and close the request"}
      </button>
    </form>
  );
}
