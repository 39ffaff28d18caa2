"use client";
// Labelled inputs bound to the builder's react-hook-form state, drawn with the shared pieces of
// components/ui/field.tsx (one message line per field, named by aria-describedby).
import type { ReactNode } from "react";
import { get, useFormContext, useWatch } from "react-hook-form";
import type { ParameterSpec } from "@/lib/grader";
import { FieldHint, FieldMessage, fieldIds, QuantityInput as SharedQuantityInput, SelectField, type Reading } from "@/components/ui/field";
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

function Described({ id, hint, error }: { id: string; hint?: ReactNode; error?: string }) {
  return (
    <>
      <FieldHint id={id} hint={hint} />
      <FieldMessage id={id} error={error} />
    </>
  );
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
    "aria-describedby": fieldIds(id, hint).describedBy,
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
    <SelectField
      id={id}
      label={label}
      hint={hint}
      error={error}
      className={className}
      options={options}
      disabled={disabled}
      {...reg}
      onChange={(e) => {
        void reg.onChange(e);
        onChangeValue?.(e.target.value);
      }}
    />
  );
}

/** A value typed with its unit; shows, as it is typed, how the grader reads it or why it cannot. */
export function QuantityInput({ name, label, param, hint, className }: { name: string; label: string; param: ParameterSpec; hint?: ReactNode; className?: string }) {
  const { register } = useFormContext<BuilderForm>();
  const text = (useWatch<BuilderForm>({ name: name as never }) as unknown as string | undefined) ?? "";
  const error = useFieldError(name);
  let reading: Reading = { status: "empty" };
  if (text.trim() !== "") {
    const r = readValue(text, param);
    reading = r.ok ? { status: "ok", readAs: readAsText(r.value, param) } : { status: "error", message: r.message };
  }
  return <SharedQuantityInput id={idFor(name)} label={label} hint={hint} className={className} inputClassName="font-mono" error={error} reading={reading} {...register(name as never)} />;
}
