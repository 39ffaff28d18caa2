import { z } from "zod";
import { emailSchema } from "./auth";

export const roleSchema = z.enum(["student", "ta", "instructor"], { error: "Role must be student, ta or instructor." });

const sectionSchema = z
  .string()
  .trim()
  .max(40, "Use at most 40 characters.")
  .transform((s) => (s === "" ? null : s));

export const addMemberSchema = z.object({
  email: emailSchema,
  role: roleSchema,
  section: sectionSchema.optional().nullable(),
});
export type AddMemberInput = z.input<typeof addMemberSchema>;

/** PATCH of a membership: a new role, a new section (null or "" clears it), or both. */
export const updateMemberSchema = z
  .object({
    role: roleSchema.optional(),
    section: sectionSchema.nullable().optional(),
  })
  .strict()
  .refine((v) => v.role !== undefined || v.section !== undefined, { message: "Give a role or a section to change.", path: ["role"] });
export type UpdateMemberInput = z.input<typeof updateMemberSchema>;

/** CSV import of students: `confirm: false` previews, `confirm: true` saves the rows marked good. */
export const importMembersSchema = z.object({
  csv: z
    .string({ error: "Paste or choose a CSV file of name, e-mail and section." })
    .min(1, "The CSV is empty.")
    .max(500_000, "Import at most 500 kB of CSV at a time."),
  confirm: z.boolean({ error: "confirm must be true or false." }),
});
export type ImportMembersInput = z.input<typeof importMembersSchema>;

