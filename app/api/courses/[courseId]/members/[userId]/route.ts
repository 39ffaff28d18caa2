import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { changeMember, removeMember } from "@/lib/courses/roster";
import { updateMemberSchema } from "@/lib/validation/members";
import { uuidSchema } from "@/lib/validation/common";

type Params = { courseId: string; userId: string };

export const PATCH = route<Params>(async (req, { courseId, userId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  if (!uuidSchema.safeParse(userId).success) throw notFound("That member");
  const patch = await jsonBody(req, updateMemberSchema);
  return json({ member: await changeMember(courseId, userId, patch) });
});

export const DELETE = route<Params>(async (_req, { courseId, userId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  if (!uuidSchema.safeParse(userId).success) throw notFound("That member");
  await removeMember(courseId, userId);
  return json({ removed: true });
});
