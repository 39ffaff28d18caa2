// The attempt a student submits: one schema for the submission form and the route handler. Only zod: the
// lab page's form loads it in the browser, so it must not pull in the grader (the units library, the templates).
import { z } from "zod";

export const attemptInputSchema = z.object({
  idempotencyKey: z.string({ error: "An idempotency key is required." }).min(8, "The idempotency key is too short.").max(100),
  readings: z.record(z.string(), z.string().max(200, "Use at most 200 characters.").nullable()),
  measured: z.record(z.string(), z.string().max(200, "Use at most 200 characters.").nullable()).optional().default({}),
  uploadIds: z.array(z.uuid({ error: "Not an upload id." })).max(4, "Attach at most 4 files.").optional().default([]),
  /** the readings came from the simulated bench (a lab that allows either; a simulated-only lab sets it itself) */
  simulated: z.boolean({ error: "Say true or false." }).optional(),
});
export type AttemptInput = z.input<typeof attemptInputSchema>;
