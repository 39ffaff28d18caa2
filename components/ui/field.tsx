// Labelled inputs for every form in the app, so that all of them mark errors the same way: the input gets
// aria-invalid, and one live element under it (named by aria-describedby) says "✗ what is wrong" or, for a
// value typed with its unit, "✓ Read as …". FormMessage is the banner above a form.
import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from "react";
import { forwardRef, useId } from "react";

/** What a typed value reads as right now (the caller parses it the way the grader will). */
export type Reading = { status: "empty" } | { status: "ok"; readAs: string } | { status: "error"; message: string };

/** The hint and the one message under a field; `describedBy` names the ids to put on the input. */
export function fieldIds(id: string, hint: unknown) {
  return { hint: `${id}-hint`, message: `${id}-error`, describedBy: [hint ? `${id}-hint` : "", `${id}-error`].filter(Boolean).join(" ") };
}

export function FieldHint({ id, hint }: { id: string; hint?: ReactNode }) {
  return hint ? (
    <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
      {hint}
    </p>
  ) : null;
}

/** The live line under a field: the error if there is one, else the note (how the value was read), else empty. */
export function FieldMessage({ id, error, note, testId }: { id: string; error?: string; note?: ReactNode; testId?: string }) {
  return (
    <p id={`${id}-error`} aria-live="polite" role={error ? "alert" : undefined} data-testid={testId} className={error ? "field-error" : "mt-1 text-sm text-ink-soft"}>
      {error ? (
        <>
          <span aria-hidden="true">✗ </span>
          {error}
        </>
      ) : note ? (
        <>
          <span aria-hidden="true">✓ </span>
          {note}
        </>
      ) : null}
    </p>
  );
}

/** The attributes that tie a control to its label, hint and message line. */
export type ControlProps = { id: string; "aria-invalid": true | undefined; "aria-describedby": string };

/**
 * One field of any kind: the label, the control (drawn by `children` with the ids it must carry), the hint
 * and the one message line. Field and QuantityInput below are this with an <input>, SelectField with a
 * <select>; forms with a textarea use it directly.
 */
export function FieldFrame({
  id,
  label,
  hint,
  error,
  note,
  messageTestId,
  className = "mb-4",
  children,
}: {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  note?: ReactNode;
  messageTestId?: string;
  className?: string;
  children: (control: ControlProps) => ReactNode;
}) {
  return (
    <div className={className}>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {children({ id, "aria-invalid": error ? true : undefined, "aria-describedby": fieldIds(id, hint).describedBy })}
      <FieldHint id={id} hint={hint} />
      <FieldMessage id={id} error={error} note={note} testId={messageTestId} />
    </div>
  );
}

type Props = InputHTMLAttributes<HTMLInputElement> & { label: string; name: string; error?: string; hint?: string };

export const Field = forwardRef<HTMLInputElement, Props>(function Field({ label, name, error, hint, id, ...rest }, ref) {
  return (
    <FieldFrame id={id ?? `field-${name}`} label={label} hint={hint} error={error}>
      {(control) => <input ref={ref} name={name} className="field-input" {...control} {...rest} />}
    </FieldFrame>
  );
});

type SelectProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, "id" | "className"> & {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  options: { value: string; label: string }[];
  /** a first, empty choice ("Choose…") */
  placeholder?: string;
  className?: string;
  selectClassName?: string;
};

/** A choice from a list, with the label, hint and message line of every other field. */
export const SelectField = forwardRef<HTMLSelectElement, SelectProps>(function SelectField({ id, label, hint, error, options, placeholder, className, selectClassName, ...rest }, ref) {
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error} className={className}>
      {(control) => (
        <select ref={ref} className={`field-input ${selectClassName ?? ""}`.trim()} {...control} {...rest}>
          {placeholder !== undefined ? <option value="">{placeholder}</option> : null}
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </FieldFrame>
  );
});

type QuantityProps = Omit<InputHTMLAttributes<HTMLInputElement>, "id"> & {
  label: ReactNode;
  hint?: ReactNode;
  /** an error from the form or the server; it wins over the reading */
  error?: string;
  /** how the text typed so far reads */
  reading?: Reading;
  id?: string;
  /** data-testid of the message line */
  messageTestId?: string;
  className?: string;
  inputClassName?: string;
};

/**
 * A value typed with its unit ("4k7", "9.1 uA", "0,5 mA"): used by the lab builder, the submission form and
 * the lessons' calculators. Under it, as the value is typed: how it reads, or why it cannot be read.
 */
export const QuantityInput = forwardRef<HTMLInputElement, QuantityProps>(function QuantityInput(
  { label, hint, error, reading, id, messageTestId, className, inputClassName, ...rest },
  ref,
) {
  const generated = useId();
  const problem = error ?? (reading?.status === "error" ? reading.message : undefined);
  const note = reading?.status === "ok" ? `Read as ${reading.readAs}` : undefined;
  return (
    <FieldFrame id={id ?? generated} label={label} hint={hint} error={problem} note={note} messageTestId={messageTestId} className={className}>
      {(control) => (
        <input
          ref={ref}
          type="text"
          autoComplete="off"
          spellCheck={false}
          inputMode="text"
          className={`field-input ${inputClassName ?? ""}`}
          {...control}
          {...rest}
        />
      )}
    </FieldFrame>
  );
});

export function FormMessage({ message, tone = "error" }: { message?: string | null; tone?: "error" | "info" }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={message ? (tone === "error" ? "mb-4 rounded-md bg-verdict-wrong/10 p-3 text-sm text-verdict-wrong" : "mb-4 rounded-md bg-trace-pale p-3 text-sm text-trace") : ""}>
      {message ?? ""}
    </div>
  );
}
