import { db } from "@/db";
import { gradebook, gradebookJson } from "@/db/queries/gradebook";
import { route } from "@/lib/http/route";
import { assertRole, requireCourseRole, STAFF } from "@/lib/auth/access";
import { gradebookCsv } from "@/lib/gradebook/csv";
import { gradebookQuerySchema } from "@/lib/validation/gradebook";
import { parseOr400 } from "@/lib/validation/zod-errors";

type Params = { courseId: string };

// Staff read the gradebook as JSON (PostgreSQL builds the document; it is passed on as it is); only the
// instructor exports it as CSV.
export const GET = route<Params>(async (req, { courseId }) => {
  const access = await requireCourseRole(courseId, STAFF);
  const { format } = parseOr400(gradebookQuerySchema, Object.fromEntries(new URL(req.url).searchParams));
  if (format === "csv") {
    assertRole(access, ["instructor"]);
    const csv = gradebookCsv(await gradebook(db, courseId));
    const name = `${access.course.code.replace(/[^A-Za-z0-9._-]+/g, "-")}-gradebook.csv`;
    return new Response(csv, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${name}"`,
        "cache-control": "no-store",
      },
    });
  }
  return new Response(await gradebookJson(db, courseId), {
    headers: { "content-type": "application/json", "cache-control": "no-store" },
  });
});
