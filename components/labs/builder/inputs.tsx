"use client";
// Labelled inputs bound to the builder's react-hook-form state. Each error (and each "read as" note) sits
// in its own element named by aria-describedby; error text starts with a word, not only a colour.
import type { ReactNode } from "react";
import { get, useFormContext, useWatch } from "react-hook-form";
import type { ParameterSpec } from "@/lib/grader";
import { readAsText, readValue, type BuilderForm } from "./form-model";

export function idFor(name: string): string {
  return `lab-${name.replace(/[^A-Za-z0-9_-]/g, "-")}`;
}

export function useFieldError(name: string): string | undefined {
  const {
    formState: { errors },
  } = useFormContext<BuilderForm>();
  const e = get(errors, name) as { message?: string } | undefined;
  return e?.message || undefined;
}

function Described({ id, hint, error, note }: { id: string; hint?: ReactNode; error?: string; note?: ReactNode }) {
  return (
    <>
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {note && !error ? (
        <p id={`${id}-note`} className="mt-1 text-xs text-trace" aria-live="polite">
          {note}
        </p>
      ) : null}
      <p id={`${id}-error`} className="field-error" aria-live="polite">
        {error ? `Check: ${error}` : ""}
      </p>
    </>
  );
}

function describedBy(id: string, hint: unknown, error: unknown, note: unknown): string | undefined {
  return [hint ? `${id}-hint` : "", note && !error ? `${id}-note` : "", error ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined;
}

type TextProps = {
  name: string;
  label: string;
  hint?: ReactNode;
  type?: "text" | "datetime-local" | "number";
  inputMode?: "decimal" | "numeric" | "text";
  className?: string;
  placeholder?: string;
  multiline?: number;
};

export function TextInput({ name, label, hint, type = "text", inputMode, className, placeholder, multiline }: TextProps) {
  const { register } = useFormContext<BuilderForm>();
  const error = useFieldError(name);
  const id = idFor(name);
  const common = {
    id,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": describedBy(id, hint, error, null),
    className: "field-input",
    placeholder,
    ...register(name as never),
  };
  return (
    <div className={className ?? "mb-4"}>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {multiline ? <textarea rows={multiline} {...common} /> : <input type={type} inputMode={inputMode} autoComplete="off" spellCheck={false} {...common} />}
      <Described id={id} hint={hint} error={error} />
    </div>
  );
}

export function SelectInput({ name, label, options, hint, className, onChangeValue, disabled }: { name: string; label: string; options: { value: string; label: string }[]; hint?: ReactNode; className?: string; onChangeValue?: (v: string) => void; disabled?: boolean }) {
  const { register } = useFormContext<BuilderForm>();
  const error = useFieldError(name);
  const id = idFor(name);
  const reg = register(name as never);
  return (
    <div className={className ?? "mb-4"}>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <select
        id={id}
        className="field-input"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error, null)}
        disabled={disabled}
        {...reg}
        onChange={(e) => {
          void reg.onChange(e);
          onChangeValue?.(e.target.value);
        }}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <Described id={id} hint={hint} error={error} />
    </div>
  );
}

/** A value typed with its unit; shows, as it is typed, how the grader reads it or why it cannot. */
export function QuantityInput({ name, label, param, hint, className }: { name: string; label: string; param: ParameterSpec; hint?: ReactNode; className?: string }) {
  const { register } = useFormContext<BuilderForm>();
  const text = (useWatch<BuilderForm>({ name: name as never }) as unknown as string | undefined) ?? "";
  const formError = useFieldError(name);
  const id = idFor(name);
  let note: ReactNode = null;
  let liveError: string | undefined;
  if (text.trim() !== "") {
    const r = readValue(text, param);
    if (r.ok) note = `Read as ${readAsText(r.value, param)}`;
    else liveError = r.message;
  }
  const error = formError ?? liveError;
  return (
    <div className={className ?? "mb-4"}>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input
        id={id}
        type="text"
        autoComplete="off"
        spellCheck={false}
        className="field-input font-mono"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error, note)}
        {...register(name as never)}
      />
      <Described id={id} hint={hint} error={error} note={note} />
    </div>
  );
}
