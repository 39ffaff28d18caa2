// The bench arrangement of a course: the Benches page and `PUT /api/courses/{courseId}/benches`.
import { z } from "zod";
import { uuidSchema } from "./common";

/** At most this many students sit at one bench. */
export const MAX_AT_BENCH = 4;

const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;

export const benchNameSchema = z
  .string({ error: "Give the bench a name, such as Bench 07." })
  .trim()
  .min(1, "Give the bench a name, such as Bench 07.")
  .max(40, "Use at most 40 characters.")
  .refine((s) => !CONTROL.test(s), "Use letters, digits and spaces (no control characters).");

const sectionSchema = z
  .string({ error: "A section is text, or leave it out." })
  .trim()
  .max(40, "Use at most 40 characters.")
  .refine((s) => !CONTROL.test(s), "Use letters, digits and spaces (no control characters).")
  .transform((s) => (s === "" ? null : s));

export const benchesSchema = z
  .object({
    benches: z
      .array(
        z.object({
          name: benchNameSchema,
          section: sectionSchema.nullable().optional().transform((s) => s ?? null),
          memberIds: z
            .array(uuidSchema, { error: "memberIds is a list of student ids." })
            .max(MAX_AT_BENCH, `At most ${MAX_AT_BENCH} students sit at one bench.`),
        }),
        { error: "benches is a list of benches." },
      )
      .max(1000, "At most 1,000 benches in a course."),
  })
  .superRefine((v, ctx) => {
    const names = new Map<string, number>();
    const seated = new Map<string, number>();
    v.benches.forEach((b, i) => {
      const key = b.name.toLowerCase();
      if (names.has(key)) ctx.addIssue({ code: "custom", path: ["benches", i, "name"], message: `"${b.name}" is already the name of bench ${names.get(key)! + 1} in the list.` });
      else names.set(key, i);
      b.memberIds.forEach((id, j) => {
        if (seated.has(id)) ctx.addIssue({ code: "custom", path: ["benches", i, "memberIds", j], message: `This student already sits at ${v.benches[seated.get(id)!].name}; a student sits at one bench.` });
        else seated.set(id, i);
      });
    });
  });
export type BenchesInput = z.input<typeof benchesSchema>;
export type Benches = z.output<typeof benchesSchema>;
