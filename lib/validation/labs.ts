// The lab a builder saves and the attempt a student submits: one schema each, shared by the forms and
// the route handlers. The parameter spec, questions and policy use the grader's own schemas.
import { z } from "zod";
import type { LabDataColumn } from "@/db/queries/labs";
import { hasSimulatedBench } from "@/lib/simulation/circuits";
import { drawVariant, gradePolicySchema, questionSchema, TEMPLATE_KEYS, templates, variantSpecSchema, type TemplateKey } from "@/lib/grader";

// An ISO date-time from a form or a request, or a Date already read (a PATCH merged into a stored lab).
export const isoDate = z
  .union([z.date(), z.iso.datetime({ offset: true, local: true }), z.literal(""), z.null()])
  .transform((v) => (v instanceof Date ? v : v ? new Date(v) : null))
  .refine((d) => d === null || !Number.isNaN(d.getTime()), { message: "Enter a valid date and time." });

/** A percentage kept to hundredths: the column is a 4-byte float, which refuses the tiniest numbers JSON can carry. */
const percent = () =>
  z
    .number({ error: "Enter a number." })
    .min(0, "Use 0 or more.")
    .max(100, "Use at most 100.")
    .transform((v) => Math.round(v * 100) / 100);

export const BENCH_MODES = ["real", "simulated", "either"] as const;
export const benchModeSchema = z.enum(BENCH_MODES, { error: "Choose real, simulated or either." });

export const labFields = {
  title: z.string({ error: "Give the lab a title." }).trim().min(1, "Give the lab a title.").max(120, "Use at most 120 characters."),
  templateKey: z.enum(TEMPLATE_KEYS as [TemplateKey, ...TemplateKey[]], { error: "Choose a circuit template." }),
  spec: variantSpecSchema,
  questions: z.array(questionSchema).min(1, "Ask at least one question.").max(20, "Ask at most 20 questions."),
  policy: gradePolicySchema.partial().default({}),
  attemptsAllowed: z.number({ error: "Enter a whole number." }).int("Enter a whole number.").min(1, "Allow at least one attempt.").max(20, "Allow at most 20 attempts."),
  counting: z.enum(["best", "last"], { error: "Choose best or last attempt." }),
  opensAt: isoDate,
  dueAt: isoDate,
  /** late attempts accepted until then; empty: the due date plus the days the late penalty takes to reach its floor */
  closesAt: isoDate.optional().transform((d) => d ?? null),
  latePenaltyPercentPerDay: percent(),
  lateFloorPercent: percent(),
  showExpected: z.enum(["after_attempt", "after_due", "never"], { error: "Choose when expected values are shown." }),
  instructions: z.string().max(20_000, "Use at most 20,000 characters.").default(""),
  safetyNotes: z.string().max(5_000, "Use at most 5,000 characters.").default(""),
  /** where students take their readings: the real bench, the simulated bench, or either */
  bench: benchModeSchema.default("real"),
};

/** db/queries/labs.ts reads and writes these fields as columns by name; the build fails when the two lists differ. */
type SameKeys<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
export const labFieldsAreColumns: SameKeys<keyof typeof labFields, LabDataColumn> = true;

function checkLab(lab: { bench: "real" | "simulated" | "either"; templateKey: TemplateKey; spec: { template: string; parameters: Record<string, unknown> }; questions: { quantity: string }[]; opensAt: Date | null; dueAt: Date | null; closesAt?: Date | null }, ctx: z.RefinementCtx) {
  if (lab.spec.template !== lab.templateKey) {
    ctx.addIssue({ code: "custom", path: ["spec", "template"], message: "The parameter spec belongs to another template." });
  }
  const template = templates[lab.templateKey];
  const quantities = new Set(template.quantities.map((q) => q.key));
  lab.questions.forEach((q, i) => {
    if (!quantities.has(q.quantity)) {
      ctx.addIssue({ code: "custom", path: ["questions", i, "quantity"], message: `"${q.quantity}" is not a quantity of this template.` });
    }
  });
  const params = new Set(template.parameters.map((p) => p.key));
  for (const key of Object.keys(lab.spec.parameters)) {
    if (!params.has(key)) ctx.addIssue({ code: "custom", path: ["spec", "parameters", key], message: `"${key}" is not a parameter of this template.` });
  }
  if (lab.spec.template === lab.templateKey && [...Object.keys(lab.spec.parameters)].every((k) => params.has(k))) {
    try {
      drawVariant(lab.spec as Parameters<typeof drawVariant>[0], "lab-check");
    } catch (e) {
      ctx.addIssue({ code: "custom", path: ["spec"], message: (e as Error).message });
    }
  }
  if (lab.bench !== "real" && !hasSimulatedBench(lab.templateKey)) {
    ctx.addIssue({ code: "custom", path: ["bench"], message: "This template has no circuit for the simulated bench: choose the real bench." });
  }
  if (lab.opensAt && lab.dueAt && lab.dueAt <= lab.opensAt) {
    ctx.addIssue({ code: "custom", path: ["dueAt"], message: "The due date must come after the opening date." });
  }
  if (lab.closesAt && lab.dueAt && lab.closesAt < lab.dueAt) {
    ctx.addIssue({ code: "custom", path: ["closesAt"], message: "The lab cannot close before its due date." });
  }
  if (lab.closesAt && !lab.dueAt) {
    ctx.addIssue({ code: "custom", path: ["closesAt"], message: "Set a due date first: the close is when late attempts stop." });
  }
  if (lab.closesAt && lab.opensAt && lab.closesAt <= lab.opensAt) {
    ctx.addIssue({ code: "custom", path: ["closesAt"], message: "The lab must close after it opens." });
  }
}

export const labInputSchema = z.object(labFields).superRefine(checkLab);
export type LabInput = z.input<typeof labInputSchema>;
export type LabData = z.output<typeof labInputSchema>;

/** PATCH: any subset of the fields, plus publishing. No defaults here: a field left out stays as it is. */
const WITH_DEFAULTS = new Set(["policy", "instructions", "safetyNotes", "bench"]);
export const labPatchSchema = z
  .object({
    ...Object.fromEntries(Object.entries(labFields).filter(([k]) => !WITH_DEFAULTS.has(k)).map(([k, v]) => [k, v.optional()])),
    policy: gradePolicySchema.partial().optional(),
    instructions: z.string().max(20_000, "Use at most 20,000 characters.").optional(),
    safetyNotes: z.string().max(5_000, "Use at most 5,000 characters.").optional(),
    bench: benchModeSchema.optional(),
    status: z.enum(["draft", "published"]).optional(),
  })
  .strict();

export const reviewRequestSchema = z.object({
  message: z.string({ error: "Say what you would like reviewed." }).trim().min(5, "Say a little more (at least 5 characters).").max(2000, "Use at most 2,000 characters."),
});
