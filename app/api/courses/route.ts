import { db } from "@/db";
import { listCoursesForUser } from "@/db/queries/courses";
import { json, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/access";

export const GET = route(async () => {
  const user = await requireUser();
  return json({ courses: await listCoursesForUser(db, user.id) });
});
