import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { Markdown } from "@/components/labs/handout";
import { PrintButton } from "@/components/labs/print-button";
import { Caution } from "@/components/lesson/Caution";
import { forPage, refused, STAFF } from "@/lib/auth/access";
import { kitsFor } from "@/lib/benches/kits-service";
import { labAccess } from "@/lib/labs/attempts";

export const metadata: Metadata = { title: "Kits" };

// What the lab technician packs from: one printed sheet per bench (bench, partners, parts for the bag, the
// lab's cautions), then the totals against the stockroom.
export default async function KitsPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const got = await forPage(labAccess(labId, STAFF), `/labs/${labId}/kits`);
  if (refused(got)) forbidden();
  const { lab, access } = got;
  const { kits, totals } = await kitsFor(lab);
  const short = totals.filter((t) => t.needed > t.inStock);
  return (
    <>
      <p className="no-print text-sm">
        <Link href={`/labs/${lab.id}`}>← {lab.title}</Link>
      </p>
      <h1 className="no-print mt-2 text-3xl">Kits: {lab.title}</h1>
      <p className="no-print mt-1 text-sm text-ink-soft">
        {access.course.code} · {kits.length} bag{kits.length === 1 ? "" : "s"}, one sheet each when printed. Parts come from the students&apos; stored circuits; a
        student whose circuit is not drawn yet adds nothing to a bag.
      </p>
      <p className="no-print mt-3 flex flex-wrap gap-3">
        <PrintButton />
        <a className="btn-quiet no-underline" href={`/api/labs/${lab.id}/kits?format=csv`} download>Download CSV</a>
      </p>

      <section aria-labelledby="totals-heading" className="no-print card mt-6 overflow-x-auto">
        <h2 id="totals-heading" className="text-lg">Totals against the stockroom</h2>
        {totals.length === 0 ? (
          <p className="mt-1 text-sm text-ink-soft">No part is needed yet.</p>
        ) : (
          <table className="mt-2 min-w-full text-sm">
            <caption className="sr-only">Parts needed in all and on the shelf</caption>
            <thead className="text-left">
              <tr>
                <th scope="col" className="pr-4">Part</th>
                <th scope="col" className="pr-4">Tolerance</th>
                <th scope="col" className="pr-4 text-right">Needed</th>
                <th scope="col" className="pr-4 text-right">In stock</th>
              </tr>
            </thead>
            <tbody>
              {totals.map((t) => (
                <tr key={`${t.value}|${t.tolerancePercent}`} className="border-t border-ink/10">
                  <td className="pr-4">{t.label}</td>
                  <td className="pr-4">{t.tolerancePercent === null ? "any" : `${t.tolerancePercent} %`}</td>
                  <td className="pr-4 text-right tabular-nums">{t.needed}</td>
                  <td className={`pr-4 text-right tabular-nums ${t.needed > t.inStock ? "text-verdict-wrong" : ""}`}>
                    {t.inStock}
                    {t.needed > t.inStock ? ` (short by ${t.needed - t.inStock})` : ""}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {short.length ? <p className="mt-2 text-sm text-verdict-wrong">{short.length} part value{short.length === 1 ? " is" : "s are"} short on the shelf.</p> : null}
      </section>

      {kits.map((k) => (
        <section key={k.bench ?? k.student?.userId} className="card mt-6 break-inside-avoid print:break-after-page" aria-label={k.bench ?? `Kit of ${k.student?.name}`} data-testid="kit">
          <h2 className="text-xl">{k.bench ?? `${k.student?.name} (no bench)`}</h2>
          <p className="text-sm">
            {access.course.code} · {lab.title}
          </p>
          <p className="mt-1 text-sm">
            {k.members.length > 1 ? "Partners" : "Student"}: {k.members.map((m) => m.name).join(", ")}
          </p>
          <h3 className="mt-3 font-semibold">Put in the bag</h3>
          {k.parts.length === 0 ? (
            <p className="text-sm text-ink-soft">Nothing yet: no circuit of this bench is drawn.</p>
          ) : (
            <ul className="mt-1 space-y-0.5 text-sm">
              {k.parts.map((p) => (
                <li key={`${p.value}|${p.tolerancePercent}`} className="tabular-nums">
                  <span aria-hidden="true">☐ </span>
                  {p.count} × {p.label}
                  {p.tolerancePercent === null ? "" : ` ${p.tolerancePercent} %`}
                </li>
              ))}
            </ul>
          )}
          <Caution title="before you build">
            {lab.safetyNotes.trim() ? <Markdown source={lab.safetyNotes} baseLevel={4} /> : <p>Build and change the circuit with the supply off, and check the meter&apos;s range before you connect it.</p>}
            <p>Follow your institution&apos;s lab rules; they come first.</p>
          </Caution>
        </section>
      ))}
    </>
  );
}
