import { db } from "@/db";
import { requestReview } from "@/db/queries/attempts";
import { json, jsonBody, route } from "@/lib/http/route";
import { AppError } from "@/lib/errors";
import { attemptAccess } from "@/lib/labs/attempts";
import { reviewRequestSchema } from "@/lib/validation/labs";

// The student asks the course staff to review a graded attempt, with a message.
export const POST = route<{ attemptId: string }>(async (req, { attemptId }) => {
  const { attempt, access } = await attemptAccess(attemptId);
  if (attempt.userId !== access.user.id) throw new AppError("forbidden", "Only the student who submitted an attempt can ask for its review.");
  const { message } = await jsonBody(req, reviewRequestSchema);
  await requestReview(db, attempt.id, message);
  return json({ review: { attemptId: attempt.id, message, requestedAt: new Date() } }, 201);
});
