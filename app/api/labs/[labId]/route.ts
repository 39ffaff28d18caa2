import { db } from "@/db";
import { findLab } from "@/db/queries/labs";
import { json, jsonBody, route } from "@/lib/http/route";
import { labPatchSchema } from "@/lib/validation/labs";
import { isStaff } from "@/lib/auth/access";
import { editLab } from "@/lib/labs/edit";
import { latestRegrade } from "@/lib/labs/regrade";
import { labAccess, toLab } from "@/lib/labs/attempts";
import { labFull, labPublic } from "@/lib/labs/view";

type Params = { labId: string };

export const GET = route<Params>(async (_req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  if (!isStaff(access.role)) return json({ lab: labPublic(lab) });
  return json({ lab: labFull(lab), regrade: (await latestRegrade(lab.id)) ?? null });
});

export const PATCH = route<Params>(async (req, { labId }) => {
  const { lab } = await labAccess(labId, ["instructor"]);
  const { regrade } = await editLab(lab, await jsonBody(req, labPatchSchema));
  const updated = toLab((await findLab(db, lab.id))!);
  return json({ lab: labFull(updated), regrade });
});
