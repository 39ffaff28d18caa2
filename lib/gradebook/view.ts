// Pure helpers the gradebook table and the student's row share: filtering, markers and number format.
import type { GradebookCell, GradebookStudent } from "@/db/queries/gradebook";

export interface Marker {
  key: "late" | "staff" | "review" | "simulated" | "missing" | "exception";
  symbol: string;
  label: string;
}

export const MARKERS: Record<Marker["key"], Marker> = {
  late: { key: "late", symbol: "L", label: "submitted late (penalty applied)" },
  staff: { key: "staff", symbol: "✎", label: "changed by staff" },
  review: { key: "review", symbol: "?", label: "review requested, not yet answered" },
  simulated: { key: "simulated", symbol: "S", label: "readings from the simulated bench" },
  missing: { key: "missing", symbol: "–", label: "not submitted" },
  exception: { key: "exception", symbol: "E", label: "own dates or extra attempts (exception)" },
};

export function cellMarkers(cell: GradebookCell | null, exceptionReason?: string): Marker[] {
  const exception = exceptionReason ? [{ ...MARKERS.exception, label: `${MARKERS.exception.label}: ${exceptionReason}` }] : [];
  if (!cell) return [MARKERS.missing, ...exception];
  const out: Marker[] = [...exception];
  if (cell.late) out.push(MARKERS.late);
  if (cell.changedByStaff) out.push(MARKERS.staff);
  if (cell.reviewOpen) out.push(MARKERS.review);
  if (cell.simulated) out.push(MARKERS.simulated);
  return out;
}

/** Students of one section (or all, for ""), whose name or e-mail contains the search text (any case). */
export function filterStudents<S extends Pick<GradebookStudent, "name" | "email" | "section">>(students: S[], section: string, search: string): S[] {
  const q = search.trim().toLocaleLowerCase();
  return students.filter(
    (s) => (section === "" || (s.section ?? "") === section) && (q === "" || s.name.toLocaleLowerCase().includes(q) || s.email.toLocaleLowerCase().includes(q)),
  );
}

/** The sections present, sorted; students without a section are left out of the list. */
export function sectionsOf(students: Pick<GradebookStudent, "section">[]): string[] {
  return [...new Set(students.map((s) => s.section).filter((s): s is string => !!s))].sort((a, b) => a.localeCompare(b));
}

/** A score as the table shows it: at most two decimals, no trailing zeros. */
export function formatScore(n: number): string {
  return String(Math.round(n * 100) / 100);
}
