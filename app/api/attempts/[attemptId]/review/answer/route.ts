import { json, route } from "@/lib/http/route";
import { bodyOf, answerReview } from "@/lib/labs/review";

// Course staff answer the student's review request (`{ message }`), which closes it.
export const POST = route<{ attemptId: string }>(async (req, { attemptId }) => {
  return json({ review: await answerReview(attemptId, bodyOf(req)) }, 201);
});
