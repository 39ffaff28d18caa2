import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { importMembers } from "@/lib/courses/roster";
import { importMembersSchema } from "@/lib/validation/members";

type Params = { courseId: string };

/** Preview (`confirm: false`, saves nothing) or import students from a CSV of name, e-mail and section. */
export const POST = route<Params>(async (req, { courseId }) => {
  const access = await requireCourseRole(courseId, ["instructor"]);
  const { csv, confirm } = await jsonBody(req, importMembersSchema);
  return json(await importMembers(access.course.id, csv, confirm));
});
