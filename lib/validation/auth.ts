// One schema per mutation, shared by the form (react-hook-form) and the server.
import { z } from "zod";

export const emailSchema = z
  .string({ error: "Enter your e-mail address." })
  .trim()
  .min(1, "Enter your e-mail address.")
  .max(254, "That e-mail address is too long.")
  .pipe(z.email({ error: "That does not look like an e-mail address." }))
  .transform((e) => e.toLowerCase());

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200),
});
export type SignInInput = z.input<typeof signInSchema>;

export const passwordSchema = z
  .string({ error: "Choose a password." })
  .min(10, "Use at least 10 characters.")
  .max(200, "Use at most 200 characters.");

export const signUpSchema = z.object({
  name: z.string({ error: "Enter your name." }).trim().min(1, "Enter your name.").max(120, "Use at most 120 characters."),
  email: emailSchema,
  password: passwordSchema,
  joinCode: z
    .string({ error: "Enter the join code your instructor gave you." })
    .trim()
    .min(1, "Enter the join code your instructor gave you.")
    .max(40, "That join code is too long.")
    .transform((c) => c.toUpperCase()),
});
export type SignUpInput = z.input<typeof signUpSchema>;
