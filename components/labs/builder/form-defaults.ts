// The builder's starting points: a template's defaults, an empty form, and a stored lab as form state. Pure.
import { defaultVariantSpec, templates, type ParameterDraw, type ParameterSpec, type TemplateKey, type VariantSpec } from "@/lib/grader";
import { toLocalInput } from "@/lib/dates";
import type { BuilderForm, DrawForm, QuestionForm, StoredLabInput } from "./form-types";
import { valueText } from "./form-text";


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
    bench: "real",
    instructions: "",
    safetyNotes: "",
  };
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
    bench: input.bench ?? "real",
    instructions: input.instructions ?? "",
    safetyNotes: input.safetyNotes ?? "",
  };
}
