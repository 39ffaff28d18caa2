import { z } from "zod";
import { uuidSchema } from "./common";

/** `?format=` of the gradebook route: JSON (default) or the CSV export. */
export const gradebookQuerySchema = z.object({
  format: z.enum(["json", "csv"], { error: "Format must be json or csv." }).default("json"),
});

/**
 * A lab's weight in the course total: a number from 0 to 1000, or null for "by its points". The form
 * sends the text of its field ("" for by points, "2,5" read as 2.5); the API sends a number or null.
 */
export const weightSchema = z.preprocess(
  (v) => (typeof v === "string" ? (v.trim() === "" ? null : Number(v.trim().replace(",", "."))) : v),
  z
    .number({ error: "A weight is a number (or empty for its points)." })
    .min(0, "A weight cannot be negative.")
    .max(1000, "Use a weight of at most 1000.")
    .nullable(),
);

/** The weights form and `PUT /api/courses/{courseId}/gradebook/weights`. */
export const labWeightsSchema = z.object({
  weights: z
    .array(z.object({ labId: uuidSchema, weight: weightSchema }))
    .max(500, "Too many labs at once.")
    .refine((ws) => new Set(ws.map((w) => w.labId)).size === ws.length, "Each lab may appear once."),
});
export type LabWeights = z.output<typeof labWeightsSchema>;
export type LabWeightsInput = z.input<typeof labWeightsSchema>;
