// The builder's form as the API's body (labInputSchema's input), with a message for every field that
// does not read. Pure.
import { templates, type ParameterDraw, type ParameterSpec } from "@/lib/grader";
import { fromLocalInput } from "@/lib/dates";
import type { LabInput } from "@/lib/validation/labs";
import type { BuilderForm, DrawForm, KeptPolicy } from "./form-types";
import { readAsText, readNumber, readPercent, readValue, splitList } from "./form-text";


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
    bench: form.bench,
    instructions: form.instructions,
    safetyNotes: form.safetyNotes,
  };
  return { input, errors };
}
