// Grading a lab's attempt from stored data: no framework, session or request objects, so the web
// server, the regrade job and the tests share it.
import type { findLab } from "@/db/queries/labs";
import type { BenchMode } from "@/db/types";
import { AppError } from "@/lib/errors";
import {
  componentTolerancesFromSpec,
  formatQuantity,
  gradeAttempt,
  parseQuantity,
  readingProblem,
  templates,
  type GradePolicy,
  type GradeResult,
  type Params,
  type Question,
  type TemplateKey,
  type VariantSpec,
} from "@/lib/grader";
import { applyPenalty, latePenaltyPercent, lateDays, withException, type LabException, type LabRules } from "./policy";
import type { StoredResult } from "./present";

export interface Lab extends LabRules {
  id: string;
  courseId: string;
  title: string;
  templateKey: TemplateKey;
  status: "draft" | "published";
  spec: VariantSpec;
  questions: (Question & { id: string })[];
  policy: GradePolicy;
  instructions: string;
  safetyNotes: string;
  version: number;
  publishedAt: Date | null;
  updatedAt: Date;
  /** students see "graded, not yet released" and get no grade e-mail until the instructor releases */
  gradesHeld: boolean;
  /** where students take their readings: the real bench, the simulated bench, or either */
  bench: BenchMode;
  /**
   * The viewing student's own exception, already applied to the dates and attempts above (null for
   * everyone else): see `forStudent`.
   */
  exception: LabException | null;
}

/** The lab as one student works it: their own dates and attempt limit when they have an exception. */
export function forStudent(lab: Lab, exception: LabException | null | undefined): Lab {
  return exception ? { ...withException(lab, exception), exception } : lab;
}

type LabRow = NonNullable<Awaited<ReturnType<typeof findLab>>>;

export function toLab(row: LabRow): Lab {
  return {
    ...row,
    templateKey: row.templateKey as TemplateKey,
    spec: row.spec as VariantSpec,
    questions: withIds(row.questions as Question[]),
    policy: row.policy as GradePolicy,
    opensAt: row.opensAt ? new Date(row.opensAt) : null,
    dueAt: row.dueAt ? new Date(row.dueAt) : null,
    closesAt: row.closesAt ? new Date(row.closesAt) : null,
    publishedAt: row.publishedAt ? new Date(row.publishedAt) : null,
    exception: null,
  };
}

/** Every question gets a stable id (q1, q2, …) so a lab can ask for the same quantity twice. */
export function withIds(questions: Question[]): (Question & { id: string })[] {
  const used = new Set<string>();
  return questions.map((q, i) => {
    let id = q.id && !used.has(q.id) ? q.id : `q${i + 1}`;
    while (used.has(id)) id = `${id}x`;
    used.add(id);
    return { ...q, id };
  });
}

export function policyFor(lab: Lab): GradePolicy {
  return { ...lab.policy, componentTolerances: { ...componentTolerancesFromSpec(lab.spec), ...(lab.policy.componentTolerances ?? {}) } };
}

/** Reads the measured component values a student typed; each bad one is a 400 naming its field. */
export function parseMeasured(lab: Lab, measured: Record<string, string | null>): Params {
  const t = templates[lab.templateKey];
  const out: Params = {};
  const fields: Record<string, string[]> = {};
  for (const [key, text] of Object.entries(measured)) {
    if (text === null || text.trim() === "") continue;
    const spec = t.parameters.find((p) => p.key === key && p.kind !== "category");
    if (!spec) {
      fields[`measured.${key}`] = [`"${key}" is not a measurable component of this lab.`];
      continue;
    }
    const r = parseQuantity(text, spec.unit);
    if (!r.ok) fields[`measured.${key}`] = [r.message];
    else if (!(r.value > 0)) fields[`measured.${key}`] = ["A measured value must be greater than zero."];
    else out[key] = r.value;
  }
  if (Object.keys(fields).length) {
    throw new AppError("bad_request", `Check the measured value of ${Object.keys(fields).map((f) => f.slice(9)).join(", ")}.`, fields);
  }
  return out;
}

/**
 * Refuses answers that cannot be graded (unreadable, of the wrong kind, not one of the choices) with a
 * 400 naming each as `readings.{questionId}`, before any attempt is used.
 */
export function checkReadings(lab: Lab, readings: Record<string, string | null>): void {
  const fields: Record<string, string[]> = {};
  for (const q of lab.questions) {
    const problem = readingProblem(lab.templateKey, q.quantity, readings[q.id]);
    if (problem) fields[`readings.${q.id}`] = [problem];
  }
  const ids = Object.keys(fields).map((f) => f.slice("readings.".length));
  if (ids.length) {
    throw new AppError("bad_request", `Check ${ids.length === 1 ? "this answer" : "these answers"} before submitting: ${ids.join(", ")}. Nothing was graded and no attempt was used.`, fields);
  }
}

/** An uploaded trace's stored analysis (lib/trace's TraceAnalysis, as JSON) as grading reads it: only its average. */
export interface StoredTrace {
  averageCurrent?: number;
  [k: string]: unknown;
}

/** Grades readings for a lab and adds, for the average current, whether the typed value agrees with an uploaded trace. */
export function gradeForLab(lab: Lab, params: Params, readings: Record<string, string | null>, measured: Params, traces: StoredTrace[]): StoredResult {
  const result = gradeAttempt({
    template: lab.templateKey,
    params,
    questions: lab.questions,
    readings,
    measuredParams: Object.keys(measured).length ? measured : undefined,
    policy: policyFor(lab),
  }) as GradeResult;
  const stored: StoredResult = { ...result, results: result.results.map((r, i) => ({ ...r, id: lab.questions[i].id })) };
  const trace = traces.find((t) => typeof t.averageCurrent === "number");
  if (trace) {
    const avg = trace.averageCurrent as number;
    for (const r of stored.results) {
      if (r.quantity !== "averageCurrent" || typeof r.answer !== "number") continue;
      // A logged trace carries its own noise and offset: agreement within 5 % (or the band, if wider).
      const rel = Math.max(0.05, r.band ? (r.band[1] - r.band[0]) / 2 / Math.abs(r.expected as number) : 0);
      const agrees = Math.abs(r.answer - avg) <= rel * Math.abs(avg);
      const shown = formatQuantity(avg, "A");
      r.traceNote = agrees
        ? `Your logged trace averages ${shown} (time-weighted); your typed value agrees with it within ${Math.round(rel * 100)} %.`
        : `Your logged trace averages ${shown} (time-weighted), which does not agree with your typed value within ${Math.round(rel * 100)} %: check which one you computed.`;
      r.feedback = `${r.feedback} ${r.traceNote}`;
    }
  }
  return stored;
}


/** The row to store for a graded attempt: the grade, the late penalty at `submittedAt`, the final score. */
export function attemptRecord(a: {
  lab: Lab;
  userId: string;
  number: number;
  idempotencyKey: string;
  readings: Record<string, string | null>;
  measured: { typed: Record<string, string | null>; values: Params };
  uploadIds: string[];
  params: Params;
  result: StoredResult;
  submittedAt: Date;
}) {
  const days = lateDays(a.lab, a.submittedAt);
  const penalty = latePenaltyPercent(a.lab, days);
  return {
    labId: a.lab.id,
    userId: a.userId,
    number: a.number,
    idempotencyKey: a.idempotencyKey,
    readings: a.readings,
    measured: a.measured,
    uploadIds: a.uploadIds,
    result: { ...a.result, params: a.params },
    rawScore: a.result.score,
    maxScore: a.result.maxScore,
    lateDays: days,
    penaltyPercent: penalty,
    score: applyPenalty(a.result.score, penalty),
    graderVersion: a.result.graderVersion,
    labVersion: a.lab.version,
    submittedAt: a.submittedAt,
  };
}
