import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { CopyFromLibrary, InstrumentEditor } from "@/components/instruments/instrument-editor";
import { RangeTable } from "@/components/instruments/range-table";
import { QueryProvider } from "@/components/providers/query-provider";
import { forPage, refused, requireCourseRole } from "@/lib/auth/access";
import { LIBRARY } from "@/lib/instruments/library";
import { courseInstruments } from "@/lib/instruments/service";

export const metadata: Metadata = { title: "Instruments" };

export default async function InstrumentsPage({ params }: { params: Promise<{ courseId: string }> }) {
  const { courseId } = await params;
  const access = await forPage(requireCourseRole(courseId), `/courses/${courseId}/instruments`);
  if (refused(access)) forbidden();
  const instruments = await courseInstruments(courseId);
  const canEdit = access.role === "instructor";
  return (
    <>
      <p className="text-sm">
        <Link href={`/courses/${courseId}`}>← {access.course.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl">Instruments</h1>
      <p className="mt-1 mb-6 text-sm text-ink-soft">
        The meters of this course&apos;s benches, each with its range table: full scale, shunt or burden, resolution and accuracy per range. A lab takes its readings with
        one of them; its expected values and the band a bench reading is accepted in follow from that meter.
        {canEdit ? " Type values with their units (5 µA, 10 kΩ, 50 mV); resolution is a number of counts, or the converter's bits (14 bit) with its reference." : ""}
      </p>
      <QueryProvider>
        {instruments.map((i) => (
          <section key={i.id} className="mb-8" aria-labelledby={`h-${i.id}`}>
            <h2 id={`h-${i.id}`} className="text-xl">
              {i.name} <span className="text-sm text-ink-soft">({i.kind})</span>
            </h2>
            {i.description ? <p className="text-sm">{i.description}</p> : null}
            <RangeTable profile={i} />
            {canEdit ? <InstrumentEditor id={i.id} profile={i} /> : null}
          </section>
        ))}
        {canEdit ? (
          <section aria-labelledby="h-library">
            <h2 id="h-library" className="text-xl">
              Add an instrument
            </h2>
            <p className="text-sm text-ink-soft">Copy the built-in profile closest to your meter, then enter your meter&apos;s own range table from its manual.</p>
            <CopyFromLibrary courseId={courseId} library={LIBRARY.map((l) => ({ libraryKey: l.libraryKey, name: l.name }))} />
          </section>
        ) : null}
      </QueryProvider>
    </>
  );
}
