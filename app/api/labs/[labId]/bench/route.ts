import { json, route } from "@/lib/http/route";
import { labAccess } from "@/lib/labs/attempts";
import { benchFor } from "@/lib/labs/simulated-bench";
import { benchQuerySchema } from "@/lib/validation/bench";
import { parseOr400 } from "@/lib/validation/zod-errors";

// The caller's simulated bench: its seed, the lab's instrument and their circuit (404 where the lab has none);
// staff may name a student with ?userId=.
export const GET = route<{ labId: string }>(async (req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  const { userId } = parseOr400(benchQuerySchema, Object.fromEntries(new URL(req.url).searchParams));
  return json({ bench: await benchFor(lab, access, userId) });
});
