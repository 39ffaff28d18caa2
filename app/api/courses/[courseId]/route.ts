import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { changeCourseSettings } from "@/lib/courses/admin";
import { courseSettingsSchema } from "@/lib/validation/courses";

type Params = { courseId: string };

/** The course and its settings; the join code only for the staff. */
export const GET = route<Params>(async (_req, { courseId }) => {
  const { course, role } = await requireCourseRole(courseId);
  const { joinCode, joiningOpen, defaultLatePenaltyPercentPerDay, defaultLateFloorPercent, ...pub } = course;
  return json({ course: role === "student" ? pub : { ...pub, joinCode, joiningOpen, defaultLatePenaltyPercentPerDay, defaultLateFloorPercent } });
});

/** Instructor: title, term, joining open or closed, default late policy for new labs. */
export const PATCH = route<Params>(async (req, { courseId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  const input = await jsonBody(req, courseSettingsSchema);
  return json(await changeCourseSettings(courseId, input));
});
