// One student's exception to a lab: `PUT /api/labs/{labId}/exceptions/{userId}` and the form on the lab's page.
import { z } from "zod";
import { isoDate } from "./labs";
import { regradeReasonSchema } from "./reviews";

export const exceptionSchema = z
  .object({
    /** the student's own due date (no late penalty before it) */
    dueAt: isoDate.optional().transform((d) => d ?? null),
    /** the student's own close; without one an explicit close moves with the due date */
    closesAt: isoDate.optional().transform((d) => d ?? null),
    extraAttempts: z
      .number({ error: "Enter a whole number of extra attempts." })
      .int("Enter a whole number of extra attempts.")
      .min(0, "Extra attempts cannot be negative.")
      .max(20, "Give at most 20 extra attempts.")
      .optional()
      .transform((n) => n ?? 0),
    reason: regradeReasonSchema,
  })
  .superRefine((v, ctx) => {
    if (!v.dueAt && !v.closesAt && v.extraAttempts === 0) ctx.addIssue({ code: "custom", path: ["dueAt"], message: "Give a new due date, a new close or extra attempts." });
    if (v.dueAt && v.closesAt && v.closesAt < v.dueAt) ctx.addIssue({ code: "custom", path: ["closesAt"], message: "The close cannot come before the due date." });
  });
export type ExceptionInput = z.input<typeof exceptionSchema>;
export type ExceptionData = z.output<typeof exceptionSchema>;
