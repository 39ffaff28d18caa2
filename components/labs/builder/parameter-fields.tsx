"use client";
// One parameter of the circuit: a fixed value for every student, a range each student's value is drawn
// from, or a list to pick from. Resistors also name the series they are snapped to and their tolerance.
import { useFormContext, useWatch } from "react-hook-form";
import { SERIES_NAMES, type ParameterSpec } from "@/lib/grader";
import type { BuilderForm, DrawMode } from "./form-model";
import { idFor, QuantityInput, SelectInput, TextInput, useFieldError } from "./inputs";

const MODE_LABEL: Record<DrawMode, string> = {
  fixed: "The same value for every student",
  range: "Drawn from a range for each student",
  list: "Picked from a list for each student",
};

function unitHint(p: ParameterSpec): string {
  if (p.kind === "integer") return `A whole number${p.displayUnit ? ` (${p.displayUnit})` : ""}.`;
  if (p.unit === "") return "A plain number.";
  return `Type the unit, for example ${p.displayUnit === "Ω" || p.displayUnit === "kΩ" ? "4.7 kΩ or 4k7" : `a value in ${p.displayUnit}`}.`;
}

function CategoryChoices({ name, p }: { name: string; p: ParameterSpec }) {
  const { setValue } = useFormContext<BuilderForm>();
  const text = (useWatch<BuilderForm>({ name: name as never }) as unknown as string) ?? "";
  const picked = new Set(text.split(";").map((s) => s.trim()).filter(Boolean));
  const error = useFieldError(name);
  const id = idFor(name);
  return (
    <fieldset className="mb-4" aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="field-label">Options to pick from</legend>
      <div className="mt-1 flex flex-wrap gap-3">
        {(p.choices ?? []).map((c) => (
          <label key={c} className="inline-flex items-center gap-1 text-sm">
            <input
              type="checkbox"
              checked={picked.has(c)}
              onChange={(e) => {
                const next = new Set(picked);
                if (e.target.checked) next.add(c);
                else next.delete(c);
                setValue(name as never, (p.choices ?? []).filter((x) => next.has(x)).join("; ") as never, { shouldDirty: true, shouldValidate: true });
              }}
            />
            {c}
          </label>
        ))}
      </div>
      <p id={`${id}-error`} className="field-error" aria-live="polite">
        {error ? `Check: ${error}` : ""}
      </p>
    </fieldset>
  );
}

export function ParameterFields({ p }: { p: ParameterSpec }) {
  const base = `parameters.${p.key}`;
  const mode = (useWatch<BuilderForm>({ name: `${base}.mode` as never }) as unknown as DrawMode) ?? "fixed";
  const modes: DrawMode[] = p.kind === "category" ? ["fixed", "list"] : ["fixed", "range", "list"];
  const hint = unitHint(p);
  const bounds =
    p.min !== undefined && p.max !== undefined && p.kind !== "category"
      ? ` Sensible limits for this template: ${p.min} to ${p.max}${p.unit && p.unit !== "" ? ` ${p.unit === "ohm" ? "Ω" : p.unit}` : ""} (SI).`
      : "";
  return (
    <fieldset className="rounded-card border border-ink/15 p-4" data-testid={`param-${p.key}`}>
      <legend className="px-1 font-semibold">{p.label}</legend>
      {p.description ? <p className="mb-2 text-sm text-ink-soft">{p.description}</p> : null}
      <SelectInput name={`${base}.mode`} label="How students get this value" options={modes.map((m) => ({ value: m, label: MODE_LABEL[m] }))} />
      {p.kind === "category" ? (
        mode === "list" ? (
          <CategoryChoices name={`${base}.values`} p={p} />
        ) : (
          <SelectInput name={`${base}.value`} label="Value" options={(p.choices ?? []).map((c) => ({ value: c, label: c }))} />
        )
      ) : mode === "fixed" ? (
        <QuantityInput name={`${base}.value`} label="Value" param={p} hint={hint + bounds} />
      ) : mode === "range" ? (
        <div className="grid gap-x-4 sm:grid-cols-3">
          <QuantityInput name={`${base}.min`} label="Smallest value" param={p} hint={hint} />
          <QuantityInput name={`${base}.max`} label="Largest value" param={p} />
          <QuantityInput name={`${base}.step`} label="Step (optional)" param={p} hint={p.kind === "resistor" ? "Leave empty: values snap to the series." : "Leave empty for any value (3 significant figures)."} />
        </div>
      ) : (
        <TextInput name={`${base}.values`} label="Values to pick from" hint={`Separate values with semicolons, for example "${p.kind === "resistor" ? "1 kΩ; 2.2 kΩ; 4.7 kΩ" : "1; 2; 5"}". ${hint}`} />
      )}
      {p.kind === "resistor" ? (
        <div className="grid gap-x-4 sm:grid-cols-2">
          <SelectInput
            name={`${base}.series`}
            label="Resistor series"
            hint="Drawn values snap to the nearest value of this series."
            options={SERIES_NAMES.map((s) => ({ value: s, label: s }))}
          />
          <TextInput name={`${base}.tolerancePercent`} label="Tolerance (%)" inputMode="decimal" hint="The parts' tolerance, used for the bench reading bands." />
        </div>
      ) : null}
    </fieldset>
  );
}
