import { db } from "@/db";
import { findPendingUpload } from "@/db/queries/uploads";
import { json, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { storedParts } from "@/lib/uploads/direct";
import { uuidSchema } from "@/lib/validation/common";

// The parts of an upload the store already holds, `{ parts: [{ number, etag, size }] }`, so an upload
// client resuming after a dropped connection sends only the rest. Its owner only (others: 404); an
// upload already completed has none left open (`[]`).
export const GET = route<{ uploadId: string }>(async (_req, { uploadId }) => {
  const user = await requireUser();
  if (!uuidSchema.safeParse(uploadId).success) throw notFound("That upload");
  const row = await findPendingUpload(db, uploadId);
  if (!row || row.ownerId !== user.id) throw notFound("That upload");
  return json({ parts: await storedParts(row) });
});
