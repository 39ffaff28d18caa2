// Course creation (site admin), copying into a new term and course settings (instructor).
import { z } from "zod";
import { emailSchema } from "./auth";

const code = z
  .string({ error: "Enter a course code." })
  .trim()
  .min(1, "Enter a course code.")
  .max(20, "Use at most 20 characters.")
  .regex(/^[A-Za-z0-9][A-Za-z0-9 ._-]*$/, "Use letters, digits, spaces, dots, dashes or underscores.");
const title = z.string({ error: "Enter a title." }).trim().min(1, "Enter a title.").max(120, "Use at most 120 characters.");
const term = z.string({ error: "Enter the term." }).trim().min(1, "Enter the term.").max(40, "Use at most 40 characters.");
// kept to hundredths: the column is a 4-byte float, which refuses the tiniest numbers JSON can carry
const percent = z
  .number({ error: "Enter a number." })
  .min(0, "Use 0 or more.")
  .max(100, "Use at most 100.")
  .transform((v) => Math.round(v * 100) / 100);

export const createCourseSchema = z.object({
  code,
  title,
  term,
  institution: z.string({ error: "Enter the institution." }).trim().min(1, "Enter the institution.").max(120, "Use at most 120 characters."),
  instructorEmail: emailSchema,
  /** needed only when no account uses the e-mail address yet (the instructor is then invited) */
  instructorName: z.string().trim().max(120, "Use at most 120 characters.").optional().default(""),
});
export type CreateCourseInput = z.input<typeof createCourseSchema>;

export const copyCourseSchema = z.object({
  code,
  term,
  title: title.optional(),
  /** whole days added to every lab and lesson date (the new term's start minus the old one's) */
  shiftDays: z.number({ error: "Enter a whole number of days." }).int("Enter a whole number of days.").min(-3660, "Shift by at most ten years.").max(3660, "Shift by at most ten years."),
});
export type CopyCourseInput = z.input<typeof copyCourseSchema>;

export const courseSettingsSchema = z
  .object({
    title,
    term,
    joiningOpen: z.boolean({ error: "Joining is open or closed." }),
    defaultLatePenaltyPercentPerDay: percent,
    defaultLateFloorPercent: percent,
  })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Give at least one setting to change.", path: ["title"] });
export type CourseSettingsInput = z.input<typeof courseSettingsSchema>;
