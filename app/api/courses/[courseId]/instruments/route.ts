import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { courseInstruments, createInstrument } from "@/lib/instruments/service";
import { instrumentCreateSchema } from "@/lib/validation/instruments";

type Params = { courseId: string };

export const GET = route<Params>(async (_req, { courseId }) => {
  await requireCourseRole(courseId);
  return json({ instruments: await courseInstruments(courseId) });
});

export const POST = route<Params>(async (req, { courseId }) => {
  const access = await requireCourseRole(courseId, ["instructor"]);
  const input = await jsonBody(req, instrumentCreateSchema);
  return json({ instrument: await createInstrument(access, input) }, 201);
});
