import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { createLab, labsForCourse } from "@/lib/labs/attempts";
import { labSummary } from "@/lib/labs/view";
import { labInputSchema } from "@/lib/validation/labs";

type Params = { courseId: string };

export const GET = route<Params>(async (_req, { courseId }) => {
  const access = await requireCourseRole(courseId);
  const labs = await labsForCourse(access);
  return json({ labs: labs.map(labSummary) });
});

export const POST = route<Params>(async (req, { courseId }) => {
  const access = await requireCourseRole(courseId, ["instructor"]);
  const data = await jsonBody(req, labInputSchema);
  const id = await createLab(access, data);
  return json({ lab: { id, status: "draft" } }, 201);
});
