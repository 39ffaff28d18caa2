import { json, route } from "@/lib/api";
import { isStaff } from "@/lib/auth/access";
import { editLab } from "@/lib/labs/edit";
import { latestRegrade } from "@/lib/labs/regrade";
import { labAccess } from "@/lib/labs/service";
import { labFull, labPublic } from "@/lib/labs/view";

type Params = { labId: string };

export const GET = route<Params>(async (_req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  if (!isStaff(access.role)) return json({ lab: labPublic(lab) });
  return json({ lab: labFull(lab), regrade: (await latestRegrade(lab.id)) ?? null });
});

export const PATCH = route<Params>(async (req, { labId }) => {
  const { lab } = await labAccess(labId, ["instructor"]);
  let body: unknown;
  try {
    body = await req.json();
  } catch {
    return json({ error: { code: "bad_request", message: "The request body must be JSON." } }, 400);
  }
  const { regrade } = await editLab(lab, body);
  const { lab: updated } = await labAccess(labId, ["instructor"]);
  return json({ lab: labFull(updated), regrade });
});
