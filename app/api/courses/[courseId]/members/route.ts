import { db } from "@/db";
import { listMembers } from "@/db/queries/courses";
import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole, STAFF } from "@/lib/auth/access";
import { addMember } from "@/lib/courses/roster";
import { addMemberSchema } from "@/lib/validation/members";

type Params = { courseId: string };

export const GET = route<Params>(async (_req, { courseId }) => {
  await requireCourseRole(courseId, STAFF);
  const members = await listMembers(db, courseId);
  return json({ members });
});

export const POST = route<Params>(async (req, { courseId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  const input = await jsonBody(req, addMemberSchema);
  const member = await addMember(courseId, input);
  return json({ member }, 201);
});
