// The lab builder's form state and its conversion to and from the API's body (labInputSchema input).
// Every value with a unit is kept as the text the instructor typed ("4.7 kΩ", "1.8 V") and read with the
// grader's parseQuantity when the form is checked, so the builder reads units exactly as the grader does.
// Pure: no React, no server code; the client form and the unit tests share it.
import { z } from "zod";
import {
  defaultVariantSpec,
  formatQuantity,
  parseQuantity,
  templates,
  TEMPLATE_KEYS,
  type ParameterDraw,
  type ParameterSpec,
  type TemplateKey,
  type VariantSpec,
} from "@/lib/grader";
import { fromLocalInput, toLocalInput } from "@/lib/dates";
import { labInputSchema, type LabInput } from "@/lib/validation/labs";

export type DrawMode = "fixed" | "range" | "list";

export interface DrawForm {
  mode: DrawMode;
  /** fixed: the value with its unit, or the chosen option of a category */
  value: string;
  min: string;
  max: string;
  /** optional step of a range */
  step: string;
  /** list: values with units separated by semicolons or new lines; for a category, the chosen options joined by ";" */
  values: string;
  /** resistors only: "" or a series name */
  series: string;
  /** resistors only: percent, "" when not given */
  tolerancePercent: string;
}

export interface QuestionForm {
  id?: string;
  quantity: string;
  kind: "prediction" | "bench";
  points: string;
  /** "" uses the lab's default tolerance */
  tolerancePercent: string;
}

export interface BuilderForm {
  title: string;
  templateKey: TemplateKey;
  parameters: Record<string, DrawForm>;
  questions: QuestionForm[];
  /** policy.relativeTolerance × 100 */
  defaultTolerancePercent: string;
  /** policy.closeCredit × 100 */
  closeCreditPercent: string;
  /** policy.instrumentAccuracyPercent, "" when not given */
  instrumentAccuracyPercent: string;
  attemptsAllowed: string;
  counting: "best" | "last";
  /** datetime-local text ("2026-12-10T09:00") in the browser's time zone, or "" */
  opensAt: string;
  dueAt: string;
  /** late attempts accepted until then; "" for the default close */
  closesAt: string;
  latePenaltyPercentPerDay: string;
  lateFloorPercent: string;
  showExpected: "after_attempt" | "after_due" | "never";
  instructions: string;
  safetyNotes: string;
}

/** The parts of a lab the builder does not show but must keep (componentTolerances, closeMultiple). */
export interface KeptPolicy {
  closeMultiple?: number;
  componentTolerances?: Record<string, number>;
}

// ---------------------------------------------------------------------------------------------------
// Values as text

/** A value as text that reads back exactly ("4.7 kΩ", "1.8 V", "792 mAh", "0.8"). */
export function valueText(value: number | string, p: Pick<ParameterSpec, "unit" | "displayUnit" | "kind">): string {
  if (typeof value === "string") return value;
  if (p.kind === "integer" || p.unit === "") return String(value);
  // Non-prefix display units (mAh, h, °C) are kept; SI-prefixed ones are chosen to suit the value.
  const keepDisplay = ["mAh", "Ah", "h", "d", "min", "°C"].includes(p.displayUnit);
  return formatQuantity(value, p.unit, { digits: 12, trim: true, displayUnit: keepDisplay ? p.displayUnit : undefined });
}

/** How a value is shown back to the instructor: "4.7 kΩ". */
export function readAsText(value: number, p: Pick<ParameterSpec, "unit" | "displayUnit" | "kind">): string {
  if (p.kind === "integer" || p.unit === "") return String(Number(value.toPrecision(12)));
  const keepDisplay = ["mAh", "Ah", "h", "d", "min", "°C"].includes(p.displayUnit);
  return formatQuantity(value, p.unit, { digits: 6, trim: true, displayUnit: keepDisplay ? p.displayUnit : undefined });
}

export type ReadResult = { ok: true; value: number } | { ok: false; message: string };

/** Reads one typed value for a parameter, as the grader reads units; integers must be whole. */
export function readValue(text: string, p: Pick<ParameterSpec, "unit" | "kind" | "label">): ReadResult {
  const r = parseQuantity(text, p.unit);
  if (!r.ok) return { ok: false, message: r.reason === "empty" ? "Enter a value." : r.message };
  if (p.kind === "integer" && !Number.isInteger(r.value)) return { ok: false, message: "Enter a whole number." };
  return { ok: true, value: r.value };
}

/** Splits a list typed as "1 kΩ; 2.2 kΩ" or one value per line. Commas are left alone: "9,1 mA" is a decimal comma. */
export function splitList(text: string): string[] {
  return text
    .split(/[;\n]/)
    .map((s) => s.trim())
    .filter((s) => s !== "");
}

/** A percent typed as "1", "1 %" or "0,5". NaN when it is not a number. */
export function readPercent(text: string): number {
  const t = text.trim().replace(/\s*%$/, "").replace(",", ".");
  if (t === "") return NaN;
  return Number(t);
}

function readNumber(text: string): number {
  const t = text.trim().replace(",", ".");
  return t === "" ? NaN : Number(t);
}

// ---------------------------------------------------------------------------------------------------
// Defaults and conversion from stored labs

export function drawToForm(p: ParameterSpec, d: ParameterDraw | undefined): DrawForm {
  const base: DrawForm = {
    mode: "fixed",
    value: valueText(p.default, p),
    min: "",
    max: "",
    step: "",
    values: "",
    series: p.kind === "resistor" ? (d?.series ?? "E24") : "",
    tolerancePercent: d?.tolerancePercent !== undefined ? String(d.tolerancePercent) : "",
  };
  if (p.suggestedRange) {
    base.min = valueText(p.suggestedRange[0], p);
    base.max = valueText(p.suggestedRange[1], p);
  }
  if (!d) return base;
  if (d.mode === "fixed") return { ...base, mode: "fixed", value: valueText(d.value, p) };
  if (d.mode === "range") {
    return { ...base, mode: "range", min: valueText(d.min, p), max: valueText(d.max, p), step: d.step !== undefined ? valueText(d.step, p) : "" };
  }
  return { ...base, mode: "list", values: d.values.map((v) => valueText(v, p)).join("; ") };
}

export function specToForm(spec: VariantSpec): Record<string, DrawForm> {
  const t = templates[spec.template];
  const out: Record<string, DrawForm> = {};
  for (const p of t.parameters) out[p.key] = drawToForm(p, spec.parameters[p.key]);
  return out;
}

/** The questions a new lab starts with: every quantity of the template, as a prediction worth 1 point. */
export function defaultQuestions(templateKey: TemplateKey): QuestionForm[] {
  return templates[templateKey].quantities.map((q) => ({ quantity: q.key, kind: "prediction", points: "1", tolerancePercent: "" }));
}

/** Everything a template change resets: the parameters and questions. */
export function templateDefaults(templateKey: TemplateKey): Pick<BuilderForm, "templateKey" | "parameters" | "questions"> {
  return { templateKey, parameters: specToForm(defaultVariantSpec(templateKey)), questions: defaultQuestions(templateKey) };
}

/** A new lab's form; the late policy starts from the course's default when one is given. */
export function emptyForm(templateKey: TemplateKey = "shunt-burden", latePolicy?: { latePenaltyPercentPerDay: number; lateFloorPercent: number }): BuilderForm {
  return {
    title: "",
    ...templateDefaults(templateKey),
    defaultTolerancePercent: "1",
    closeCreditPercent: "50",
    instrumentAccuracyPercent: "",
    attemptsAllowed: "3",
    counting: "best",
    opensAt: "",
    dueAt: "",
    closesAt: "",
    latePenaltyPercentPerDay: String(latePolicy?.latePenaltyPercentPerDay ?? 10),
    lateFloorPercent: String(latePolicy?.lateFloorPercent ?? 50),
    showExpected: "after_attempt",
    instructions: "",
    safetyNotes: "",
  };
}

/** A stored lab as the builder receives it (labAsInput's shape, dates as ISO strings). */
export interface StoredLabInput {
  title: string;
  templateKey: TemplateKey;
  spec: VariantSpec;
  questions: { id?: string; quantity: string; kind: "prediction" | "bench"; points: number; tolerancePercent?: number }[];
  policy: { relativeTolerance?: number; closeCredit?: number; instrumentAccuracyPercent?: number } & KeptPolicy;
  attemptsAllowed: number;
  counting: "best" | "last";
  opensAt: string | null;
  dueAt: string | null;
  closesAt?: string | null;
  latePenaltyPercentPerDay: number;
  lateFloorPercent: number;
  showExpected: "after_attempt" | "after_due" | "never";
  instructions: string;
  safetyNotes: string;
}

/** A stored lab (labAsInput's shape) as form state. Dates are converted with toLocalInput where this runs. */
export function inputToForm(input: StoredLabInput): BuilderForm {
  const policy = input.policy ?? {};
  return {
    title: input.title,
    templateKey: input.templateKey,
    parameters: specToForm(input.spec),
    questions: input.questions.map((q) => ({
      ...(q.id ? { id: q.id } : {}),
      quantity: q.quantity,
      kind: q.kind,
      points: String(q.points),
      tolerancePercent: q.tolerancePercent !== undefined ? String(q.tolerancePercent) : "",
    })),
    defaultTolerancePercent: String(Number(((policy.relativeTolerance ?? 0.01) * 100).toPrecision(12))),
    closeCreditPercent: String(Number(((policy.closeCredit ?? 0.5) * 100).toPrecision(12))),
    instrumentAccuracyPercent: policy.instrumentAccuracyPercent !== undefined ? String(policy.instrumentAccuracyPercent) : "",
    attemptsAllowed: String(input.attemptsAllowed),
    counting: input.counting,
    opensAt: toLocalInput(input.opensAt),
    dueAt: toLocalInput(input.dueAt),
    closesAt: toLocalInput(input.closesAt ?? null),
    latePenaltyPercentPerDay: String(input.latePenaltyPercentPerDay),
    lateFloorPercent: String(input.lateFloorPercent),
    showExpected: input.showExpected,
    instructions: input.instructions ?? "",
    safetyNotes: input.safetyNotes ?? "",
  };
}

// ---------------------------------------------------------------------------------------------------
// Conversion to the API body

export type FormErrors = Record<string, string>;

function drawFromForm(p: ParameterSpec, f: DrawForm, errors: FormErrors): ParameterDraw | undefined {
  const at = `parameters.${p.key}`;
  const extra: { series?: ParameterDraw["series"]; tolerancePercent?: number } = {};
  if (p.kind === "resistor") {
    if (f.series) extra.series = f.series as ParameterDraw["series"];
    if (f.tolerancePercent.trim() !== "") {
      const tol = readPercent(f.tolerancePercent);
      if (!Number.isFinite(tol) || tol < 0 || tol > 50) errors[`${at}.tolerancePercent`] = "Enter a tolerance from 0 to 50 %.";
      else extra.tolerancePercent = tol;
    }
  }
  if (p.kind === "category") {
    const choices = p.choices ?? [];
    if (f.mode === "list") {
      const picked = splitList(f.values).filter((v) => choices.includes(v));
      if (picked.length === 0) {
        errors[`${at}.values`] = "Pick at least one option.";
        return undefined;
      }
      return { mode: "list", values: picked };
    }
    if (!choices.includes(f.value)) {
      errors[`${at}.value`] = "Pick one of the options.";
      return undefined;
    }
    return { mode: "fixed", value: f.value };
  }
  const read = (text: string, field: string): number | undefined => {
    const r = readValue(text, p);
    if (!r.ok) {
      errors[`${at}.${field}`] = r.message;
      return undefined;
    }
    return r.value;
  };
  const outside = (v: number) => (p.min !== undefined && v < p.min) || (p.max !== undefined && v > p.max);
  const bounds = () => `Keep it between ${readAsText(p.min ?? -Infinity, p)} and ${readAsText(p.max ?? Infinity, p)}.`;
  if (f.mode === "fixed") {
    const v = read(f.value, "value");
    if (v === undefined) return undefined;
    if (outside(v)) {
      errors[`${at}.value`] = bounds();
      return undefined;
    }
    return { mode: "fixed", value: v, ...extra };
  }
  if (f.mode === "range") {
    const min = read(f.min, "min");
    const max = read(f.max, "max");
    let step: number | undefined;
    if (f.step.trim() !== "") {
      step = read(f.step, "step");
      if (step !== undefined && !(step > 0)) {
        errors[`${at}.step`] = "The step must be greater than zero.";
        return undefined;
      }
      if (step === undefined) return undefined;
    }
    if (min === undefined || max === undefined) return undefined;
    if (outside(min)) errors[`${at}.min`] = bounds();
    if (outside(max)) errors[`${at}.max`] = bounds();
    if (min > max) errors[`${at}.max`] = "The largest value must not be below the smallest.";
    if (errors[`${at}.min`] || errors[`${at}.max`]) return undefined;
    return { mode: "range", min, max, ...(step !== undefined ? { step } : {}), ...extra };
  }
  const texts = splitList(f.values);
  if (texts.length === 0) {
    errors[`${at}.values`] = "Enter at least one value, separated by semicolons.";
    return undefined;
  }
  const values: number[] = [];
  for (const t of texts) {
    const r = readValue(t, p);
    if (!r.ok) {
      errors[`${at}.values`] = `"${t}": ${r.message}`;
      return undefined;
    }
    if (outside(r.value)) {
      errors[`${at}.values`] = `"${t}": ${bounds()}`;
      return undefined;
    }
    values.push(r.value);
  }
  return { mode: "list", values, ...extra };
}

/**
 * Converts the form into the API body. Values that cannot be read are reported under their form path
 * ("parameters.loadResistance.min") and the body is then incomplete; check `errors` first.
 */
export function formToInput(form: BuilderForm, kept: KeptPolicy = {}): { input: LabInput; errors: FormErrors } {
  const errors: FormErrors = {};
  const t = templates[form.templateKey];
  const parameters: Record<string, ParameterDraw> = {};
  if (t) {
    for (const p of t.parameters) {
      const f = form.parameters[p.key];
      if (!f) continue;
      const d = drawFromForm(p, f, errors);
      if (d) parameters[p.key] = d;
    }
  }
  const questions = form.questions.map((q, i) => {
    const points = readNumber(q.points);
    const tol = q.tolerancePercent.trim() === "" ? undefined : readPercent(q.tolerancePercent);
    if (tol !== undefined && !(tol > 0)) errors[`questions.${i}.tolerancePercent`] = "Enter a tolerance above 0 %, or leave it empty.";
    if (!Number.isFinite(points) || points < 0) errors[`questions.${i}.points`] = "Enter 0 or more points.";
    return { ...(q.id ? { id: q.id } : {}), quantity: q.quantity, kind: q.kind, points, ...(tol !== undefined && tol > 0 ? { tolerancePercent: tol } : {}) };
  });
  const relTol = readPercent(form.defaultTolerancePercent);
  if (!(relTol > 0) || relTol > 100) errors.defaultTolerancePercent = "Enter a tolerance above 0 % and at most 100 %.";
  const closeCredit = readPercent(form.closeCreditPercent);
  if (!(closeCredit >= 0 && closeCredit <= 100)) errors.closeCreditPercent = "Enter a percentage from 0 to 100.";
  const accuracy = form.instrumentAccuracyPercent.trim() === "" ? undefined : readPercent(form.instrumentAccuracyPercent);
  if (accuracy !== undefined && !(accuracy >= 0)) errors.instrumentAccuracyPercent = "Enter 0 % or more, or leave it empty.";

  const input: LabInput = {
    title: form.title,
    templateKey: form.templateKey,
    spec: { template: form.templateKey, parameters },
    questions,
    policy: {
      ...(kept.closeMultiple !== undefined ? { closeMultiple: kept.closeMultiple } : {}),
      ...(kept.componentTolerances ? { componentTolerances: kept.componentTolerances } : {}),
      relativeTolerance: relTol / 100,
      closeCredit: closeCredit / 100,
      ...(accuracy !== undefined && accuracy >= 0 ? { instrumentAccuracyPercent: accuracy } : {}),
    },
    attemptsAllowed: readNumber(form.attemptsAllowed),
    counting: form.counting,
    opensAt: fromLocalInput(form.opensAt),
    dueAt: fromLocalInput(form.dueAt),
    closesAt: fromLocalInput(form.closesAt),
    latePenaltyPercentPerDay: readNumber(form.latePenaltyPercentPerDay),
    lateFloorPercent: readNumber(form.lateFloorPercent),
    showExpected: form.showExpected,
    instructions: form.instructions,
    safetyNotes: form.safetyNotes,
  };
  return { input, errors };
}

// ---------------------------------------------------------------------------------------------------
// Error paths: the API's (labInputSchema's) dotted paths → the form's field names

const POLICY_PATHS: Record<string, string> = {
  relativeTolerance: "defaultTolerancePercent",
  closeCredit: "closeCreditPercent",
  instrumentAccuracyPercent: "instrumentAccuracyPercent",
};
const TOP_FIELDS = new Set([
  "title",
  "templateKey",
  "attemptsAllowed",
  "counting",
  "opensAt",
  "dueAt",
  "closesAt",
  "latePenaltyPercentPerDay",
  "lateFloorPercent",
  "showExpected",
  "instructions",
  "safetyNotes",
]);
const DRAW_FIELDS = new Set(["value", "min", "max", "step", "values", "series", "tolerancePercent"]);
const QUESTION_FIELDS = new Set(["quantity", "kind", "points", "tolerancePercent"]);

/**
 * The form field that shows an error reported at an API path. Errors about the whole spec or the
 * question list go to "root.spec" / "root.questions"; anything else to "root.server".
 */
export function formPathFor(apiPath: string): string {
  const parts = apiPath.split(".");
  if (TOP_FIELDS.has(parts[0])) return parts[0];
  if (parts[0] === "spec") {
    if (parts[1] === "parameters" && parts[2]) {
      const field = parts[3];
      if (field && DRAW_FIELDS.has(field)) return `parameters.${parts[2]}.${field}`;
      return `parameters.${parts[2]}.mode`;
    }
    return "root.spec";
  }
  if (parts[0] === "questions") {
    if (parts[1] !== undefined && /^\d+$/.test(parts[1])) {
      const field = parts[2];
      return `questions.${parts[1]}.${field && QUESTION_FIELDS.has(field) ? field : "quantity"}`;
    }
    return "root.questions";
  }
  if (parts[0] === "policy") return POLICY_PATHS[parts[1] ?? ""] ?? "defaultTolerancePercent";
  return "root.server";
}

/** The API's `fields` object mapped onto form field names (first message wins for each field). */
export function mapServerErrors(fields: Record<string, string[] | string> | undefined): FormErrors {
  const out: FormErrors = {};
  for (const [path, messages] of Object.entries(fields ?? {})) {
    const target = formPathFor(path);
    const message = Array.isArray(messages) ? messages[0] : messages;
    if (message && !out[target]) out[target] = message;
  }
  return out;
}

/** Checks the form: first what the builder reads itself (units), then the shared labInputSchema. */
export function checkForm(form: BuilderForm, kept: KeptPolicy = {}): { input: LabInput; errors: FormErrors } {
  const { input, errors } = formToInput(form, kept);
  const r = labInputSchema.safeParse(input);
  if (!r.success) {
    for (const issue of r.error.issues) {
      const target = formPathFor(issue.path.map(String).join("."));
      // A value the builder could not read was left out of the body; its own message is clearer.
      if (target.startsWith("parameters.") && Object.keys(errors).some((k) => k.startsWith(target.split(".").slice(0, 2).join(".")))) continue;
      if (!errors[target]) errors[target] = issue.message;
    }
  }
  return { input, errors };
}

/** The builder's zod schema for react-hook-form: the form state in, the API body (labInputSchema input) out. */
export function builderSchema(kept: KeptPolicy = {}) {
  return z
    .custom<BuilderForm>((v) => typeof v === "object" && v !== null && TEMPLATE_KEYS.includes((v as BuilderForm).templateKey), {
      message: "Choose a circuit template.",
      path: ["templateKey"],
    })
    .transform((form, ctx) => {
      const { input, errors } = checkForm(form, kept);
      const paths = Object.keys(errors);
      if (paths.length === 0) return input;
      for (const p of paths) ctx.addIssue({ code: "custom", message: errors[p], path: p.split(".") });
      return z.NEVER;
    });
}

// ---------------------------------------------------------------------------------------------------
// Editing: only what changed is sent, compared by value (stored JSON may order keys differently)

function canonical(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(canonical);
  if (v && typeof v === "object" && !(v instanceof Date)) {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(v).sort()) {
      const x = (v as Record<string, unknown>)[k];
      if (x !== undefined) out[k] = canonical(x);
    }
    return out;
  }
  return v;
}

export function sameValue(a: unknown, b: unknown): boolean {
  return JSON.stringify(canonical(a)) === JSON.stringify(canonical(b));
}

function sameInstant(a: string | null | undefined, b: string | null | undefined): boolean {
  if (!a || !b) return !a && !b;
  return new Date(a).getTime() === new Date(b).getTime();
}

/** The fields of `next` that differ from `before`, for a PATCH. */
export function changedFields(before: LabInput, next: LabInput): Partial<LabInput> {
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(next) as (keyof LabInput)[]) {
    const a = before[key];
    const b = next[key];
    const same = key === "opensAt" || key === "dueAt" || key === "closesAt" ? sameInstant(a as string | null, b as string | null) : sameValue(a, b);
    if (!same) out[key] = b;
  }
  return out as Partial<LabInput>;
}

/** The fields whose change makes a published lab with attempts recompute its grades (as lib/labs/edit.ts decides). */
export const GRADING_FIELDS = ["spec", "questions", "policy", "latePenaltyPercentPerDay", "lateFloorPercent", "templateKey"] as const;

export function changesGrades(changed: Partial<LabInput>): boolean {
  return GRADING_FIELDS.some((k) => k in changed);
}
