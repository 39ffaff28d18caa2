import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { forPage, refused, STAFF } from "@/lib/auth/access";
import { benchParts } from "@/lib/labs/parts-list";
import { labAccess } from "@/lib/labs/attempts";
import { PrintButton } from "@/components/labs/print-button";

export const metadata: Metadata = { title: "Bench parts list" };

export default async function PartsPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const got = await forPage(labAccess(labId, STAFF), `/labs/${labId}/parts`);
  if (refused(got)) forbidden();
  const { lab, access } = got;
  const list = await benchParts(lab);
  const total = list.rows.reduce((a, r) => a + r.total, 0);
  return (
    <>
      <p className="no-print text-sm">
        <Link href={`/labs/${lab.id}`}>← {lab.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl">Bench parts list: {lab.title}</h1>
      <p className="mt-1 text-sm text-ink-soft">
        {access.course.code} · {list.students} student{list.students === 1 ? "" : "s"}, one circuit each · {total} resistor{total === 1 ? "" : "s"} in all.
        {list.drawn < list.students
          ? lab.status === "published"
            ? ` Circuits drawn so far: ${list.drawn} of ${list.students}; publishing draws the rest in the background (a student who joins later is drawn on first opening the lab). Reload to see the whole list.`
            : ` The circuits are drawn when the lab is published; this draft counts ${list.drawn} of ${list.students}.`
          : ""}
      </p>
      <p className="no-print mt-3 flex gap-3">
        <PrintButton />
        <a className="btn-quiet no-underline" href={`/api/labs/${lab.id}/parts?format=csv`} download>Download CSV</a>
      </p>
      {list.rows.length === 0 ? (
        <p className="card mt-6">This lab&apos;s circuits use no resistors that the students place, or the course has no students yet.</p>
      ) : (
        <div className="card mt-6 overflow-x-auto p-0">
          <table className="min-w-full text-sm">
            <caption className="sr-only">Resistors per value and per section</caption>
            <thead className="bg-paper-sunk text-left">
              <tr>
                <th scope="col" className="px-4 py-2">Value</th>
                <th scope="col" className="px-4 py-2">Tolerance</th>
                <th scope="col" className="px-4 py-2">Used as</th>
                <th scope="col" className="px-4 py-2 text-right">Total</th>
                {list.sections.map((s) => (
                  <th key={s} scope="col" className="px-4 py-2 text-right">{s === "no section" ? "No section" : `Section ${s}`}</th>
                ))}
              </tr>
            </thead>
            <tbody>
              {list.rows.map((r) => (
                <tr key={`${r.value}|${r.tolerancePercent}`} className="border-t border-ink/10">
                  <td className="px-4 py-2 font-mono">{r.label}</td>
                  <td className="px-4 py-2">{r.tolerancePercent === null ? "—" : `±${r.tolerancePercent} %`}</td>
                  <td className="px-4 py-2">{r.uses.join(", ")}</td>
                  <td className="px-4 py-2 text-right font-mono font-semibold">{r.total}</td>
                  {list.sections.map((s) => (
                    <td key={s} className="px-4 py-2 text-right font-mono">{r.bySection[s] ?? 0}</td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <p className="mt-4 text-xs text-ink-faint">Stock a few spares of each value; a student who breaks a part needs the same value again.</p>
    </>
  );
}
