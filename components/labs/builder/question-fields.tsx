"use client";
// The questions of a lab: which quantity, a prediction (worked out before the bench) or a bench reading,
// points and an optional tolerance that overrides the lab's default.
import { useDeferredValue, useMemo } from "react";
import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { bandWarnings, templates, type BandWarning, type TemplateKey } from "@/lib/grader";
import { formToInput, type BuilderForm } from "./form-model";
import { SelectInput, TextInput, useFieldError } from "./inputs";

export function QuestionFields({ templateKey }: { templateKey: TemplateKey }) {
  const { control } = useFormContext<BuilderForm>();
  const { fields, append, remove, move } = useFieldArray({ control, name: "questions", keyName: "key" });
  const listError = useFieldError("root.questions");
  const t = templates[templateKey];
  const warnings = useBandWarnings();
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
              {warnings.has(i) ? (
                <p className="mb-3 rounded-card border-l-4 border-caution-edge bg-caution-bg p-2 text-sm text-caution" role="note" data-testid={`question-${i + 1}-band-warning`}>
                  {warnings.get(i)!.message}
                </p>
              ) : null}
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

/**
 * Questions whose accepted band cannot tell the right value from a tenth of it on this lab's drawn circuits
 * (a bench meter that cannot resolve the value, a floor near zero), by question index. Worked out from the
 * form as it stands; nothing while the form has a value that does not read.
 */
function useBandWarnings(): Map<number, BandWarning> {
  const form = useWatch<BuilderForm>() as BuilderForm;
  const deferred = useDeferredValue(form);
  return useMemo(() => {
    const out = new Map<number, BandWarning>();
    if (!deferred?.templateKey || !deferred.questions) return out;
    const { input, errors } = formToInput(deferred);
    if (Object.keys(errors).length > 0) return out;
    try {
      for (const w of bandWarnings(input.spec, input.questions.map((q) => ({ ...q, points: 1 })), input.policy)) out.set(w.index, w);
    } catch {
      // a question naming a quantity of another template while the template changes: no warnings yet
    }
    return out;
  }, [deferred]);
}
