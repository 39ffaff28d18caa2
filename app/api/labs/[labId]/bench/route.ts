import { json, route } from "@/lib/http/route";
import { labAccess } from "@/lib/labs/attempts";
import { benchFor } from "@/lib/labs/simulated-bench";

// The caller's simulated bench: its seed, the lab's instrument and their circuit (404 where the lab has none).
export const GET = route<{ labId: string }>(async (_req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  return json({ bench: await benchFor(lab, access) });
});
