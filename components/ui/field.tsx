// Labelled inputs for every form in the app, so that all of them mark errors the same way: the input gets
// aria-invalid, and one live element under it (named by aria-describedby) says "✗ what is wrong" or, for a
// value typed with its unit, "✓ Read as …". FormMessage is the banner above a form.
import type { InputHTMLAttributes, ReactNode } from "react";
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

type Props = InputHTMLAttributes<HTMLInputElement> & { label: string; name: string; error?: string; hint?: string };

export const Field = forwardRef<HTMLInputElement, Props>(function Field({ label, name, error, hint, id, ...rest }, ref) {
  const inputId = id ?? `field-${name}`;
  return (
    <div className="mb-4">
      <label htmlFor={inputId} className="field-label">
        {label}
      </label>
      <input
        ref={ref}
        id={inputId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={fieldIds(inputId, hint).describedBy}
        className="field-input"
        {...rest}
      />
      <FieldHint id={inputId} hint={hint} />
      <FieldMessage id={inputId} error={error} />
    </div>
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
  const inputId = id ?? generated;
  const problem = error ?? (reading?.status === "error" ? reading.message : undefined);
  const note = reading?.status === "ok" ? `Read as ${reading.readAs}` : undefined;
  return (
    <div className={className ?? "mb-4"}>
      <label htmlFor={inputId} className="field-label">
        {label}
      </label>
      <input
        ref={ref}
        id={inputId}
        type="text"
        autoComplete="off"
        spellCheck={false}
        inputMode="text"
        className={`field-input ${inputClassName ?? ""}`}
        aria-invalid={problem ? true : undefined}
        aria-describedby={fieldIds(inputId, hint).describedBy}
        {...rest}
      />
      <FieldHint id={inputId} hint={hint} />
      <FieldMessage id={inputId} error={problem} note={note} testId={messageTestId} />
    </div>
  );
});

export function FormMessage({ message, tone = "error" }: { message?: string | null; tone?: "error" | "info" }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={message ? (tone === "error" ? "mb-4 rounded-md bg-verdict-wrong/10 p-3 text-sm text-verdict-wrong" : "mb-4 rounded-md bg-trace-pale p-3 text-sm text-trace") : ""}>
      {message ?? ""}
    </div>
  );
}
