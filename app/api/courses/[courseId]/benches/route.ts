import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole, STAFF } from "@/lib/auth/access";
import { arrangement, arrangementJson, saveArrangement } from "@/lib/benches/service";
import { benchesSchema } from "@/lib/validation/benches";

type Params = { courseId: string };

export const GET = route<Params>(async (_req, { courseId }) => {
  await requireCourseRole(courseId, STAFF);
  return json(arrangementJson(await arrangement(courseId)));
});

export const PUT = route<Params>(async (req, { courseId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  const input = await jsonBody(req, benchesSchema);
  return json(arrangementJson(await saveArrangement(courseId, input)));
});
