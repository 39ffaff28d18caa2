import { json, route } from "@/lib/http/route";
import { STAFF } from "@/lib/auth/access";
import { kitsCsv, kitsFor } from "@/lib/benches/kits-service";
import { labAccess } from "@/lib/labs/attempts";

type Params = { labId: string };

/** Staff: what goes in each bench's bag, and the totals against the stockroom; `?format=csv` one row per kit line. */
export const GET = route<Params>(async (req, { labId }) => {
  const { lab } = await labAccess(labId, STAFF);
  const { kits, totals } = await kitsFor(lab);
  if (new URL(req.url).searchParams.get("format") === "csv") {
    const name = `kits-${lab.title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "lab"}.csv`;
    return new Response(kitsCsv(kits), { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}"` } });
  }
  return json({ kits, totals });
});
