"use client";
// The lab builder's sections, top to bottom: the lab and its circuit template, the circuit values, the
// questions and how answers are marked, attempts/dates/feedback, and the handout text. Each reads and
// writes the builder's react-hook-form state through the form context; lab-builder.tsx holds the state
// that is not a field (status, messages, the regrade) and the saving.
import { get, useFormState, useWatch } from "react-hook-form";
import { CircuitDiagram } from "@/components/lesson/diagrams";
import { templates, TEMPLATE_KEYS, type Template } from "@/lib/grader";
import { expectedWhenText } from "@/lib/labs/policy";
import type { BuilderForm } from "./form-model";
import { SelectInput, TextInput } from "./inputs";
import { ParameterFields } from "./parameter-fields";
import { QuestionFields } from "./question-fields";

/** The title and the circuit template (fixed once students have submitted). */
export function AboutSection({ template, attempts, onTemplateChange }: { template: Template; attempts: number; onTemplateChange: (key: string) => void }) {
  return (
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
  );
}

/** The settings each student's own circuit values are drawn from. */
export function ParametersSection({ template }: { template: Template }) {
  const { errors } = useFormState<BuilderForm>();
  const specError = (get(errors, "root.spec") as { message?: string } | undefined)?.message;
  return (
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
  );
}

/** The questions and the bands that mark their answers. */
export function QuestionsSection({ template }: { template: Template }) {
  return (
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
  );
}

/** Attempts allowed, which counts, the dates (in the browser's time zone) and when expected values show. */
export function RulesSection({ timeZone }: { timeZone: string }) {
  return (
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
        <SelectInput
          name="bench"
          label="Where students take their readings"
          className="mb-4 sm:col-span-2"
          hint="The simulated bench runs the course's instrument on each student's own circuit in the browser; staff can replay every reading."
          options={[
            { value: "real", label: "On the real bench" },
            { value: "simulated", label: "On the simulated bench" },
            { value: "either", label: "Either: each student says which" },
          ]}
        />
      </div>
    </section>
  );
}

/** The handout's instructions and safety notes. */
export function HandoutTextSection() {
  return (
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
