// Reading a roster CSV (name, e-mail, section, optionally bench) and marking what importing each row would do.
// Pure: the caller looks up which addresses have accounts and passes them in.
import Papa from "papaparse";
import type { Role } from "@/db/types";
import { emailSchema } from "@/lib/validation/auth";

export type ImportOutcome = "invite" | "add" | "member" | "bad_email" | "duplicate" | "bad_row";

export interface ImportRow {
  /** line of the file, counting from 1 (the header row included) */
  line: number;
  email: string;
  name: string;
  section: string | null;
  /** the bench to seat the student at (the optional `bench` column), or null */
  bench: string | null;
  outcome: ImportOutcome;
  message?: string;
}

export interface CsvEntry {
  line: number;
  name: string;
  email: string;
  section: string;
  bench: string;
}

const AS_ROLE: Record<Role, string> = { student: "a student", ta: "a teaching assistant", instructor: "an instructor" };

const HEADER = { name: /^(full\s*)?name$/i, email: /^e-?mail(\s*address)?$/i, section: /^(section|group|lab\s*section)$/i, bench: /^bench(\s*(name|number|no\.?))?$/i };

/** At most this many students at one bench (lib/validation/benches.ts MAX_AT_BENCH). */
const MAX_AT_BENCH = 4;
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;

/** Splits the CSV into entries. A first row naming an e-mail column is a header; otherwise columns are name, e-mail, section, bench. */
export function readRosterCsv(csv: string): CsvEntry[] {
  const parsed = Papa.parse<string[]>(csv.replace(/^\uFEFF/, ""), { skipEmptyLines: false, delimiter: "" });
  const rows = parsed.data.map((cells, i) => ({ line: i + 1, cells: cells.map((c) => (c ?? "").trim()) }));
  let cols = { name: 0, email: 1, section: 2, bench: 3 };
  let start = 0;
  const first = rows.find((r) => r.cells.some((c) => c !== ""));
  if (first && first.cells.some((c) => HEADER.email.test(c))) {
    const find = (re: RegExp) => first.cells.findIndex((c) => re.test(c));
    cols = { name: find(HEADER.name), email: find(HEADER.email), section: find(HEADER.section), bench: find(HEADER.bench) };
    start = rows.indexOf(first) + 1;
  }
  const at = (cells: string[], i: number) => (i >= 0 ? (cells[i] ?? "") : "");
  return rows
    .slice(start)
    .filter((r) => r.cells.some((c) => c !== ""))
    .map((r) => ({ line: r.line, name: at(r.cells, cols.name), email: at(r.cells, cols.email), section: at(r.cells, cols.section), bench: at(r.cells, cols.bench) }));
}

export interface KnownAccount {
  id: string;
  /** the role in this course, or null when the account is not a member */
  role: Role | null;
}

/** Marks every entry: new account to invite, existing account to add, already a member, bad e-mail, duplicate or bad row. */
export function classifyRows(entries: CsvEntry[], accounts: Map<string, KnownAccount>): ImportRow[] {
  const seen = new Map<string, number>();
  return entries.map((e) => {
    const parsed = emailSchema.safeParse(e.email);
    const email = parsed.success ? parsed.data : e.email;
    const base = { line: e.line, email, name: e.name, section: e.section === "" ? null : e.section, bench: e.bench === "" ? null : e.bench };
    if (!parsed.success) return { ...base, outcome: "bad_email" as const, message: e.email ? `"${e.email}" is not an e-mail address.` : "The e-mail address is missing." };
    const earlier = seen.get(email);
    if (earlier !== undefined) return { ...base, outcome: "duplicate" as const, message: `The same address is on line ${earlier}.` };
    seen.set(email, e.line);
    if (e.section.length > 40) return { ...base, outcome: "bad_row" as const, message: "The section has more than 40 characters." };
    if (e.name.length > 120) return { ...base, outcome: "bad_row" as const, message: "The name has more than 120 characters." };
    if (e.bench.length > 40) return { ...base, outcome: "bad_row" as const, message: "The bench has more than 40 characters." };
    if (CONTROL.test(e.bench)) return { ...base, outcome: "bad_row" as const, message: "The bench name has a control character." };
    const account = accounts.get(email);
    if (account?.role) return { ...base, outcome: "member" as const, message: `Already in the course as ${AS_ROLE[account.role]}.` };
    if (account) return { ...base, outcome: "add" as const };
    if (!e.name) return { ...base, outcome: "bad_row" as const, message: "A new account needs a name." };
    return { ...base, outcome: "invite" as const };
  });
}

/** The addresses worth looking up (those that parse as e-mail addresses), lower-cased. */
export function lookupEmails(entries: CsvEntry[]): string[] {
  const out = new Set<string>();
  for (const e of entries) {
    const p = emailSchema.safeParse(e.email);
    if (p.success) out.add(p.data);
  }
  return [...out];
}

/**
 * Marks rows that would seat a fifth student at a bench as bad rows. `seated` is how many sit at each bench
 * now (by name); `seatable` says whether a row would be seated (a new or added student, or a student already
 * in the course).
 */
export function checkBenchRoom(rows: ImportRow[], seated: Map<string, number>, seatable: (row: ImportRow) => boolean): ImportRow[] {
  const count = new Map(seated);
  return rows.map((row) => {
    if (!row.bench || !seatable(row)) return row;
    const n = (count.get(row.bench) ?? 0) + 1;
    if (n > MAX_AT_BENCH) return { ...row, outcome: "bad_row" as const, message: `${row.bench} would seat more than ${MAX_AT_BENCH} students.` };
    count.set(row.bench, n);
    return row;
  });
}
