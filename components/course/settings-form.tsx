"use client";

// The instructor's course settings: title, term, joining open or closed, the late policy new labs start with,
// a new join code, and copying the course into a new term.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormMessage } from "@/components/ui/field";
import { copyCourseSchema, courseSettingsSchema, type CopyCourseInput, type CourseSettingsInput } from "@/lib/validation/courses";
import type { z } from "zod";
import { sendJson } from "./send-json";

type Note = { text: string; tone: "error" | "info" } | null;

export interface SettingsValues {
  title: string;
  term: string;
  joiningOpen: boolean;
  defaultLatePenaltyPercentPerDay: number;
  defaultLateFloorPercent: number;
}

export function CourseSettingsForm({ courseId, initial }: { courseId: string; initial: SettingsValues }) {
  const router = useRouter();
  const [note, setNote] = useState<Note>(null);
  const form = useForm<CourseSettingsInput, unknown, z.output<typeof courseSettingsSchema>>({ resolver: zodResolver(courseSettingsSchema), defaultValues: initial });
  const e = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    const r = await sendJson("PATCH", `/api/courses/${courseId}`, values);
    if (!r.ok) return setNote({ text: r.message, tone: "error" });
    setNote({ text: "The settings are saved.", tone: "info" });
    router.refresh();
  });
  return (
    <form onSubmit={onSubmit} aria-label="Course settings" noValidate className="card">
      <h2 className="mb-3 text-lg">Course</h2>
      <FormMessage message={note?.text} tone={note?.tone} />
      <div className="grid gap-x-4 sm:grid-cols-2">
        <Field label="Title" {...form.register("title")} error={e.title?.message} />
        <Field label="Term" {...form.register("term")} error={e.term?.message} />
      </div>
      <label className="mb-4 flex items-center gap-2 text-sm">
        <input type="checkbox" {...form.register("joiningOpen")} />
        Students may join with the join code
      </label>
      <h3 className="mt-2 text-base">Late policy for new labs</h3>
      <p className="mb-2 text-sm text-ink-soft">Each new lab starts with these; the lab&apos;s own policy can still be changed in the lab builder.</p>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <Field label="Late penalty per started day (%)" type="number" step="any" {...form.register("defaultLatePenaltyPercentPerDay", { valueAsNumber: true })} error={e.defaultLatePenaltyPercentPerDay?.message} />
        <Field label="A late attempt keeps at least (%)" type="number" step="any" {...form.register("defaultLateFloorPercent", { valueAsNumber: true })} error={e.defaultLateFloorPercent?.message} />
      </div>
      <button className="btn-primary" type="submit" disabled={form.formState.isSubmitting}>Save settings</button>
    </form>
  );
}

export function JoinCodePanel({ courseId, joinCode, joiningOpen }: { courseId: string; joinCode: string; joiningOpen: boolean }) {
  const router = useRouter();
  const [code, setCode] = useState(joinCode);
  const [note, setNote] = useState<Note>(null);
  async function regenerate() {
    if (!window.confirm("Make a new join code? The current one stops working at once.")) return;
    const r = await sendJson<{ joinCode: string }>("POST", `/api/courses/${courseId}/join-code`);
    if (!r.ok) return setNote({ text: r.message, tone: "error" });
    setCode(r.data.joinCode);
    setNote({ text: "A new join code is in force.", tone: "info" });
    router.refresh();
  }
  return (
    <section className="card" aria-labelledby="join-title">
      <h2 id="join-title" className="text-lg">Join code</h2>
      <FormMessage message={note?.text} tone={note?.tone} />
      <p className="mt-2">
        <code className="rounded bg-paper-sunk px-3 py-1 font-mono text-lg" data-testid="join-code">{code}</code>
      </p>
      <p className="mt-2 text-sm text-ink-soft">{joiningOpen ? "Students can join with it on the sign-up page." : "Joining is closed: the code admits no one until you open it again."}</p>
      <button type="button" className="btn-quiet mt-3" onClick={regenerate}>Make a new join code</button>
    </section>
  );
}

export function CopyCourseForm({ courseId, code }: { courseId: string; code: string }) {
  const router = useRouter();
  const [note, setNote] = useState<Note>(null);
  const form = useForm<CopyCourseInput, unknown, z.output<typeof copyCourseSchema>>({
    resolver: zodResolver(copyCourseSchema),
    defaultValues: { code: `${code}-NEXT`, term: "", shiftDays: 182 },
  });
  const e = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    const r = await sendJson<{ course: { id: string; code: string }; labs: number }>("POST", `/api/courses/${courseId}/copy`, values);
    if (!r.ok) {
      for (const [k, v] of Object.entries(r.fields ?? {})) if (k === "code" || k === "term" || k === "shiftDays") form.setError(k, { message: v[0] });
      return setNote({ text: r.message, tone: "error" });
    }
    router.push(`/courses/${r.data.course.id}/settings?copied=${r.data.labs}`);
  });
  return (
    <form onSubmit={onSubmit} aria-label="Copy into a new term" noValidate className="card">
      <h2 className="text-lg">Copy into a new term</h2>
      <p className="mt-1 mb-3 text-sm text-ink-soft">
        The new course gets this lesson plan and every lab as a draft, with all dates moved by the days you give. No
        students, attempts or grades are copied; you are its instructor.
      </p>
      <FormMessage message={note?.text} tone={note?.tone} />
      <div className="grid gap-x-4 sm:grid-cols-3">
        <Field label="New course code" {...form.register("code")} error={e.code?.message} />
        <Field label="New term" placeholder="e.g. Autumn 2027" {...form.register("term")} error={e.term?.message} />
        <Field label="Move dates by (days)" type="number" step="1" {...form.register("shiftDays", { valueAsNumber: true })} error={e.shiftDays?.message} />
      </div>
      <button className="btn-quiet" type="submit" disabled={form.formState.isSubmitting}>Copy the course</button>
    </form>
  );
}
