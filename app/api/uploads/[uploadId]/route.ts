import { db } from "@/db";
import { findUpload } from "@/db/queries/uploads";
import { json, route } from "@/lib/http/route";
import { isStaff, requireCourseRole } from "@/lib/auth/access";
import { AppError, notFound } from "@/lib/errors";
import { uploadView } from "@/lib/uploads/accept";
import { uuidSchema } from "@/lib/validation/common";

// The upload's record and a signed URL valid for 60 s: for its owner and the course staff only.
export const GET = route<{ uploadId: string }>(async (_req, { uploadId }) => {
  if (!uuidSchema.safeParse(uploadId).success) throw notFound("That upload");
  const upload = await findUpload(db, uploadId);
  if (!upload) throw notFound("That upload");
  const access = await requireCourseRole(upload.courseId).catch((e) => {
    if (e instanceof AppError && e.code !== "unauthorized") throw notFound("That upload");
    throw e;
  });
  if (upload.ownerId !== access.user.id && !isStaff(access.role)) throw notFound("That upload");
  return json({ upload: await uploadView(upload) });
});
