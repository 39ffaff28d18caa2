// The site admin's account tools.
import { z } from "zod";

/** GET /api/admin/users?query=: part of a name or e-mail address (empty: every account, by name). */
export const userSearchSchema = z.object({
  query: z.string({ error: "Type part of a name or an e-mail address." }).trim().max(200, "Use at most 200 characters.").optional().default(""),
});

/** PATCH /api/admin/users/{userId}: disable an account (its sessions end, it cannot sign in) or enable it again. */
export const userPatchSchema = z.object({ disabled: z.boolean({ error: "Say whether the account is disabled (true or false)." }) });
export type UserPatchInput = z.input<typeof userPatchSchema>;
