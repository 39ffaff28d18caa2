"use client";
// The instructor's exceptions on a lab's page: one student's own due date, close and/or extra attempts
// with a reason, listed with a way to remove each. Like the hold-grades switch it sends one request with
// api() and re-renders the server page (the lab page is also every student's, so no query client); the
// shared schema is loaded on the first submit.
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { FormMessage } from "@/components/ui/field";
import { utcDate } from "@/lib/dates";
import { api, isApiError } from "@/lib/http/client";

export interface ExceptionItem {
  userId: string;
  studentName: string;
  dueAt: string | null;
  closesAt: string | null;
  extraAttempts: number;
  reason: string;
}

const toInstant = (local: string) => (local ? new Date(local).toISOString() : undefined);

export function ExceptionsPanel({ labId, students, exceptions, canEdit }: { labId: string; students: { userId: string; name: string }[]; exceptions: ExceptionItem[]; canEdit: boolean }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [note, setNote] = useState<{ text: string; tone: "error" | "info" } | null>(null);
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [form, setForm] = useState({ userId: "", dueAt: "", closesAt: "", extraAttempts: "0", reason: "" });
  const set = (k: keyof typeof form) => (e: { target: { value: string } }) => setForm({ ...form, [k]: e.target.value });

  function grant() {
    startTransition(async () => {
      const body = { dueAt: toInstant(form.dueAt), closesAt: toInstant(form.closesAt), extraAttempts: Number(form.extraAttempts || 0), reason: form.reason };
      const { exceptionSchema } = await import("@/lib/validation/exceptions");
      const checked = exceptionSchema.safeParse(body);
      const local: Record<string, string[]> = {};
      if (!form.userId) local.userId = ["Choose a student."];
      if (!checked.success) for (const i of checked.error.issues) (local[i.path.join(".")] ??= []).push(i.message);
      if (Object.keys(local).length) {
        setFields(local);
        return setNote({ text: "Check the marked fields; nothing was saved.", tone: "error" });
      }
      try {
        await api(`/api/labs/${labId}/exceptions/${form.userId}`, { method: "PUT", body });
        setFields({});
        setNote({ text: "The exception is saved; attempts already made now use the student's own due date.", tone: "info" });
        setForm({ userId: "", dueAt: "", closesAt: "", extraAttempts: "0", reason: "" });
        router.refresh();
      } catch (e) {
        setFields(isApiError(e) ? (e.fields ?? {}) : {});
        setNote({ text: isApiError(e) ? e.message : "That did not work.", tone: "error" });
      }
    });
  }

  function remove(x: ExceptionItem) {
    if (!window.confirm(`Remove the exception of ${x.studentName}? Their attempts get the lab's own late penalty again.`)) return;
    startTransition(async () => {
      try {
        await api(`/api/labs/${labId}/exceptions/${x.userId}`, { method: "DELETE" });
        setNote({ text: `The exception of ${x.studentName} is removed.`, tone: "info" });
        router.refresh();
      } catch (e) {
        setNote({ text: isApiError(e) ? e.message : "That did not work.", tone: "error" });
      }
    });
  }

  const err = (k: string) => (fields[k] ? <span className="field-error block">{fields[k].join(" ")}</span> : null);
  return (
    <section aria-labelledby="exceptions-heading" className="card mt-6">
      <h2 id="exceptions-heading" className="text-lg">Exceptions</h2>
      <p className="mt-1 text-sm text-ink-soft">A student with an exception works with their own due date, close and attempt limit: no late penalty before their own due date.</p>
      <FormMessage message={note?.text} tone={note?.tone} />
      {exceptions.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">No student has an exception.</p>
      ) : (
        <ul className="mt-2 space-y-2 text-sm" data-testid="exceptions">
          {exceptions.map((x) => (
            <li key={x.userId} className="flex flex-wrap items-baseline gap-x-3">
              <strong>{x.studentName}</strong>
              <span>
                {x.dueAt ? `due ${utcDate(new Date(x.dueAt))}` : "the lab's due date"}
                {x.closesAt ? `, closes ${utcDate(new Date(x.closesAt))}` : ""}
                {x.extraAttempts ? `, ${x.extraAttempts} extra attempt${x.extraAttempts === 1 ? "" : "s"}` : ""}
              </span>
              <span className="text-ink-soft">{x.reason}</span>
              {canEdit ? (
                <button type="button" className="btn-quiet px-2 py-0.5" disabled={pending} onClick={() => remove(x)} aria-label={`Remove the exception of ${x.studentName}`}>
                  Remove
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {canEdit ? (
        <form
          className="mt-4 grid gap-3 text-sm sm:grid-cols-2"
          aria-label="Grant an exception"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            grant();
          }}
        >
          <label className="field-label">
            Student
            <select className="field-input" value={form.userId} onChange={set("userId")} aria-invalid={fields.userId ? true : undefined}>
              <option value="">choose…</option>
              {students.map((s) => (
                <option key={s.userId} value={s.userId}>{s.name}</option>
              ))}
            </select>
            {err("userId")}
          </label>
          <label className="field-label">
            Extra attempts
            <input className="field-input" type="number" min={0} max={20} step={1} value={form.extraAttempts} onChange={set("extraAttempts")} />
            {err("extraAttempts")}
          </label>
          <label className="field-label">
            Own due date (your time zone)
            <input className="field-input" type="datetime-local" value={form.dueAt} onChange={set("dueAt")} />
            {err("dueAt")}
          </label>
          <label className="field-label">
            Own close (optional)
            <input className="field-input" type="datetime-local" value={form.closesAt} onChange={set("closesAt")} />
            {err("closesAt")}
          </label>
          <label className="field-label sm:col-span-2">
            Reason (the student and the grade history show it)
            <input className="field-input" value={form.reason} maxLength={500} onChange={set("reason")} />
            {err("reason")}
          </label>
          <p className="sm:col-span-2">
            <button type="submit" className="btn-primary" disabled={pending}>
              {pending ? "Saving…" : "Grant the exception"}
            </button>
          </p>
        </form>
      ) : null}
    </section>
  );
}
