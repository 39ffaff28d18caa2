import { db } from "@/db";
import { listStock, replaceStock } from "@/db/queries/stock";
import { lockCourse } from "@/db/queries/courses";
import { json, jsonBody, route } from "@/lib/http/route";
import { requireCourseRole, STAFF } from "@/lib/auth/access";
import { stockSchema } from "@/lib/validation/stock";

type Params = { courseId: string };

export const GET = route<Params>(async (_req, { courseId }) => {
  await requireCourseRole(courseId, STAFF);
  return json({ items: await listStock(db, courseId) });
});

/** Replaces the stockroom's list in one transaction. */
export const PUT = route<Params>(async (req, { courseId }) => {
  await requireCourseRole(courseId, ["instructor"]);
  const { items } = await jsonBody(req, stockSchema);
  await db.transaction().execute(async (trx) => {
    await lockCourse(trx, courseId);
    await replaceStock(trx, courseId, items);
  });
  return json({ items: await listStock(db, courseId) });
});
