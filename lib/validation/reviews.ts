// Review and regrade: the staff's per-question points or a re-run of the grader (both with a reason),
// the answer to a student's review request, and the review queue's filters. Shared by the forms and
// the route handlers.
import { z } from "zod";

export const regradeReasonSchema = z
  .string({ error: "Give a reason for the change." })
  .trim()
  .min(3, "Give a reason of at least 3 characters.")
  .max(500, "Keep the reason to 500 characters or fewer.");

/** Points for one question: from 0 up (the question's maximum is checked against the lab), in halves. */
export const regradePointsSchema = z
  .number({ error: "Points must be a number." })
  .min(0, "Points cannot be negative.")
  .refine((p) => Number.isInteger(p * 2), "Points go in steps of one half (for example 1.5).");

/** One question's new points with a reason. */
export const questionRegradeSchema = z.object({
  questionId: z.string({ error: "Choose the question to regrade." }).trim().min(1, "Choose the question to regrade.").max(40),
  points: regradePointsSchema,
  reason: regradeReasonSchema,
});

/** Re-run the grader on the stored readings with the lab as it is now. */
export const rerunSchema = z.object({ rerun: z.literal(true, { error: "rerun must be true." }), reason: regradeReasonSchema });

/**
 * The body of POST /api/attempts/{attemptId}/regrades: either `{ questionId, points, reason }` or
 * `{ rerun: true, reason }`, picked by the presence of `rerun`, so errors name the fields of the form used.
 */
export function parseRegrade(data: unknown): z.ZodSafeParseResult<z.output<typeof rerunSchema> | z.output<typeof questionRegradeSchema>> {
  const isRerun = typeof data === "object" && data !== null && "rerun" in data;
  return isRerun ? rerunSchema.safeParse(data) : questionRegradeSchema.safeParse(data);
}

export const reviewAnswerSchema = z.object({
  message: z
    .string({ error: "Write your answer to the student." })
    .trim()
    .min(3, "Write at least 3 characters.")
    .max(4000, "Keep the answer to 4,000 characters or fewer."),
});

const flag = z
  .enum(["true", "false", "1", "0", ""])
  .optional()
  .transform((v) => (v === "true" || v === "1" ? true : v === "false" || v === "0" ? false : undefined));

/** The review queue's query string. */
export const reviewQuerySchema = z.object({
  status: z.enum(["open", "answered", "all"], { error: "status is open, answered or all." }).default("all"),
  labId: z.uuid("labId must be a lab's id.").optional().or(z.literal("").transform(() => undefined)),
  section: z.string().trim().max(60).optional().transform((v) => (v ? v : undefined)),
  /** only attempts with at least one recognised mistake */
  mistake: flag,
  /** only late (or only on-time) attempts */
  late: flag,
  /** only attempts staff changed (or never changed) */
  changed: flag,
});

export type ReviewQuery = z.output<typeof reviewQuerySchema>;
