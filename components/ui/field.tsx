// A labelled input with its error wired through aria-describedby, for every form in the app.
import type { InputHTMLAttributes } from "react";
import { forwardRef } from "react";

type Props = InputHTMLAttributes<HTMLInputElement> & { label: string; name: string; error?: string; hint?: string };

export const Field = forwardRef<HTMLInputElement, Props>(function Field({ label, name, error, hint, id, ...rest }, ref) {
  const inputId = id ?? `field-${name}`;
  const describedBy = [hint ? `${inputId}-hint` : null, error ? `${inputId}-error` : null].filter(Boolean).join(" ");
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
        aria-describedby={describedBy || undefined}
        className="field-input"
        {...rest}
      />
      {hint ? (
        <p id={`${inputId}-hint`} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      <p id={`${inputId}-error`} className="field-error" aria-live="polite">
        {error ?? ""}
      </p>
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
