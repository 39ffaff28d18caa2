import { z } from "zod";
import { db } from "@/db";
import { findUploadSamples } from "@/db/queries/uploads";
import { json, route } from "@/lib/http/route";
import { isStaff, requireCourseRole } from "@/lib/auth/access";
import { AppError, notFound } from "@/lib/errors";
import { readWindow } from "@/lib/uploads/samples";
import { uuidSchema } from "@/lib/validation/common";
import { parseOr400 } from "@/lib/validation/zod-errors";

const query = z
  .object({
    from: z.coerce.number({ error: "Give the window's start in seconds." }).refine(Number.isFinite, "Give the window's start in seconds."),
    to: z.coerce.number({ error: "Give the window's end in seconds." }).refine(Number.isFinite, "Give the window's end in seconds."),
    points: z.coerce.number().int("A whole number of points.").min(2, "At least 2 points.").max(10_000, "At most 10,000 points.").default(1000),
  })
  .refine((q) => q.to > q.from, { path: ["to"], message: "The end must come after the start." });

// A time window of a logged trace at full resolution, reduced by min/max per pixel column to at most
// 2 × points points: `{ from, to, points, samples, t: number[], i: number[] }` (seconds, amperes). For the
// upload's owner and the course staff; read from the compact stored samples, never the CSV.
export const GET = route<{ uploadId: string }>(async (req, { uploadId }) => {
  if (!uuidSchema.safeParse(uploadId).success) throw notFound("That upload");
  const upload = await findUploadSamples(db, uploadId);
  if (!upload) throw notFound("That upload");
  const access = await requireCourseRole(upload.courseId).catch((e) => {
    if (e instanceof AppError && e.code !== "unauthorized") throw notFound("That upload");
    throw e;
  });
  if (upload.ownerId !== access.user.id && !isStaff(access.role)) throw notFound("That upload");
  const params = new URL(req.url).searchParams;
  const q = parseOr400(query, { from: params.get("from") ?? undefined, to: params.get("to") ?? undefined, points: params.get("points") ?? undefined });
  if (!upload.samples) {
    throw new AppError("conflict", upload.status === "ready" ? "This upload is not a trace kept for zooming." : "The trace is still being analysed; ask again when it is ready.");
  }
  const window = await readWindow(upload.samples, q.from, q.to, q.points);
  return json({ from: q.from, to: q.to, points: q.points, samples: window.samples, t: window.t, i: window.i });
});
