"use client";

// The site admin creates a course and names its first instructor by e-mail.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Field, FormMessage } from "@/components/ui/field";
import { createCourseSchema, type CreateCourseInput } from "@/lib/validation/courses";
import { sendJson } from "./send-json";

type Created = { course: { id: string; code: string; joinCode: string }; instructor: { email: string; invited: boolean } };

export function CreateCourseForm() {
  const router = useRouter();
  const [note, setNote] = useState<{ text: string; tone: "error" | "info" } | null>(null);
  const form = useForm<CreateCourseInput, unknown, z.output<typeof createCourseSchema>>({
    resolver: zodResolver(createCourseSchema),
    defaultValues: { code: "", title: "", term: "", institution: "", instructorEmail: "", instructorName: "" },
  });
  const e = form.formState.errors;
  const onSubmit = form.handleSubmit(async (values) => {
    const r = await sendJson<Created>("POST", "/api/courses", values);
    if (!r.ok) {
      for (const [k, v] of Object.entries(r.fields ?? {})) {
        if (k in values) form.setError(k as keyof CreateCourseInput, { message: v[0] });
      }
      return setNote({ text: r.message, tone: "error" });
    }
    const c = r.data;
    setNote({
      text: `${c.course.code} is created with join code ${c.course.joinCode}; ${c.instructor.email} is its instructor${c.instructor.invited ? " (invited to set a password)" : ""}.`,
      tone: "info",
    });
    form.reset({ ...values, code: "", title: "", instructorEmail: "", instructorName: "" });
    router.refresh();
  });
  return (
    <form onSubmit={onSubmit} aria-label="Create a course" noValidate className="card">
      <h2 className="mb-3 text-lg">Create a course</h2>
      <FormMessage message={note?.text} tone={note?.tone} />
      <div className="grid gap-x-4 sm:grid-cols-2">
        <Field label="Course code" placeholder="e.g. ELM-310" {...form.register("code")} error={e.code?.message} />
        <Field label="Title" {...form.register("title")} error={e.title?.message} />
        <Field label="Term" placeholder="e.g. Spring 2027" {...form.register("term")} error={e.term?.message} />
        <Field label="Institution" {...form.register("institution")} error={e.institution?.message} />
        <Field label="Instructor's e-mail" type="email" {...form.register("instructorEmail")} error={e.instructorEmail?.message} />
        <Field label="Instructor's name (for a new account)" hint="Needed only when the instructor has no account yet." {...form.register("instructorName")} error={e.instructorName?.message} />
      </div>
      <button className="btn-primary" type="submit" disabled={form.formState.isSubmitting}>Create course</button>
    </form>
  );
}
