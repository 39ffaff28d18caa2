// The bench parts list of a lab: every resistor value the students' circuits need, counted per value and
// per section, so the lab technician can stock the benches before the session.
import Papa from "papaparse";
import { formatQuantity, templates, type Params, type TemplateKey } from "@/lib/grader";
import type { VariantSpec } from "@/lib/grader";

export interface PartStudent {
  userId: string;
  section: string | null;
}

export interface PartRow {
  /** the resistance in ohms */
  value: number;
  /** "4.7 kΩ" */
  label: string;
  /** tolerance of the parts in percent, when the lab names it */
  tolerancePercent: number | null;
  /** which of the circuit's resistors need this value ("Load resistance", "Shunt resistance") */
  uses: string[];
  total: number;
  bySection: Record<string, number>;
}

export const NO_SECTION = "no section";

/** The template's resistor parameters as the lab draws them. */
export function resistorParameters(templateKey: TemplateKey, spec: VariantSpec) {
  return templates[templateKey].parameters
    .filter((p) => p.kind === "resistor")
    .map((p) => ({ key: p.key, label: p.label, tolerancePercent: spec.parameters[p.key]?.tolerancePercent ?? null }));
}

/** Counts one resistor per resistor parameter per student circuit, by value (and tolerance) and section. */
export function countParts(templateKey: TemplateKey, spec: VariantSpec, students: PartStudent[], circuits: Map<string, Params>): { rows: PartRow[]; sections: string[] } {
  const resistors = resistorParameters(templateKey, spec);
  const rows = new Map<string, PartRow>();
  const sections = new Set<string>();
  for (const s of students) {
    const params = circuits.get(s.userId);
    if (!params) continue;
    const section = s.section ?? NO_SECTION;
    sections.add(section);
    for (const r of resistors) {
      const value = params[r.key];
      if (typeof value !== "number") continue;
      const key = `${value}|${r.tolerancePercent ?? ""}`;
      let row = rows.get(key);
      if (!row) {
        row = { value, label: formatQuantity(value, "ohm"), tolerancePercent: r.tolerancePercent, uses: [], total: 0, bySection: {} };
        rows.set(key, row);
      }
      if (!row.uses.includes(r.label)) row.uses.push(r.label);
      row.total++;
      row.bySection[section] = (row.bySection[section] ?? 0) + 1;
    }
  }
  return {
    rows: [...rows.values()].sort((a, b) => a.value - b.value || (a.tolerancePercent ?? 0) - (b.tolerancePercent ?? 0)),
    sections: [...sections].sort((a, b) => (a === NO_SECTION ? 1 : b === NO_SECTION ? -1 : a.localeCompare(b, "en", { numeric: true }))),
  };
}

/** The list as CSV: value in ohms, label, tolerance, uses, total, then one column per section. */
export function partsCsv(rows: PartRow[], sections: string[]): string {
  return Papa.unparse(
    {
      fields: ["value_ohm", "value", "tolerance_percent", "used_as", "total", ...sections.map((s) => `section ${s}`)],
      data: rows.map((r) => [r.value, r.label, r.tolerancePercent ?? "", r.uses.join("; "), r.total, ...sections.map((s) => r.bySection[s] ?? 0)]),
    },
    { newline: "\r\n" },
  ) + "\r\n";
}
