// The gradebook as CSV: one row per student (name, e-mail, section, one column per lab, total), with a
// header. Built with papaparse; a text cell that a spreadsheet would run as a formula (starting with
// =, +, -, @, a tab or a carriage return) is prefixed with an apostrophe (papaparse's escapeFormulae).
import Papa from "papaparse";
import type { Gradebook } from "@/db/queries/gradebook";

export function gradebookCsv(g: Gradebook): string {
  const fields = ["name", "email", "section", ...g.labs.map((l) => l.title), "total"];
  const data = g.students.map((s) => [
    s.name,
    s.email,
    s.section ?? "",
    ...g.labs.map((l) => s.cells[l.id]?.score ?? ""),
    s.total ?? "",
  ]);
  // A BOM so that spreadsheets read the file as UTF-8.
  return "\uFEFF" + Papa.unparse({ fields, data }, { escapeFormulae: true, newline: "\r\n" });
}
