import { json, jsonBody, route } from "@/lib/http/route";
import { exceptionJson, grantException, removeException } from "@/lib/labs/exceptions";
import { labAccess } from "@/lib/labs/attempts";
import { exceptionSchema } from "@/lib/validation/exceptions";

type Params = { labId: string; userId: string };

// One student's own due date, close and/or extra attempts at a lab, with the instructor's reason.
export const PUT = route<Params>(async (req, { labId, userId }) => {
  const { lab, access } = await labAccess(labId, ["instructor"]);
  const input = await jsonBody(req, exceptionSchema);
  return json({ exception: exceptionJson(await grantException(lab, userId, input, access.user.id)) });
});

export const DELETE = route<Params>(async (_req, { labId, userId }) => {
  const { lab, access } = await labAccess(labId, ["instructor"]);
  return json({ removed: await removeException(lab, userId, access.user.id) });
});
