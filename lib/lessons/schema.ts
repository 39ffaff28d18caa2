import { z } from "zod";

/** The ten lab templates of lib/grader (lib/grader/README.md); a lesson lists the ones it prepares for. */
export const templateKeys = [
  "shunt-burden",
  "shunt-selection",
  "range-resolution",
  "duty-cycle",
  "bidirectional-offset",
  "filter-noise",
  "uncertainty",
  "leakage-guard",
  "offset-thermal",
  "sampling-burst",
] as const;
export type LessonTemplateKey = (typeof templateKeys)[number];

/**
 * A lesson's frontmatter. Each MDX file exports it as `export const frontmatter = { … }` written as
 * strict JSON (quoted keys), so that the loader can read it without compiling the MDX and the page
 * module exports the same object.
 */
export const lessonFrontmatterSchema = z
  .object({
    title: z.string().min(3).max(120),
    summary: z.string().min(10).max(400),
    order: z.number().int().positive(),
    objectives: z.array(z.string().min(5)).min(1).max(8),
    minutes: z.number().int().min(5).max(180),
    templates: z.array(z.enum(templateKeys)),
    /**
     * The quantities of its templates that this lesson teaches (keys of the templates' quantities), where
     * several lessons prepare for one template; absent: every quantity of its templates.
     */
    quantities: z.array(z.string().min(1)).optional(),
  })
  .strict();

export type LessonFrontmatter = z.infer<typeof lessonFrontmatterSchema>;

export const slugSchema = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/);

export type LessonSummary = LessonFrontmatter & { slug: string };
