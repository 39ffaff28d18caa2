// The site admin's account search: name or e-mail contains the query.
import { json, route } from "@/lib/http/route";
import { findAccounts } from "@/lib/auth/accounts";
import { requireAdmin } from "@/lib/auth/access";
import { userSearchSchema } from "@/lib/validation/admin";
import { parseOr400 } from "@/lib/validation/zod-errors";

export const GET = route(async (req) => {
  await requireAdmin();
  const { query } = parseOr400(userSearchSchema, Object.fromEntries(new URL(req.url).searchParams));
  return json({ users: await findAccounts(query) });
});
