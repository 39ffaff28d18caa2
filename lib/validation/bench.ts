// The simulated bench's query: which readings to replay. Read from the URL (all values are text), shared by
// the route and the lab page's bench (which sends the same run it showed).
import { z } from "zod";
import { uuidSchema } from "./common";

const numberText = (message: string) =>
  z.preprocess((v) => (typeof v === "string" && v.trim() !== "" ? Number(v) : v), z.number({ error: message }).refine(Number.isFinite, message));

export const benchReadingsQuerySchema = z.object({
  /** a range key of the lab's instrument, or "auto" where it ranges by itself */
  range: z.string({ error: "Name a range of the instrument (or auto)." }).trim().min(1, "Name a range of the instrument (or auto).").max(40, "Use at most 40 characters."),
  count: numberText("count is a whole number from 1 to 10000.").pipe(z.number().int("count is a whole number from 1 to 10000.").min(1, "count is a whole number from 1 to 10000.").max(10_000, "count is a whole number from 1 to 10000.")).default(20),
  /** seconds on the bench's clock when the run started (the last change of range or filter) */
  from: numberText("from is a time in seconds, 0 or more.").pipe(z.number().min(0, "from is a time in seconds, 0 or more.").max(1e7, "from is at most 10,000,000 s.")).default(0),
  /** readings per second */
  rate: numberText("rate is in readings per second, from 0.001 to 100000.").pipe(z.number().min(0.001, "rate is in readings per second, from 0.001 to 100000.").max(100_000, "rate is in readings per second, from 0.001 to 100000.")).optional(),
  filter: z.enum(["on", "off"], { error: "filter is on or off." }).default("on"),
  /** staff: the student whose bench to replay */
  userId: uuidSchema.optional(),
});
/** `GET …/bench`: staff may name the student whose bench they open. */
export const benchQuerySchema = z.object({ userId: uuidSchema.optional() });

export type BenchReadingsQuery = z.output<typeof benchReadingsQuerySchema>;
