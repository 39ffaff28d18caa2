import { z } from "zod";

const when = z
  .union([z.iso.datetime({ offset: true, local: true }), z.literal(""), z.null()])
  .transform((v) => (v ? new Date(v) : null));

/** The instructor's lesson plan for a course, in the order the lessons appear. */
export const lessonPlanSchema = z.object({
  lessons: z
    .array(
      z.object({
        slug: z.string().min(1).max(100),
        visible: z.boolean({ error: "Say whether the lesson appears." }),
        opensAt: when.optional().default(null),
      }),
    )
    .max(100)
    .refine((l) => new Set(l.map((x) => x.slug)).size === l.length, { message: "A lesson appears twice." }),
});
export type LessonPlanInput = z.input<typeof lessonPlanSchema>;
export type LessonPlan = z.output<typeof lessonPlanSchema>;
