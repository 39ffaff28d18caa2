"use client";
// The student's submission: one field per question that echoes how the value was read as they type,
// optional measured component values, optional files with upload progress, and one idempotency key per
// form so that a double click or a retry makes a single attempt.
//
// The page renders it on the server and hydrates it with react-hook-form alone: the checks (the attempt's
// zod schema and the units library) load when a field first takes the focus or the form is submitted
// (use-quantity-reader.ts). The attempt is sent with api() itself, not a react-query mutation: it is sent
// once and the page moves on, so nothing here is cached, and the lab page needs no query client.
import { useRouter } from "next/navigation";
import { useCallback, useRef, useState, type FormEvent } from "react";
import { useForm, useWatch, type Control, type Resolver, type UseFormRegisterReturn } from "react-hook-form";
import type { z } from "zod";
import { FieldMessage, FormMessage, QuantityInput } from "@/components/ui/field";
import { useHydrated } from "@/components/ui/use-hydrated";
import { api, isApiError } from "@/lib/http/client";
import type { AttemptInput, attemptInputSchema } from "@/lib/validation/attempts";
import { FileField } from "./file-field";
import { mapServerFields, measuredPayload, newIdempotencyKey, submitErrorMessage, toPayload, type FormMeasured, type FormQuestion } from "./read";
import type { SubmissionValues as FormValues } from "./read-quantities";
import { useQuantityReader, type QuantityReader } from "./use-quantity-reader";
import type { UploadedFile } from "./upload";

type FormOutput = z.output<typeof attemptInputSchema>;

function choiceLabel(choice: string): string {
  return choice.replace(/^u/, "µ");
}

/** A reading typed with its unit; under it, as it is typed, how the grader will read it. */
function ReadingInput({
  label,
  hint,
  unit,
  displayUnit,
  path,
  control,
  error,
  registration,
  reader,
}: {
  label: string;
  hint: string;
  unit: string;
  displayUnit: string;
  path: `readings.${string}` | `measured.${string}`;
  control: Control<FormValues, unknown, FormOutput>;
  error?: string;
  registration: UseFormRegisterReturn;
  /** null until the reader of quantities has loaded (the first focus in the form starts it) */
  reader: QuantityReader | null;
}) {
  const text = (useWatch({ control, name: path }) as string | undefined) ?? "";
  const echo = reader ? reader.echoReading(text, unit, displayUnit) : undefined;
  return <QuantityInput label={label} hint={hint} error={error} reading={echo} messageTestId={`echo-${path}`} inputClassName="max-w-xs" {...registration} />;
}

const UNIT_HINT: Record<string, string> = {
  A: "a current, e.g. 9.1 uA, 0.0091 mA or 9.1e-6 A",
  V: "a voltage, e.g. 12.4 mV",
  ohm: "a resistance, e.g. 4.7 kΩ, 4k7 or 0R1",
  "V/A": "a transresistance in V/A",
  F: "a capacitance, e.g. 100 nF",
  s: "a time, e.g. 4.6 ms or 10 h",
  Hz: "a frequency, e.g. 159 Hz",
  K: "a temperature, e.g. 300 K",
  C: "a charge, e.g. 200 uC or 220 mAh",
  W: "a power, e.g. 2.5 mW",
  "%": "a percentage, e.g. 1.5 %",
  "": "a plain number",
};

export function SubmissionForm({
  labId,
  questions,
  components,
  bench = "real",
}: {
  labId: string;
  questions: FormQuestion[];
  components: FormMeasured[];
  /** where the lab's readings are taken: "either" asks the student which bench they used */
  bench?: "real" | "simulated" | "either";
}) {
  const router = useRouter();
  const [idempotencyKey] = useState(() => newIdempotencyKey());
  const [message, setMessage] = useState<string | null>(null);
  const [fileErrors, setFileErrors] = useState<string | undefined>();
  const [image, setImage] = useState<UploadedFile | null>(null);
  const [trace, setTrace] = useState<UploadedFile | null>(null);
  const [simulated, setSimulated] = useState(false);
  const [busyUploads, setBusyUploads] = useState({ image: false, trace: false });
  const [sent, setSent] = useState(false);
  const inFlight = useRef(false);

  const { reader, load: loadReader, ready: readerReady } = useQuantityReader();
  // The shared schema and the reading checks, from the module loaded on first use (waited for here).
  const resolver = useCallback<Resolver<FormValues, unknown, FormOutput>>(
    async (values, context, options) => (await readerReady()).submissionResolver(questions, components)(values, context, options),
    [readerReady, questions, components],
  );

  const { register, handleSubmit, control, formState, setError, setValue, setFocus } = useForm<FormValues, unknown, FormOutput>({
    resolver,
    // No default text for the answers: each field's value is read from the page when it registers, so
    // what was typed before the form hydrated is kept rather than cleared.
    defaultValues: { idempotencyKey, readings: {}, measured: {}, uploadIds: [] },
    shouldFocusError: true,
  });

  function attach(which: "image" | "trace", upload: UploadedFile | null) {
    const next = { image, trace, [which]: upload };
    if (which === "image") setImage(upload);
    else setTrace(upload);
    setFileErrors(undefined);
    setValue("uploadIds", [next.image?.id, next.trace?.id].filter((x): x is string => Boolean(x)));
  }

  const uploading = busyUploads.image || busyUploads.trace;
  const errors = formState.errors;
  const readingError = (qid: string) => errors.readings?.[qid]?.message;
  const measuredError = (key: string) => errors.measured?.[key]?.message;

  const onSubmit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    try {
      await readerReady();
    } catch {
      setMessage("The form's checks could not be loaded. Check your connection and submit again: nothing you typed is lost.");
      return;
    }
    return handleSubmit(
      async (values) => {
        if (inFlight.current || uploading) return;
        inFlight.current = true;
        setMessage(null);
        const body: AttemptInput = {
          idempotencyKey,
          readings: toPayload(values.readings),
          measured: measuredPayload(values.measured ?? {}),
          uploadIds: [image?.id, trace?.id].filter((x): x is string => Boolean(x)),
          ...(bench === "either" ? { simulated } : {}),
        };
        try {
          const { attempt } = await api<{ attempt: { id: string } }>(`/api/labs/${labId}/attempts`, { method: "POST", body });
          setSent(true);
          router.push(`/attempts/${attempt.id}`);
          return;
        } catch (e) {
          inFlight.current = false;
          const status = isApiError(e) ? e.status : 0;
          const err = isApiError(e) ? e.detail : {};
          const mapped = mapServerFields(err.fields, { readings: questions.map((q) => q.id), measured: components.map((c) => c.key) });
          for (const f of mapped.fields) setError(f.path as `readings.${string}`, { type: "server", message: f.message });
          if (mapped.files.length) setFileErrors(mapped.files.join(" "));
          setMessage([submitErrorMessage(status, err), ...mapped.form.filter((m) => m !== err.message)].join(" "));
          if (mapped.fields[0]) setFocus(mapped.fields[0].path as `readings.${string}`);
        }
      },
      (invalid) => {
        const names: string[] = [];
        for (const q of questions) if (invalid.readings?.[q.id]) names.push(q.label);
        for (const c of components) if (invalid.measured?.[c.key]) names.push(`measured ${c.label.toLowerCase()}`);
        setMessage(names.length ? `Check ${names.length === 1 ? "this answer" : "these answers"} before submitting: ${names.join("; ")}.` : "Check the form before submitting.");
      },
    )();
  };

  const submitting = formState.isSubmitting || sent;
  // before hydration a click would send the form natively: a page load that sends nothing and clears what was typed
  const hydrated = useHydrated();

  return (
    <form onSubmit={onSubmit} onFocus={loadReader} noValidate aria-labelledby="submit-heading" data-testid="submission-form">
      <h2 id="submit-heading" className="text-xl">
        Your readings
      </h2>
      <p className="mt-1 mb-4 text-sm text-ink-soft">
        Type each value with its unit. Under each field you see how it will be read before you submit. Leave a field empty to skip that question.
      </p>
      <FormMessage message={message} />
      <input type="hidden" {...register("idempotencyKey")} />

      <fieldset className="card mb-4">
        <legend className="px-1 text-sm font-semibold">Answers</legend>
        {questions.map((q, i) => {
          const label = `${i + 1}. ${q.label}`;
          const pts = `${q.points} point${q.points === 1 ? "" : "s"}`;
          if (q.answerKind === "category") {
            const error = readingError(q.id);
            const selId = `reading-${q.id}`;
            return (
              <div className="mb-4" key={q.id}>
                <label htmlFor={selId} className="field-label">
                  {label}
                </label>
                <select
                  id={selId}
                  className="field-input max-w-xs"
                  aria-invalid={error ? true : undefined}
                  aria-describedby={`${selId}-hint ${selId}-error`}
                  {...register(`readings.${q.id}`)}
                >
                  <option value="">Choose…</option>
                  {(q.choices ?? []).map((c) => (
                    <option key={c} value={c}>
                      {choiceLabel(c)}
                    </option>
                  ))}
                </select>
                <p id={`${selId}-hint`} className="mt-1 text-xs text-ink-soft">
                  Pick one. {pts}.
                </p>
                <FieldMessage id={selId} error={error} />
              </div>
            );
          }
          return (
            <ReadingInput
              key={q.id}
              label={label}
              hint={`Answer with ${UNIT_HINT[q.unit] ?? `a value in ${q.displayUnit || q.unit}`}. ${pts}.`}
              unit={q.unit}
              displayUnit={q.displayUnit}
              path={`readings.${q.id}`}
              control={control}
              error={readingError(q.id)}
              registration={register(`readings.${q.id}`)}
              reader={reader}
            />
          );
        })}
      </fieldset>

      {components.length ? (
        <fieldset className="card mb-4">
          <legend className="px-1 text-sm font-semibold">Measured component values (optional)</legend>
          <p className="mb-3 text-sm text-ink-soft">
            If you measured your resistors with a meter, enter what you measured: your bench readings are then checked against the circuit you actually built.
          </p>
          {components.map((c) => (
            <ReadingInput
              key={c.key}
              label={`Measured ${c.label.toLowerCase()}`}
              hint={`Nominal value on your handout: ${c.shown}.`}
              unit={c.unit}
              displayUnit={c.displayUnit}
              path={`measured.${c.key}`}
              control={control}
              error={measuredError(c.key)}
              registration={register(`measured.${c.key}`)}
              reader={reader}
            />
          ))}
        </fieldset>
      ) : null}

      <fieldset className="card mb-4">
        <legend className="px-1 text-sm font-semibold">Files (optional)</legend>
        <FileField
          label="Scope capture"
          hint="A PNG or JPEG screenshot of your oscilloscope or meter."
          accept="image/png,image/jpeg,.png,.jpg,.jpeg"
          expectKind="image"
          labId={labId}
          onChange={(u) => attach("image", u)}
          onBusy={(b) => setBusyUploads((s) => ({ ...s, image: b }))}
          testId="file-image"
        />
        <FileField
          label="Logged current trace"
          hint="A CSV file with a time column and a current column (units in the header, e.g. time (ms), current (uA))."
          accept=".csv,text/csv"
          expectKind="trace"
          labId={labId}
          serverError={fileErrors}
          onChange={(u) => attach("trace", u)}
          onBusy={(b) => setBusyUploads((s) => ({ ...s, trace: b }))}
          testId="file-trace"
        />
        <p className="mt-2 text-xs text-ink-faint">
          Not sure of the format? Download a sample trace:{" "}
          <a href="/samples/duty-cycle-sensor-node.csv" download>a sensor node in ms and mA</a>, or{" "}
          <a href="/samples/duty-cycle-decimal-comma.csv" download>one with semicolons, decimal commas and a few broken rows</a>.
        </p>
      </fieldset>

      {bench === "either" ? (
        <label className="card mb-4 flex items-center gap-2 text-sm">
          <input type="checkbox" checked={simulated} onChange={(e) => setSimulated(e.target.checked)} data-testid="took-simulated" />
          I took these readings on the simulated bench
        </label>
      ) : bench === "simulated" ? (
        <p className="mb-4 text-sm text-ink-soft">This lab is taken on the simulated bench: your attempt is recorded as such.</p>
      ) : null}

      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn-primary" disabled={submitting || uploading || !hydrated} aria-describedby="submit-note">
          {submitting ? "Submitting…" : "Submit for grading"}
        </button>
        <p id="submit-note" className="text-sm text-ink-soft" aria-live="polite">
          {uploading ? "Wait for the upload to finish." : submitting ? "Grading your readings…" : "Each submission uses one attempt."}
        </p>
      </div>
    </form>
  );
}
