import { db } from "@/db";
import { listCoursesForUser } from "@/db/queries/courses";
import { json, jsonBody, route } from "@/lib/http/route";
import { requireAdmin, requireUser } from "@/lib/auth/access";
import { createCourse } from "@/lib/courses/admin";
import { createCourseSchema } from "@/lib/validation/courses";

export const GET = route(async () => {
  const user = await requireUser();
  return json({ courses: await listCoursesForUser(db, user.id) });
});

/** The site admin creates a course with its first instructor (invited when they have no account yet). */
export const POST = route(async (req) => {
  await requireAdmin();
  const input = await jsonBody(req, createCourseSchema);
  return json(await createCourse(input), 201);
});
