import { db } from "@/db";
import { json, jsonBody, route } from "@/lib/http/route";
import { labAccess } from "@/lib/labs/attempts";
import { setLabGradesHeld } from "@/lib/mail/release";
import { gradesHeldSchema } from "@/lib/validation/mail";

// Hold a lab's grades ({ held: true }) or release them ({ held: false }: one message per student with
// their counted score). Instructor only.
export const PUT = route<{ labId: string }>(async (req, { labId }) => {
  const { lab } = await labAccess(labId, ["instructor"]);
  const { held } = await jsonBody(req, gradesHeldSchema);
  const r = await setLabGradesHeld(db, lab.id, held);
  return json({ lab: { id: lab.id, gradesHeld: r.held }, released: r.messages });
});
