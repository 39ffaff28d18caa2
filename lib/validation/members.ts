import { z } from "zod";
import { emailSchema } from "./auth";

export const roleSchema = z.enum(["student", "ta", "instructor"], { error: "Role must be student, ta or instructor." });

export const addMemberSchema = z.object({
  email: emailSchema,
  role: roleSchema,
  section: z.string().trim().max(40, "Use at most 40 characters.").optional().nullable(),
});
export type AddMemberInput = z.input<typeof addMemberSchema>;

export const uuidSchema = z.uuid();
