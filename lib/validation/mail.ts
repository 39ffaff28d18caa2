// One schema per mutation or query of the mail features, shared by forms and route handlers.
import { z } from "zod";
import { emailSchema, passwordSchema } from "./auth";

/** GET /api/dev/mail?to=ADDRESS */
export const devMailQuerySchema = z.object({ to: emailSchema.optional() });

/** PUT /api/labs/{labId}/grades-held: hold a lab's grades, or release them (one message per student). */
export const gradesHeldSchema = z.object({ held: z.boolean({ error: "Say whether the grades are held (true or false)." }) });
export type GradesHeldInput = z.input<typeof gradesHeldSchema>;

/** PATCH /api/me/preferences */
export const preferencesSchema = z.object({ gradeMail: z.boolean({ error: "Say whether you want graded-attempt e-mails (true or false)." }) });
export type PreferencesInput = z.input<typeof preferencesSchema>;

/** POST /api/me/password */
export const changePasswordSchema = z
  .object({
    currentPassword: z.string({ error: "Enter your current password." }).min(1, "Enter your current password.").max(200),
    newPassword: passwordSchema,
    confirm: z.string({ error: "Type the new password again." }),
  })
  .refine((v) => v.newPassword === v.confirm, { path: ["confirm"], message: "The two new passwords differ." });
export type ChangePasswordInput = z.input<typeof changePasswordSchema>;

/** POST /api/password-reset */
export const resetRequestSchema = z.object({ email: emailSchema });
export type ResetRequestInput = z.input<typeof resetRequestSchema>;

/** POST /api/password-reset/confirm */
export const resetConfirmSchema = z
  .object({
    token: z.string({ error: "The link is incomplete." }).min(1, "The link is incomplete.").max(200, "The link is not valid."),
    password: passwordSchema,
    confirm: z.string({ error: "Type the new password again." }),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ." });
export type ResetConfirmInput = z.input<typeof resetConfirmSchema>;
