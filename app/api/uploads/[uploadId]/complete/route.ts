import { db } from "@/db";
import { findUpload } from "@/db/queries/uploads";
import { json, route } from "@/lib/http/route";
import { requireUser } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { labAccess, variantFor } from "@/lib/labs/attempts";
import { uploadView } from "@/lib/uploads/accept";
import { completeUpload } from "@/lib/uploads/direct";
import { uuidSchema } from "@/lib/validation/common";

// Completes an upload sent straight to storage: its owner only (others: 404). No body. 200 with the
// upload (status "analysing", then "ready" once the job has written the analysis); completing it again
// answers the same. Refused (and removed) when the stored file is larger than announced, over the limit
// or the quota, or not of the type announced.
export const POST = route<{ uploadId: string }>(async (_req, { uploadId }) => {
  const user = await requireUser();
  if (!uuidSchema.safeParse(uploadId).success) throw notFound("That upload");
  const row = await findUpload(db, uploadId);
  if (!row || row.ownerId !== user.id) throw notFound("That upload");
  // the circuit values of the caller's lab (the battery for the battery life)
  const params = row.labId ? await labAccess(row.labId).then(({ lab }) => variantFor(lab, user.id)).catch(() => undefined) : undefined;
  const done = await completeUpload({ uploadId, ownerId: user.id, params });
  return json({ upload: await uploadView(done) });
});
