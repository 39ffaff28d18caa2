import { json, route } from "@/lib/http/route";
import { labAccess } from "@/lib/labs/attempts";
import { benchReadings } from "@/lib/labs/simulated-bench";
import { benchReadingsQuerySchema } from "@/lib/validation/bench";
import { parseOr400 } from "@/lib/validation/zod-errors";

// Replays readings of a simulated bench: exactly what the browser showed for that range, filter and time.
// Staff may name a student with ?userId=; anyone else's bench is not found.
export const GET = route<{ labId: string }>(async (req, { labId }) => {
  const { lab, access } = await labAccess(labId);
  const query = parseOr400(benchReadingsQuerySchema, Object.fromEntries(new URL(req.url).searchParams));
  return json({ readings: await benchReadings(lab, access, query) });
});
