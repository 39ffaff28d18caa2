import { json, route } from "@/lib/http/route";
import { reviewQueue } from "@/lib/labs/review";

// The course's review requests: open ones first (oldest first), then answered ones.
// Filters: status=open|answered|all, labId, section, mistake, late, changed (true or false).
export const GET = route<{ courseId: string }>(async (req, { courseId }) => {
  const { reviews } = await reviewQueue(courseId, new URL(req.url).searchParams);
  return json({ reviews });
});
