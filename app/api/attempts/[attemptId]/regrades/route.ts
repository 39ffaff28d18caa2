import { json, route } from "@/lib/http/route";
import { bodyOf, regradeAttempt } from "@/lib/labs/review";

// Course staff change one question's points (`{ questionId, points, reason }`) or re-run the grader on the
// stored readings with the lab as it is now (`{ rerun: true, reason }`); both are kept in the grade history.
export const POST = route<{ attemptId: string }>(async (req, { attemptId }) => {
  return json({ attempt: await regradeAttempt(attemptId, bodyOf(req)) }, 201);
});
