import { json, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { regenerateJoinCode } from "@/lib/courses/admin";

type Params = { courseId: string };

/** A new join code; the old one stops working at once. */
export const POST = route<Params>(async (_req, { courseId }) => {
  const access = await requireCourseRole(courseId, ["instructor"]);
  return json({ joinCode: await regenerateJoinCode(access.course.id, access.course.code) });
});
