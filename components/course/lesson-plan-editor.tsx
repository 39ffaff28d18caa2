"use client";

// The instructor's lesson plan: which lessons appear, in which order, and when each opens.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useFieldArray, useForm } from "react-hook-form";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";
import { toLocalInput } from "@/lib/dates";
import { lessonPlanSchema, type LessonPlan, type LessonPlanInput } from "@/lib/validation/course-lessons";

export interface PlanRow {
  slug: string;
  title: string;
  visible: boolean;
  /** "YYYY-MM-DDTHH:mm" in the browser's time zone, or "" */
  opensAt: string;
}

export function LessonPlanEditor({ courseId, initial }: { courseId: string; initial: { slug: string; title: string; visible: boolean; opensAt: string | null }[] }) {
  const titles = Object.fromEntries(initial.map((l) => [l.slug, l.title]));
  const form = useForm<LessonPlanInput, unknown, LessonPlan>({
    resolver: zodResolver(lessonPlanSchema),
    defaultValues: { lessons: initial.map((l) => ({ slug: l.slug, visible: l.visible, opensAt: toLocalInput(l.opensAt) })) },
  });
  const { fields, move } = useFieldArray({ control: form.control, name: "lessons" });

  const queryClient = useQueryClient();
  const save = useMutation({
    mutationFn: (values: LessonPlan) =>
      api(`/api/courses/${courseId}/lessons`, {
        method: "PUT",
        // the schema read each local date-time in the browser's time zone; send it as an instant
        body: { lessons: values.lessons.map((l) => ({ ...l, opensAt: l.opensAt ? l.opensAt.toISOString() : null })) },
      }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["course-lessons", courseId] }),
  });
  const message = save.isSuccess
    ? { text: "The lesson plan is saved.", tone: "info" as const }
    : save.isError
      ? { text: (isApiError(save.error) && save.error.serverMessage) || "The plan could not be saved.", tone: "error" as const }
      : null;

  const onSubmit = form.handleSubmit(async (values) => {
    await save.mutateAsync(values).catch(() => undefined);
  });

  return (
    <form onSubmit={onSubmit} aria-label="Lesson plan" noValidate>
      <FormMessage message={message?.text} tone={message?.tone} />
      <ol className="space-y-2">
        {fields.map((f, i) => (
          <li key={f.id} className="card flex flex-wrap items-center gap-4 p-3">
            <span className="w-6 text-right font-mono text-sm text-ink-faint">{i + 1}</span>
            <label className="flex items-center gap-2">
              <input type="checkbox" {...form.register(`lessons.${i}.visible`)} />
              <span className="font-medium">{titles[f.slug]}</span>
            </label>
            <label className="ml-auto flex items-center gap-2 text-sm">
              Opens
              <input type="datetime-local" className="field-input mt-0 w-auto py-1" aria-label={`Opening time of ${titles[f.slug]}`} {...form.register(`lessons.${i}.opensAt`)} />
            </label>
            <span className="flex gap-1">
              <button type="button" className="btn-quiet px-2 py-1" disabled={i === 0} onClick={() => move(i, i - 1)} aria-label={`Move ${titles[f.slug]} up`}>
                ↑
              </button>
              <button type="button" className="btn-quiet px-2 py-1" disabled={i === fields.length - 1} onClick={() => move(i, i + 1)} aria-label={`Move ${titles[f.slug]} down`}>
                ↓
              </button>
            </span>
          </li>
        ))}
      </ol>
      <button type="submit" className="btn-primary mt-4" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Saving…" : "Save lesson plan"}
      </button>
    </form>
  );
}
