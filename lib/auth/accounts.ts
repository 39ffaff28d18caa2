// The site admin's accounts: find any account, disable it (its sessions end at once and sign-in is
// refused with a message to contact the course staff) or enable it again.
import "server-only";
import { db } from "@/db";
import { deleteSessionsOf } from "@/db/queries/sessions";
import { searchUsers, setDisabled } from "@/db/queries/users";
import { AppError, notFound } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { requireAdmin } from "./access";

export async function findAccounts(query: string) {
  await requireAdmin();
  return searchUsers(db, query);
}

export async function setAccountDisabled(userId: string, disabled: boolean) {
  const admin = await requireAdmin();
  if (!uuidSchema.safeParse(userId).success) throw notFound("That account");
  if (disabled && userId === admin.id) throw new AppError("conflict", "You cannot disable your own account.", { disabled: ["Another site admin can disable this account."] });
  return db.transaction().execute(async (trx) => {
    const user = await setDisabled(trx, userId, disabled);
    if (!user) throw notFound("That account");
    // every session of a disabled account ends now, in the same transaction
    if (disabled) await deleteSessionsOf(trx, userId);
    return user;
  });
}
