"use client";
// The instructor's lab weights: each lab's share of the course total. Empty means "by its points".
import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";
import { labWeightsSchema, type LabWeights, type LabWeightsInput } from "@/lib/validation/gradebook";

export function WeightsForm({ courseId, labs }: { courseId: string; labs: { id: string; title: string; weight: number | null; maxPoints: number }[] }) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const [message, setMessage] = useState<{ text: string; tone: "error" | "info" } | null>(null);
  const form = useForm<LabWeightsInput, unknown, LabWeights>({
    resolver: zodResolver(labWeightsSchema),
    defaultValues: { weights: labs.map((l) => ({ labId: l.id, weight: l.weight === null ? "" : String(l.weight) })) },
  });
  const errors = form.formState.errors.weights;

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await api(`/api/courses/${courseId}/gradebook/weights`, { method: "PUT", body: values });
      setMessage({ text: "The weights are saved; the totals use them now.", tone: "info" });
      // the table's totals come from the gradebook query; the page's own numbers from the server
      await queryClient.invalidateQueries({ queryKey: ["gradebook", courseId] });
      router.refresh();
    } catch (e) {
      setMessage({ text: isApiError(e) ? e.message : "The weights could not be saved.", tone: "error" });
    }
  });

  if (labs.length === 0) return <p className="text-sm text-ink-soft">There are no published labs to weigh yet.</p>;
  return (
    <form onSubmit={onSubmit} aria-label="Lab weights" noValidate>
      <FormMessage message={message?.text} tone={message?.tone} />
      <p className="mb-3 text-sm text-ink-soft">
        Each lab counts in the course total in proportion to its weight. Leave a weight empty to weigh the lab by its points.
      </p>
      <ul className="grid gap-2 sm:grid-cols-2">
        {labs.map((l, i) => {
          const error = errors?.[i]?.weight?.message;
          const id = `weight-${l.id}`;
          return (
            <li key={l.id}>
              <label htmlFor={id} className="field-label">
                {l.title}
              </label>
              <input
                id={id}
                inputMode="decimal"
                className="field-input"
                placeholder={`${l.maxPoints} (its points)`}
                aria-invalid={error ? true : undefined}
                aria-describedby={`${id}-error`}
                {...form.register(`weights.${i}.weight`)}
              />
              <p id={`${id}-error`} className="field-error" aria-live="polite">
                {error ?? ""}
              </p>
            </li>
          );
        })}
      </ul>
      <button type="submit" className="btn-primary mt-2" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? "Saving…" : "Save weights"}
      </button>
    </form>
  );
}
