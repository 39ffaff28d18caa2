// Checking the builder's form with the API's own schema, and putting the API's field errors (dotted
// labInputSchema paths) under the form's fields. Pure.
import { z } from "zod";
import { TEMPLATE_KEYS } from "@/lib/grader";
import { labInputSchema, type LabInput } from "@/lib/validation/labs";
import type { BuilderForm, KeptPolicy } from "./form-types";
import { formToInput, type FormErrors } from "./form-input";


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
  "bench",
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
