import { json, route } from "@/lib/http/route";
import { handoutFor } from "@/lib/labs/handout";
import { labAccess } from "@/lib/labs/attempts";

// The caller's own circuit values and the questions, with units.
export const GET = route<{ labId: string }>(async (_req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  return json({ handout: await handoutFor(lab, access.user.id) });
});
