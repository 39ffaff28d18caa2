import { db } from "@/db";
import { courseLabIds, labWeights, setLabWeights } from "@/db/queries/gradebook";
import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole } from "@/lib/auth/access";
import { AppError } from "@/lib/errors";
import { labWeightsSchema } from "@/lib/validation/gradebook";

type Params = { courseId: string };

export const GET = route<Params>(async (_req, { courseId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  return json({ weights: (await labWeights(db, courseId)).map((l) => ({ labId: l.id, title: l.title, weight: l.weight })) });
});

export const PUT = route<Params>(async (req, { courseId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  const { weights } = await jsonBody(req, labWeightsSchema);
  const known = await courseLabIds(db, courseId);
  const fields: Record<string, string[]> = {};
  weights.forEach((w, i) => {
    if (!known.has(w.labId)) fields[`weights.${i}.labId`] = ["No such lab in this course."];
  });
  if (Object.keys(fields).length) throw new AppError("bad_request", "Some labs are not in this course.", fields);
  await db.transaction().execute((trx) => setLabWeights(trx, courseId, weights));
  return json({ weights: (await labWeights(db, courseId)).map((l) => ({ labId: l.id, title: l.title, weight: l.weight })) });
});
