"use client";
// The questions of a lab: which quantity, a prediction (worked out before the bench) or a bench reading,
// points and an optional tolerance that overrides the lab's default.
import { useFieldArray, useFormContext } from "react-hook-form";
import { templates, type TemplateKey } from "@/lib/grader";
import type { BuilderForm } from "./form-model";
import { SelectInput, TextInput, useFieldError } from "./inputs";

export function QuestionFields({ templateKey }: { templateKey: TemplateKey }) {
  const { control } = useFormContext<BuilderForm>();
  const { fields, append, remove, move } = useFieldArray({ control, name: "questions", keyName: "key" });
  const listError = useFieldError("root.questions");
  const t = templates[templateKey];
  const quantityOptions = t.quantities.map((q) => ({ value: q.key, label: `${q.label}${q.displayUnit ? ` (${q.displayUnit})` : ""}` }));
  return (
    <div>
      <p id="lab-questions-error" className="field-error" aria-live="polite">
        {listError ? `Check: ${listError}` : ""}
      </p>
      <ol className="grid gap-4">
        {fields.map((f, i) => (
          <li key={f.key}>
            <fieldset className="rounded-card border border-ink/15 p-4" data-testid={`question-${i + 1}`}>
              <legend className="px-1 font-semibold">Question {i + 1}</legend>
              <div className="grid gap-x-4 sm:grid-cols-2">
                <SelectInput name={`questions.${i}.quantity`} label="Quantity asked" options={quantityOptions} />
                <SelectInput
                  name={`questions.${i}.kind`}
                  label="Kind of answer"
                  options={[
                    { value: "prediction", label: "Prediction (worked out before the bench)" },
                    { value: "bench", label: "Bench reading (measured)" },
                  ]}
                />
                <TextInput name={`questions.${i}.points`} label="Points" inputMode="decimal" />
                <TextInput name={`questions.${i}.tolerancePercent`} label="Tolerance (%)" inputMode="decimal" hint="Leave empty to use the lab's default tolerance." />
              </div>
              <div className="flex flex-wrap gap-2">
                <button type="button" className="btn-quiet" onClick={() => move(i, i - 1)} disabled={i === 0} aria-label={`Move question ${i + 1} up`}>
                  Move up
                </button>
                <button type="button" className="btn-quiet" onClick={() => move(i, i + 1)} disabled={i === fields.length - 1} aria-label={`Move question ${i + 1} down`}>
                  Move down
                </button>
                <button type="button" className="btn-quiet" onClick={() => remove(i)} disabled={fields.length <= 1} aria-label={`Remove question ${i + 1}`}>
                  Remove
                </button>
              </div>
            </fieldset>
          </li>
        ))}
      </ol>
      <button
        type="button"
        className="btn-quiet mt-4"
        disabled={fields.length >= 20}
        onClick={() => append({ quantity: t.quantities[0].key, kind: "prediction", points: "1", tolerancePercent: "" })}
      >
        Add a question
      </button>
    </div>
  );
}
