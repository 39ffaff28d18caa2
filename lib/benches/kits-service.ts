// The kits of a lab for its staff, from the stored circuits only (reading them draws nothing), the
// course's benches and its stockroom.
import "server-only";
import Papa from "papaparse";
import { db } from "@/db";
import { listArrangement } from "@/db/queries/benches";
import { listVariants } from "@/db/queries/labs";
import { listStock } from "@/db/queries/stock";
import type { Params } from "@/lib/grader";
import type { Lab } from "@/lib/labs/grading";
import { buildKits, type Kit } from "./kits";

export async function kitsFor(lab: Lab) {
  const [arrangement, stored, stock] = await Promise.all([listArrangement(db, lab.courseId), listVariants(db, lab.id), listStock(db, lab.courseId)]);
  const circuits = new Map<string, Params>(stored.map((v) => [v.userId, v.params as Params]));
  const plain = (m: { userId: string; name: string }) => ({ userId: m.userId, name: m.name });
  return buildKits(
    lab.templateKey,
    lab.spec,
    arrangement.benches.map((b) => ({ name: b.name, members: b.members.map(plain) })),
    arrangement.unseated.map(plain),
    circuits,
    stock,
  );
}

/** One row per kit line: the bag (bench or student), who works from it, and the part with its count. */
export function kitsCsv(kits: Kit[]): string {
  return (
    Papa.unparse(
      {
        fields: ["kit", "members", "part", "value_ohm", "tolerance_percent", "count"],
        data: kits.flatMap((k) =>
          k.parts.map((p) => [k.bench ?? k.student?.name ?? "", k.members.map((m) => m.name).join("; "), p.label, p.value, p.tolerancePercent ?? "", p.count]),
        ),
      },
      { newline: "\r\n", escapeFormulae: true },
    ) + "\r\n"
  );
}
