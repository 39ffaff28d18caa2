import { json, route } from "@/lib/http/route";
import { STAFF } from "@/lib/auth/access";
import { benchParts } from "@/lib/labs/parts-list";
import { partsCsv } from "@/lib/labs/parts";
import { labAccess } from "@/lib/labs/attempts";

type Params = { labId: string };

/** Staff: the resistors the lab's benches need, per value and per section; `?format=csv` for a spreadsheet. */
export const GET = route<Params>(async (req, { labId }) => {
  const { lab } = await labAccess(labId, STAFF);
  const list = await benchParts(lab);
  if (new URL(req.url).searchParams.get("format") === "csv") {
    const name = `parts-${lab.title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "lab"}.csv`;
    return new Response(partsCsv(list.rows, list.sections), {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}"` },
    });
  }
  return json({ parts: list.rows, sections: list.sections, students: list.students, drawn: list.drawn });
});
