"use client";
// The gradebook table: students against labs, fetched with TanStack Query, sorted with TanStack Table
// (v9: features declared up front), rows virtualised with TanStack Virtual so a thousand students
// scroll smoothly. The header row and the student column stay in place while scrolling.
import { useQuery } from "@tanstack/react-query";
import { createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, sortFn_basic, tableFeatures, useTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { useVirtualizer } from "@tanstack/react-virtual";
import Link from "next/link";
import { useMemo, useRef, useState } from "react";
import type { Gradebook, GradebookStudent } from "@/db/queries/gradebook";
import { api } from "@/lib/http/client";
import { cellMarkers, filterStudents, formatScore, MARKERS, sectionsOf } from "@/lib/gradebook/view";

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
});

const ROW_HEIGHT = 44;

export const gradebookKey = (courseId: string) => ["gradebook", courseId] as const;

export function GradebookTable({ courseId, canExport }: { courseId: string; canExport: boolean }) {
  const q = useQuery({ queryKey: gradebookKey(courseId), queryFn: ({ signal }) => api<Gradebook>(`/api/courses/${courseId}/gradebook`, { signal }) });
  const [section, setSection] = useState("");
  const [search, setSearch] = useState("");
  const [sorting, setSorting] = useState<SortingState>([]);
  const scroller = useRef<HTMLDivElement>(null);

  const labs = useMemo(() => q.data?.labs ?? [], [q.data]);
  const students = useMemo(() => q.data?.students ?? [], [q.data]);
  const sections = useMemo(() => sectionsOf(students), [students]);
  const rows = useMemo(() => filterStudents(students, section, search), [students, section, search]);

  const columns = useMemo<ColumnDef<typeof features, GradebookStudent>[]>(
    () => [
      { id: "name", header: "Student", accessorFn: (s) => s.name, sortFn: "alphanumeric" },
      { id: "section", header: "Section", accessorFn: (s) => s.section ?? "", sortFn: "alphanumeric" },
      ...labs.map(
        (l): ColumnDef<typeof features, GradebookStudent> => ({
          id: l.id,
          header: l.title,
          // not submitted sorts below every score
          accessorFn: (s) => s.cells[l.id]?.score ?? -1,
          sortFn: "basic",
          sortDescFirst: true,
        }),
      ),
      { id: "total", header: "Total %", accessorFn: (s) => s.total ?? -1, sortFn: "basic", sortDescFirst: true },
    ],
    [labs],
  );

  const table = useTable({
    features,
    columns,
    data: rows,
    state: { sorting },
    onSortingChange: setSorting,
    getRowId: (s) => s.userId,
  });
  const sortedRows = table.getRowModel().rows;

  const virtualizer = useVirtualizer({
    count: sortedRows.length,
    getScrollElement: () => scroller.current,
    estimateSize: () => ROW_HEIGHT,
    overscan: 12,
  });
  const items = virtualizer.getVirtualItems();
  const padTop = items.length ? items[0].start : 0;
  const padBottom = items.length ? virtualizer.getTotalSize() - items[items.length - 1].end : 0;

  if (q.isPending) return <p role="status">Loading the gradebook…</p>;
  if (q.isError) return <p role="alert" className="text-verdict-wrong">{q.error.message}</p>;

  const sortLabel = (id: string) => {
    const s = sorting.find((x) => x.id === id);
    return s ? (s.desc ? "descending" : "ascending") : "none";
  };

  return (
    <section aria-labelledby="gradebook-table-heading" className="mt-6">
      <h2 id="gradebook-table-heading" className="sr-only">
        Students and labs
      </h2>
      <div className="flex flex-wrap items-end gap-4">
        <label className="text-sm">
          <span className="field-label">Section</span>
          <select className="field-input" value={section} onChange={(e) => setSection(e.target.value)} aria-label="Section">
            <option value="">All sections</option>
            {sections.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          <span className="field-label">Search</span>
          <input className="field-input" type="search" placeholder="Name or e-mail" value={search} onChange={(e) => setSearch(e.target.value)} aria-label="Search by name or e-mail" />
        </label>
        <p className="text-sm text-ink-soft" aria-live="polite" data-testid="student-count">
          {rows.length} of {students.length} students
        </p>
        {canExport ? (
          <a className="btn-quiet ml-auto" href={`/api/courses/${courseId}/gradebook?format=csv`} download>
            Download CSV
          </a>
        ) : null}
      </div>
      <p className="mt-2 text-xs text-ink-soft">
        Each cell is the counted attempt&apos;s score after any late penalty.{" "}
        {Object.values(MARKERS).map((m) => (
          <span key={m.key} className="mr-3 whitespace-nowrap">
            <span aria-hidden="true" className="font-semibold">
              {m.symbol}
            </span>{" "}
            {m.label}
          </span>
        ))}
      </p>
      <div ref={scroller} className="card mt-3 max-h-[70vh] overflow-auto p-0" data-testid="gradebook-scroller" tabIndex={0} aria-label="Gradebook table, scrollable">
        <table className="border-separate border-spacing-0 text-sm" aria-rowcount={sortedRows.length + 1}>
          <caption className="sr-only">Counted scores of every student in every lab, with the course total</caption>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h, i) => {
                  const lab = labs.find((l) => l.id === h.column.id);
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      aria-sort={sortLabel(h.column.id)}
                      className={`sticky top-0 z-10 border-b border-ink/15 bg-paper-sunk px-3 py-2 text-left align-bottom font-semibold ${i === 0 ? "left-0 z-20 min-w-56" : "min-w-28"}`}
                    >
                      <button type="button" className="text-left hover:underline" onClick={h.column.getToggleSortingHandler()}>
                        {String(h.column.columnDef.header)}
                        {lab ? <span className="block text-xs font-normal text-ink-soft">of {formatScore(lab.maxPoints)}</span> : null}
                        <span aria-hidden="true">{h.column.getIsSorted() === "asc" ? " ▲" : h.column.getIsSorted() === "desc" ? " ▼" : ""}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {padTop > 0 ? (
              <tr aria-hidden="true">
                <td style={{ height: padTop }} colSpan={columns.length} />
              </tr>
            ) : null}
            {items.map((vi) => {
              const row = sortedRows[vi.index];
              const s = row.original;
              return (
                <tr key={row.id} style={{ height: ROW_HEIGHT }} className="group" data-student={s.userId}>
                  <th scope="row" className="sticky left-0 z-[5] border-b border-ink/10 bg-paper-raised px-3 py-1 text-left font-normal group-hover:bg-paper-sunk">
                    <Link href={`/courses/${courseId}/gradebook/students/${s.userId}`} className="font-medium">
                      {s.name}
                    </Link>
                    <span className="block truncate text-xs text-ink-soft">{s.email}</span>
                  </th>
                  <td className="border-b border-ink/10 px-3 py-1 group-hover:bg-paper-sunk">{s.section ?? ""}</td>
                  {labs.map((l) => {
                    const c = s.cells[l.id];
                    const marks = cellMarkers(c, s.exceptions?.[l.id]);
                    const title = marks.map((m) => m.label).join(", ");
                    return (
                      <td key={l.id} className="border-b border-ink/10 px-3 py-1 tabular-nums group-hover:bg-paper-sunk">
                        {c ? (
                          <Link href={`/attempts/${c.attemptId}`} aria-label={`${s.name}, ${l.title}: ${formatScore(c.score)} of ${formatScore(c.maxScore)}${title ? `, ${title}` : ""}`}>
                            {formatScore(c.score)}
                          </Link>
                        ) : null}
                        {marks.length ? (
                          <span className="ml-1 text-xs text-copper-dark" title={title} aria-hidden={c ? true : undefined}>
                            {marks.map((m) => m.symbol).join("")}
                            {c ? null : <span className="sr-only">{title}</span>}
                          </span>
                        ) : null}
                      </td>
                    );
                  })}
                  <td className="border-b border-ink/10 px-3 py-1 font-semibold tabular-nums group-hover:bg-paper-sunk">{s.total === null ? "" : formatScore(s.total)}</td>
                </tr>
              );
            })}
            {padBottom > 0 ? (
              <tr aria-hidden="true">
                <td style={{ height: padBottom }} colSpan={columns.length} />
              </tr>
            ) : null}
          </tbody>
        </table>
        {rows.length === 0 ? <p className="p-4 text-sm text-ink-soft">No student matches.</p> : null}
      </div>
    </section>
  );
}
