"use client";
// The lab builder: one form for a new lab and for editing one. It checks the form with the same
// labInputSchema the API uses (through builderSchema), sends it as JSON to the route handlers and puts
// the API's field errors back under the fields they name.
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useRef, useState, useSyncExternalStore } from "react";

// Values that exist only in the browser: read after hydration without an effect that sets state.
const subscribeNothing = () => () => {};
const browserTimeZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;
import { FormProvider, get, useForm, useWatch } from "react-hook-form";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/api-client";
import { toLocalInput } from "@/lib/dates";
import { templates, TEMPLATE_KEYS, type TemplateKey } from "@/lib/grader";
import { CircuitDiagram } from "@/components/lesson/diagrams";
import type { LabInput } from "@/lib/validation/labs";
import { expectedWhenText } from "@/lib/labs/policy";
import { RegradeProgress } from "../regrade-progress";
import {
  builderSchema,
  changedFields,
  changesGrades,
  emptyForm,
  formToInput,
  inputToForm,
  mapServerErrors,
  templateDefaults,
  type BuilderForm,
  type KeptPolicy,
  type StoredLabInput,
} from "./form-model";

export type { StoredLabInput };
import { SelectInput, TextInput } from "./inputs";
import { ParameterFields } from "./parameter-fields";
import { QuestionFields } from "./question-fields";


export interface LabBuilderProps {
  courseId: string;
  /** absent for a new lab */
  lab?: { id: string; status: "draft" | "published"; attemptCount: number; input: StoredLabInput };
  /** a message to show once, e.g. after a new lab was created */
  notice?: string;
  /** a new lab's late policy, from the course settings */
  latePolicy?: { latePenaltyPercentPerDay: number; lateFloorPercent: number };
}

type Intent = "draft" | "preview" | "publish";
type Saved = { lab: { id: string }; regrade?: { id: string; total: number } | null };

function withoutDates(input: StoredLabInput): StoredLabInput {
  return { ...input, opensAt: null, dueAt: null };
}

export function LabBuilder({ courseId, lab, notice, latePolicy }: LabBuilderProps) {
  const router = useRouter();
  const kept: KeptPolicy = useMemo(
    () => ({ closeMultiple: lab?.input.policy.closeMultiple, componentTolerances: lab?.input.policy.componentTolerances }),
    [lab],
  );
  const schema = useMemo(() => builderSchema(kept), [kept]);
  // Dates are shown in the browser's time zone, so they are filled in after hydration (the server may be elsewhere).
  const defaults = useMemo(() => (lab ? inputToForm(withoutDates(lab.input)) : emptyForm("shunt-burden", latePolicy)), [lab, latePolicy]);
  const methods = useForm<BuilderForm, unknown, LabInput>({ resolver: zodResolver(schema), defaultValues: defaults, mode: "onSubmit", reValidateMode: "onChange" });
  const { handleSubmit, setValue, setError, reset, getValues, formState, clearErrors } = methods;
  const timeZone = useSyncExternalStore(subscribeNothing, browserTimeZone, () => "");
  const [status, setStatus] = useState(lab?.status ?? "draft");
  const [message, setMessage] = useState<{ tone: "error" | "info"; text: string } | null>(notice ? { tone: "info", text: notice } : null);
  const [confirm, setConfirm] = useState<{ input: LabInput; intent: Intent } | null>(null);
  const [regrade, setRegrade] = useState<{ id: string; total: number } | null>(null);
  const [busy, setBusy] = useState(false);
  // Until the form is hydrated a click would submit it natively (a page reload), so the buttons wait.
  const hydrated = useSyncExternalStore(subscribeNothing, () => true, () => false);
  const intent = useRef<Intent>("draft");
  // What was last saved, as the form would send it: only fields that differ from it are PATCHed.
  const baseline = useRef<LabInput | null>(null);
  const confirmRef = useRef<HTMLDivElement>(null);
  const messageRef = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (lab) {
      setValue("opensAt", toLocalInput(lab.input.opensAt));
      setValue("dueAt", toLocalInput(lab.input.dueAt));
      baseline.current = formToInput(inputToForm(lab.input), kept).input;
    }
  }, [lab, kept, setValue]);

  useEffect(() => {
    if (confirm) confirmRef.current?.focus();
  }, [confirm]);

  const templateKey = useWatch({ control: methods.control, name: "templateKey" });
  const template = templates[templateKey] ?? templates["shunt-burden"];
  const attempts = lab?.attemptCount ?? 0;
  const specError = (get(formState.errors, "root.spec") as { message?: string } | undefined)?.message;

  function say(tone: "error" | "info", text: string) {
    setMessage({ tone, text });
    requestAnimationFrame(() => messageRef.current?.focus());
  }

  function onTemplateChange(key: string) {
    if (!(TEMPLATE_KEYS as string[]).includes(key)) return;
    const d = templateDefaults(key as TemplateKey);
    setValue("parameters", d.parameters, { shouldDirty: true });
    setValue("questions", d.questions, { shouldDirty: true });
    clearErrors();
  }

  /** One request of a save; a refusal puts the API's field errors under their fields and says why. */
  async function send<T>(url: string, method: "POST" | "PATCH", body: unknown): Promise<{ ok: true; data: T } | { ok: false }> {
    try {
      return { ok: true, data: await api<T>(url, { method, body }) };
    } catch (e) {
      if (!isApiError(e) || e.status === 0) {
        say("error", "The server could not be reached. Nothing was saved; try again.");
        return { ok: false };
      }
      const mapped = mapServerErrors(e.fields);
      let first = true;
      for (const [path, text] of Object.entries(mapped)) {
        setError(path as never, { type: "server", message: text }, { shouldFocus: first && !path.startsWith("root.") });
        first = false;
      }
      say("error", e.serverMessage ?? `The lab could not be saved (HTTP ${e.status}).`);
      return { ok: false };
    }
  }

  async function save(input: LabInput, how: Intent) {
    setBusy(true);
    setMessage(null);
    try {
      if (!lab) {
        const created = await send<Saved>(`/api/courses/${courseId}/labs`, "POST", input);
        if (!created.ok) return;
        const id = created.data.lab.id;
        if (how === "publish") {
          const published = await send<Saved>(`/api/labs/${id}`, "PATCH", { status: "published" });
          if (!published.ok) {
            router.push(`/labs/${id}/edit?notice=draft-saved`);
            return;
          }
          router.push(`/courses/${courseId}/labs?notice=published`);
          return;
        }
        router.push(how === "preview" ? `/labs/${id}/preview` : `/labs/${id}/edit?notice=created`);
        return;
      }
      const before = baseline.current ?? formToInput(inputToForm(lab.input), kept).input;
      const changed: Record<string, unknown> = { ...changedFields(before, input) };
      if (how === "publish" && status === "draft") changed.status = "published";
      // The PATCH schema has no defaults: a field left out stays as it is, so only what changed is sent.
      const patch = changed;
      if (Object.keys(patch).length > 0) {
        const saved = await send<Saved>(`/api/labs/${lab.id}`, "PATCH", patch);
        if (!saved.ok) return;
        baseline.current = input;
        reset(getValues(), { keepValues: true });
        if (patch.status === "published") setStatus("published");
        const r = saved.data.regrade;
        if (r) {
          setRegrade(r);
          say("info", `Saved. The grades of ${r.total} attempt${r.total === 1 ? " are" : "s are"} being recomputed.`);
          return;
        }
      }
      if (how === "preview") {
        router.push(`/labs/${lab.id}/preview`);
        return;
      }
      if (how === "publish") {
        router.push(`/courses/${courseId}/labs?notice=published`);
        return;
      }
      say("info", Object.keys(changed).length ? `Saved at ${new Date().toLocaleTimeString([], { hour: "2-digit", minute: "2-digit" })}.` : "Nothing has changed since the last save.");
      router.refresh();
    } finally {
      setBusy(false);
    }
  }

  const onValid = async (input: LabInput) => {
    const how = intent.current;
    if (lab && status === "published" && attempts > 0) {
      const before = baseline.current ?? formToInput(inputToForm(lab.input), kept).input;
      if (changesGrades(changedFields(before, input))) {
        setConfirm({ input, intent: how });
        return;
      }
    }
    await save(input, how);
  };

  const onInvalid = () => {
    say("error", "Some fields need attention; each one says what to change.");
  };

  const submitLabel = lab ? (status === "published" ? "Save changes" : "Save draft") : "Save draft";

  return (
    <FormProvider {...methods}>
      <form noValidate data-ready={hydrated ? "true" : undefined} onSubmit={(e) => void handleSubmit(onValid, onInvalid)(e)} aria-label={lab ? "Edit the lab" : "New lab"} className="grid gap-6">
        <div ref={messageRef} tabIndex={-1} className="outline-none">
          <FormMessage tone={message?.tone} message={message ? (message.tone === "error" ? `Not saved: ${message.text}` : message.text) : null} />
          {formState.errors.root?.server?.message ? <p className="field-error">{formState.errors.root.server.message}</p> : null}
        </div>

        {regrade && lab ? <RegradeProgress labId={lab.id} regradeId={regrade.id} total={regrade.total} /> : null}

        {lab && status === "published" && attempts > 0 ? (
          <p className="caution-box m-0" role="note">
            <strong>Published, with {attempts} attempt{attempts === 1 ? "" : "s"}.</strong> Changing the circuit values, questions,
            tolerances or late rules recomputes the grades of every attempt (you are asked first). Titles, dates, attempts allowed,
            instructions and safety notes change without a regrade.
          </p>
        ) : null}

        <section className="card" aria-labelledby="sec-about">
          <h2 id="sec-about" className="text-lg">
            The lab
          </h2>
          <TextInput name="title" label="Title" />
          {attempts > 0 ? (
            <p className="mb-2 text-sm">
              <span className="font-medium">Circuit template:</span> {template.title}. Students have submitted attempts, so the template can
              no longer change.
            </p>
          ) : (
            <SelectInput
              name="templateKey"
              label="Circuit template"
              options={TEMPLATE_KEYS.map((k) => ({ value: k, label: templates[k].title }))}
              onChangeValue={onTemplateChange}
              hint="Changing the template resets the parameters and questions to its defaults."
            />
          )}
          <p className="text-sm text-ink-soft">{template.summary}</p>
          <CircuitDiagram template={template.key} idPrefix="builder" className="mb-0" />
        </section>

        <section className="card" aria-labelledby="sec-params">
          <h2 id="sec-params" className="text-lg">
            Circuit values
          </h2>
          <p className="mb-3 text-sm text-ink-soft">
            Each student gets their own values, drawn once from these settings and kept. Type every value with its unit (for example 4.7 kΩ,
            1.8 V, 20 mA).
          </p>
          <p id="lab-spec-error" className="field-error" aria-live="polite">
            {specError ? `Check: ${specError}` : ""}
          </p>
          <div className="grid gap-4">
            {template.parameters.map((p) => (
              <ParameterFields key={`${template.key}:${p.key}`} p={p} />
            ))}
          </div>
        </section>

        <section className="card" aria-labelledby="sec-questions">
          <h2 id="sec-questions" className="text-lg">
            Questions
          </h2>
          <QuestionFields templateKey={template.key} />
          <div className="mt-4 grid gap-x-4 sm:grid-cols-3">
            <TextInput name="defaultTolerancePercent" label="Default tolerance (%)" inputMode="decimal" hint="Accepted band around the expected value, unless the circuit's own tolerances give a wider one." />
            <TextInput name="closeCreditPercent" label="Credit for a close answer (%)" inputMode="decimal" hint="Just outside the band: this share of the points." />
            <TextInput name="instrumentAccuracyPercent" label="Instrument accuracy (% of reading, optional)" inputMode="decimal" hint="Widens the band of bench readings." />
          </div>
        </section>

        <section className="card" aria-labelledby="sec-rules">
          <h2 id="sec-rules" className="text-lg">
            Attempts, dates and feedback
          </h2>
          <div className="grid gap-x-4 sm:grid-cols-2">
            <TextInput name="attemptsAllowed" label="Attempts allowed" inputMode="numeric" />
            <SelectInput
              name="counting"
              label="Attempt that counts"
              options={[
                { value: "best", label: "The best attempt" },
                { value: "last", label: "The last attempt" },
              ]}
            />
            <TextInput name="opensAt" label="Opens" type="datetime-local" hint={`Leave empty to open at once.${timeZone ? ` Times are in ${timeZone}.` : ""}`} />
            <TextInput name="dueAt" label="Due" type="datetime-local" hint={`Leave empty for no due date.${timeZone ? ` Times are in ${timeZone}.` : ""}`} />
            <TextInput name="latePenaltyPercentPerDay" label="Late penalty (% per day)" inputMode="decimal" hint="Each day or part of a day after the due date." />
            <TextInput name="lateFloorPercent" label="Late floor (%)" inputMode="decimal" hint="A late attempt always keeps at least this share of its score." />
            <TextInput
              name="closesAt"
              label="Closes (late attempts accepted until)"
              type="datetime-local"
              className="sm:col-span-2"
              hint={`Leave empty to close when the late penalty reaches its floor (the due date plus (100 − floor) ÷ penalty days; at the due date without a penalty).${timeZone ? ` Times are in ${timeZone}.` : ""}`}
            />
            <SelectInput
              name="showExpected"
              label="Expected values shown to students"
              className="mb-4 sm:col-span-2"
              options={[
                { value: "after_attempt", label: "After each attempt" },
                { value: "after_due", label: "After the due date" },
                { value: "never", label: "Never" },
              ]}
            />
            <ExpectedWhen />
          </div>
        </section>

        <section className="card" aria-labelledby="sec-text">
          <h2 id="sec-text" className="text-lg">
            Handout text
          </h2>
          <TextInput
            name="instructions"
            label="Instructions (Markdown)"
            multiline={10}
            hint="Paragraphs, lists (- or 1.), **bold**, *italic*, `code` and # headings are shown on the handout."
          />
          <TextInput name="safetyNotes" label="Safety notes" multiline={4} hint="Shown in a caution box on the handout, with a reminder to follow your institution's lab rules." />
        </section>

        {confirm ? (
          <div ref={confirmRef} tabIndex={-1} role="alertdialog" aria-labelledby="confirm-title" aria-describedby="confirm-text" className="caution-box m-0 outline-none">
            <h2 id="confirm-title" className="text-lg">
              Recompute grades?
            </h2>
            <p id="confirm-text" className="mt-1">
              This lab is published and students have submitted. If you save, the grades of {attempts} attempt{attempts === 1 ? "" : "s"} will be
              recomputed with the new settings. Late penalties already applied are kept.
            </p>
            <div className="mt-3 flex flex-wrap gap-3">
              <button
                type="button"
                className="btn-primary"
                disabled={busy}
                onClick={() => {
                  const c = confirm;
                  setConfirm(null);
                  void save(c.input, c.intent);
                }}
              >
                Save and recompute {attempts} attempt{attempts === 1 ? "" : "s"}
              </button>
              <button type="button" className="btn-quiet" onClick={() => setConfirm(null)}>
                Cancel
              </button>
            </div>
          </div>
        ) : null}

        <div className="flex flex-wrap items-center gap-3">
          <button type="submit" className="btn-quiet" disabled={busy || !hydrated} onClick={() => (intent.current = "draft")}>
            {submitLabel}
          </button>
          <button type="submit" className="btn-quiet" disabled={busy || !hydrated} onClick={() => (intent.current = "preview")}>
            Save and preview
          </button>
          {status === "draft" ? (
            <button type="submit" className="btn-primary" disabled={busy || !hydrated} onClick={() => (intent.current = "publish")}>
              Publish
            </button>
          ) : null}
          <span className="text-sm text-ink-soft">{status === "published" ? "Status: published (students see it)." : "Status: draft (students do not see it)."}</span>
          {lab ? (
            <Link className="ml-auto text-sm" href={`/labs/${lab.id}/preview`}>
              Preview the last saved version
            </Link>
          ) : null}
        </div>
      </form>
    </FormProvider>
  );
}

/** Explains, from the form as it stands, when students will see expected values (lib/labs/policy.ts's rule). */
function ExpectedWhen() {
  const [showExpected, attemptsAllowed, dueAt, closesAt, perDay, floor] = useWatch<BuilderForm, ["showExpected", "attemptsAllowed", "dueAt", "closesAt", "latePenaltyPercentPerDay", "lateFloorPercent"]>({
    name: ["showExpected", "attemptsAllowed", "dueAt", "closesAt", "latePenaltyPercentPerDay", "lateFloorPercent"],
  });
  const date = (t: string) => (t && !Number.isNaN(new Date(t).getTime()) ? new Date(t) : null);
  const text = expectedWhenText(
    {
      showExpected,
      attemptsAllowed: Number(attemptsAllowed) || 1,
      dueAt: date(dueAt),
      closesAt: date(closesAt),
      latePenaltyPercentPerDay: Number(perDay) || 0,
      lateFloorPercent: Number(floor) || 0,
    },
    (d) => new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" }).format(d),
  );
  return (
    <p className="mb-4 text-sm text-ink-soft sm:col-span-2" data-testid="expected-when" aria-live="polite">
      {text} Course staff always see them.
    </p>
  );
}
