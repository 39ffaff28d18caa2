import { json, jsonBody, readCapped, route } from "@/lib/http/route";
import { requireCourseRole, requireUser } from "@/lib/auth/access";
import { AppError } from "@/lib/errors";
import { mb, acceptUpload } from "@/lib/uploads/accept";
import { labAccess, variantFor } from "@/lib/labs/attempts";
import { maxUploadBytes } from "@/lib/uploads/storage";
import { requestUpload } from "@/lib/uploads/direct";
import { uploadRequestSchema } from "@/lib/validation/uploads";

// Two ways in. JSON `{ labId, name, size, type }` asks for an upload sent straight to storage: 201 with
// `{ upload: { id }, parts: [{ number, url }], partSize, expiresInSeconds }` (lib/uploads/direct.ts); the
// parts go to the URLs with PUT, then POST /api/uploads/{id}/complete. multipart/form-data with `file` and
// `labId` (or `courseId`) sends a small file (at most SHUNTWISE_MAX_UPLOAD_BYTES) through the app: 201
// with the upload.
// Who is calling is checked before a byte of the body is read; the body is counted as it streams and
// cut at the limit (413) whether or not it declares a Content-Length.
/** The id came in the form, not the address: a 404 for it names its field. */
const naming = (field: string, message: string) => (e: unknown): never => {
  if (e instanceof AppError && e.code === "not_found") throw new AppError("not_found", e.message, { [field]: [message] });
  throw e;
};

export const POST = route(async (req) => {
  await requireUser();
  if ((req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase() === "application/json") {
    const input = await jsonBody(req, uploadRequestSchema);
    const { lab, access } = await labAccess(input.labId).catch(naming("labId", "No lab of yours has this id."));
    return json(await requestUpload({ ownerId: access.user.id, courseId: lab.courseId, labId: lab.id, input }), 201);
  }
  const cap = maxUploadBytes() + 64 * 1024; // the file plus the form's own lines
  let body: Uint8Array;
  try {
    body = await readCapped(req, cap, "file");
  } catch (e) {
    if (e instanceof AppError && e.code === "payload_too_large") {
      throw new AppError("payload_too_large", `The file is larger than the ${mb(maxUploadBytes())} limit.`, { file: [`Files may be at most ${mb(maxUploadBytes())}.`] });
    }
    throw e;
  }
  let form: FormData;
  try {
    form = await new Response(body as BodyInit, { headers: { "content-type": req.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw new AppError("bad_request", "Send the file as multipart/form-data with a field named file.", { file: ["No file was sent."] });
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("bad_request", "Attach a file in the field named file.", { file: ["No file was sent."] });
  const labId = form.get("labId");
  const courseId = form.get("courseId");
  let owner: string, course: string, lab: string | null = null, params;
  if (typeof labId === "string" && labId) {
    const { lab: l, access } = await labAccess(labId).catch(naming("labId", "No lab of yours has this id."));
    owner = access.user.id;
    course = l.courseId;
    lab = l.id;
    params = await variantFor(l, owner);
  } else if (typeof courseId === "string" && courseId) {
    const access = await requireCourseRole(courseId).catch(naming("courseId", "No course of yours has this id."));
    owner = access.user.id;
    course = access.course.id;
  } else {
    throw new AppError("bad_request", "Say which lab the file belongs to (labId).", { labId: ["Give the lab's id."] });
  }
  const fileBytes = new Uint8Array(await file.arrayBuffer());
  const upload = await acceptUpload({ ownerId: owner, courseId: course, labId: lab, fileName: file.name || "upload", bytes: fileBytes, params });
  return json({ upload }, 201);
});
