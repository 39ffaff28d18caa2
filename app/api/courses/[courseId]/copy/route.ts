import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { copyCourse } from "@/lib/courses/admin";
import { copyCourseSchema } from "@/lib/validation/courses";

type Params = { courseId: string };

/** Copies the course into a new term: lesson plan and labs as drafts with shifted dates; no members or attempts. */
export const POST = route<Params>(async (req, { courseId }) => {
  const access = await requireCourseRole(courseId, ["instructor"]);
  const input = await jsonBody(req, copyCourseSchema);
  return json(await copyCourse(access.course.id, access.user, input), 201);
});
