// Disable an account or enable it again (site admin).
import { json, jsonBody, route } from "@/lib/http/route";
import { requireAdmin } from "@/lib/auth/access";
import { setAccountDisabled } from "@/lib/auth/accounts";
import { userPatchSchema } from "@/lib/validation/admin";

export const PATCH = route<{ userId: string }>(async (req, { userId }) => {
  await requireAdmin();
  const { disabled } = await jsonBody(req, userPatchSchema);
  return json({ user: await setAccountDisabled(userId, disabled) });
});
