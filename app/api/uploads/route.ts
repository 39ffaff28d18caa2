import { json, route } from "@/lib/api";
import { requireCourseRole } from "@/lib/auth/access";
import { AppError } from "@/lib/errors";
import { mb, acceptUpload } from "@/lib/uploads";
import { labAccess, variantFor } from "@/lib/labs/service";
import { maxUploadBytes } from "@/lib/storage";

// multipart/form-data with `file` and `labId` (or `courseId`). 201 with the upload's id.
export const POST = route(async (req) => {
  const declared = Number(req.headers.get("content-length") ?? 0);
  if (declared > maxUploadBytes() + 64 * 1024) {
    throw new AppError("payload_too_large", `The file is larger than the ${mb(maxUploadBytes())} limit.`, { file: [`Files may be at most ${mb(maxUploadBytes())}.`] });
  }
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new AppError("bad_request", "Send the file as multipart/form-data with a field named file.", { file: ["No file was sent."] });
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("bad_request", "Attach a file in the field named file.", { file: ["No file was sent."] });
  const labId = form.get("labId");
  const courseId = form.get("courseId");
  let owner: string, course: string, lab: string | null = null, params;
  if (typeof labId === "string" && labId) {
    const { lab: l, access } = await labAccess(labId);
    owner = access.user.id;
    course = l.courseId;
    lab = l.id;
    params = await variantFor(l, owner);
  } else if (typeof courseId === "string" && courseId) {
    const access = await requireCourseRole(courseId);
    owner = access.user.id;
    course = access.course.id;
  } else {
    throw new AppError("bad_request", "Say which lab the file belongs to (labId).", { labId: ["Give the lab's id."] });
  }
  const bytes = new Uint8Array(await file.arrayBuffer());
  const upload = await acceptUpload({ ownerId: owner, courseId: course, labId: lab, fileName: file.name || "upload", bytes, params });
  return json({ upload }, 201);
});
