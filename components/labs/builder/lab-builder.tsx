"use client";
// The lab builder: one form for a new lab and for editing one. It checks the form with the same
// labInputSchema the API uses (through builderSchema), sends it as JSON to the route handlers and puts
// the API's field errors back under the fields they name. The form's sections are in sections.tsx; this
// file keeps what is not a field (status, messages, the grade-recompute question) and the saving.
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useRef, useState, useSyncExternalStore } from "react";
import { FormProvider, useForm, useWatch } from "react-hook-form";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";
import { toLocalInput } from "@/lib/dates";
import { templates, TEMPLATE_KEYS, type TemplateKey } from "@/lib/grader";
import type { LabInput } from "@/lib/validation/labs";
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
import { AboutSection, HandoutTextSection, ParametersSection, QuestionsSection, RulesSection } from "./sections";

export type { StoredLabInput };

// Values that exist only in the browser: read after hydration without an effect that sets state.
const subscribeNothing = () => () => {};
const browserTimeZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;

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

        <AboutSection template={template} attempts={attempts} onTemplateChange={onTemplateChange} />
        <ParametersSection template={template} />
        <QuestionsSection template={template} />
        <RulesSection timeZone={timeZone} />
        <HandoutTextSection />

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
