"use client";

// Import students from a CSV of name, e-mail and section: preview every row first, save on confirmation.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormMessage } from "@/components/ui/field";
import type { ImportOutcome, ImportRow } from "@/lib/courses/roster-csv";
import { sendJson } from "./send-json";

const OUTCOME: Record<ImportOutcome, { label: string; good: boolean }> = {
  invite: { label: "new account to invite", good: true },
  add: { label: "existing account to add", good: true },
  member: { label: "already a member", good: false },
  bad_email: { label: "bad e-mail", good: false },
  duplicate: { label: "duplicate in the file", good: false },
  bad_row: { label: "cannot import", good: false },
};

type Result = { rows: ImportRow[]; saved: number };

export function RosterImport({ courseId }: { courseId: string }) {
  const router = useRouter();
  const [csv, setCsv] = useState("");
  const [preview, setPreview] = useState<Result | null>(null);
  const [note, setNote] = useState<{ text: string; tone: "error" | "info" } | null>(null);
  const [busy, setBusy] = useState(false);
  const url = `/api/courses/${courseId}/members/import`;

  async function run(confirm: boolean) {
    setBusy(true);
    setNote(null);
    const r = await sendJson<Result>("POST", url, { csv, confirm });
    setBusy(false);
    if (!r.ok) return setNote({ text: r.message, tone: "error" });
    if (!confirm) return setPreview(r.data);
    setPreview(null);
    setCsv("");
    const invited = r.data.rows.filter((row) => row.outcome === "invite").length;
    setNote({ text: `${r.data.saved} student${r.data.saved === 1 ? "" : "s"} added to the course; ${invited} invitation${invited === 1 ? "" : "s"} queued.`, tone: "info" });
    router.refresh();
  }

  const good = preview?.rows.filter((r) => OUTCOME[r.outcome].good).length ?? 0;
  return (
    <section className="card mt-6" aria-labelledby="import-title">
      <h2 id="import-title" className="text-lg">Import students from a CSV</h2>
      <p className="mt-1 text-sm text-ink-soft">
        One student a line: name, e-mail, section and, if you like, bench (a header row naming the columns is fine;
        a bench that does not exist yet is made, at most four students at one). You see what each row
        would do before anything is saved. Students without an account get an e-mail with a link to choose a password.
      </p>
      <FormMessage message={note?.text} tone={note?.tone} />
      <label className="field-label mt-3" htmlFor="import-file">CSV file</label>
      <input
        id="import-file"
        type="file"
        accept=".csv,text/csv,text/plain"
        className="mt-1 text-sm"
        onChange={async (e) => {
          const f = e.target.files?.[0];
          if (f) {
            setCsv(await f.text());
            setPreview(null);
          }
        }}
      />
      <label className="field-label mt-3" htmlFor="import-csv">Or paste the rows</label>
      <textarea
        id="import-csv"
        className="field-input h-32 font-mono text-xs"
        value={csv}
        onChange={(e) => {
          setCsv(e.target.value);
          setPreview(null);
        }}
        placeholder={"name,email,section\nAda Example,ada@college.example,B2"}
      />
      <div className="mt-3 flex gap-3">
        <button type="button" className="btn-quiet" disabled={!csv.trim() || busy} onClick={() => run(false)}>Preview import</button>
        {preview ? (
          <button type="button" className="btn-primary" disabled={busy || good === 0} onClick={() => run(true)}>
            Import {good} student{good === 1 ? "" : "s"}
          </button>
        ) : null}
      </div>
      {preview ? (
        <table className="mt-4 min-w-full text-sm" aria-label="Import preview">
          <thead className="bg-paper-sunk text-left">
            <tr>
              <th scope="col" className="px-3 py-1">Line</th>
              <th scope="col" className="px-3 py-1">Name</th>
              <th scope="col" className="px-3 py-1">E-mail</th>
              <th scope="col" className="px-3 py-1">Section</th>
              <th scope="col" className="px-3 py-1">Bench</th>
              <th scope="col" className="px-3 py-1">What happens</th>
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((r) => (
              <tr key={r.line} className="border-t border-ink/10">
                <td className="px-3 py-1 font-mono">{r.line}</td>
                <td className="px-3 py-1">{r.name}</td>
                <td className="px-3 py-1 font-mono text-xs">{r.email}</td>
                <td className="px-3 py-1">{r.section ?? "—"}</td>
                <td className="px-3 py-1">{r.bench ?? "—"}</td>
                <td className={`px-3 py-1 ${OUTCOME[r.outcome].good ? "" : "text-verdict-wrong"}`}>
                  {OUTCOME[r.outcome].label}
                  {r.message ? `: ${r.message}` : ""}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </section>
  );
}
