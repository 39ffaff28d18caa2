"use client";

// The course's instruments page: the instructor copies a built-in profile into the course, edits a
// profile's name and range table (values typed with their units, "5 µA", "10 kΩ", "50 mV") and deletes one
// no published lab uses. Saving sends the whole range table through PATCH, checked by the route's schema;
// a refusal names the field, shown beside the table.
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";
import { parseQuantity } from "@/lib/grader";
import { formatAuto } from "@/lib/lessons/format";
import type { InstrumentProfile, InstrumentRange } from "@/lib/instruments/profile";

type Row = Record<"label" | "fullScale" | "ohms" | "burden" | "steps" | "reference" | "percentOfReading" | "counts" | "percentOfRange", string>;

const show = (v: number | undefined, unit: string) => (v === undefined ? "" : formatAuto(v, unit).replace(/\s+/g, " "));

function toRow(r: InstrumentRange, kind: InstrumentProfile["kind"]): Row {
  const res = r.resolution;
  return {
    label: r.label,
    fullScale: show(r.fullScale, "A"),
    ohms: show(kind === "feedback-ammeter" ? r.feedbackOhms : r.shuntOhms, "Ω"),
    burden: show(r.burdenAtFullScale, "V"),
    steps: "counts" in res ? String(res.counts) : `${res.bits} bit`,
    reference: "bits" in res ? show(res.referenceVolts, "V") : "",
    percentOfReading: String(r.accuracy.percentOfReading),
    counts: r.accuracy.counts === undefined ? "" : String(r.accuracy.counts),
    percentOfRange: r.accuracy.percentOfRange === undefined ? "" : String(r.accuracy.percentOfRange),
  };
}

/** The rows read back into ranges; a value that cannot be read keeps its text so the schema names it. */
function fromRows(rows: Row[], before: InstrumentRange[], kind: InstrumentProfile["kind"]): InstrumentRange[] {
  const q = (text: string, unit: string): number | string | undefined => {
    if (text.trim() === "") return undefined;
    const r = parseQuantity(text, unit);
    return r.ok ? r.value : text;
  };
  const n = (text: string) => (text.trim() === "" ? undefined : Number(text));
  return rows.map((row, i) => {
    const old = before[i];
    const bits = /^\s*(\d+)\s*bits?\s*$/i.exec(row.steps);
    const ohms = q(row.ohms, "ohm");
    const range = {
      ...old,
      label: row.label,
      fullScale: q(row.fullScale, "A"),
      ...(kind === "feedback-ammeter" ? { feedbackOhms: ohms } : { shuntOhms: ohms }),
      burdenAtFullScale: q(row.burden, "V"),
      resolution: bits ? { bits: Number(bits[1]), referenceVolts: q(row.reference, "V") } : { counts: n(row.steps) },
      accuracy: { percentOfReading: n(row.percentOfReading), counts: n(row.counts), percentOfRange: n(row.percentOfRange) },
    } as unknown as InstrumentRange;
    // a sampling meter's sensitivity follows its shunt when the amplifier's gain stays
    if (kind === "sampling-meter" && old?.sensitivity !== undefined && old.shuntOhms && typeof ohms === "number") range.sensitivity = (old.sensitivity / old.shuntOhms) * ohms;
    for (const k of Object.keys(range) as (keyof InstrumentRange)[]) if (range[k] === undefined) delete range[k];
    return range;
  });
}

export function InstrumentEditor({ id, profile }: { id: string; profile: InstrumentProfile }) {
  const router = useRouter();
  const [name, setName] = useState(profile.name);
  const [rows, setRows] = useState<Row[]>(() => profile.ranges.map((r) => toRow(r, profile.kind)));
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [note, setNote] = useState<{ text: string; tone: "error" | "info" } | null>(null);
  const failed = (e: unknown) => {
    setFields(isApiError(e) ? (e.fields ?? {}) : {});
    setNote({ text: isApiError(e) ? e.message : "Could not save; try again.", tone: "error" });
  };
  const save = useMutation({
    mutationFn: () => api(`/api/instruments/${id}`, { method: "PATCH", body: { name, ranges: fromRows(rows, profile.ranges, profile.kind) } }),
    onSuccess: () => {
      setFields({});
      setNote({ text: "Saved. Published labs keep the profile they were published with until you apply the change to them.", tone: "info" });
      router.refresh();
    },
    onError: failed,
  });
  const remove = useMutation({
    mutationFn: () => api(`/api/instruments/${id}`, { method: "DELETE" }),
    onSuccess: () => router.refresh(),
    onError: failed,
  });
  const set = (i: number, k: keyof Row, v: string) => setRows(rows.map((r, j) => (j === i ? { ...r, [k]: v } : r)));
  const errorOf = (i: number) =>
    Object.entries(fields)
      .filter(([k]) => k.startsWith(`ranges.${i}.`))
      .map(([k, m]) => `${k.split(".").slice(2).join(" ")}: ${m[0]}`)
      .join(" ");
  const cols: [keyof Row, string][] = [
    ["label", "Range"],
    ["fullScale", "Full scale"],
    ["ohms", profile.kind === "feedback-ammeter" ? "Feedback resistor" : "Shunt"],
    ["burden", "Burden at full scale"],
    ["steps", "Counts, or bits"],
    ["reference", "Converter reference"],
    ["percentOfReading", "± % of reading"],
    ["counts", "+ counts"],
    ["percentOfRange", "+ % of range"],
  ];
  return (
    <form
      className="mt-3"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate();
      }}
    >
      <label className="block text-sm font-semibold" htmlFor={`name-${id}`}>
        Name
      </label>
      <input id={`name-${id}`} className="mt-1 w-full max-w-md rounded border border-ink/30 px-2 py-1" value={name} onChange={(e) => setName(e.target.value)} aria-invalid={fields.name ? true : undefined} />
      {fields.name ? <p className="text-sm text-verdict-wrong">{fields.name[0]}</p> : null}
      <div className="mt-3 overflow-x-auto">
        <table className="min-w-[52rem] text-sm">
          <thead>
            <tr className="text-left">
              {cols.map(([, h]) => (
                <th key={h} scope="col" className="pr-2 font-semibold">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={profile.ranges[i]?.key ?? i} className="align-top">
                {cols.map(([k, h]) => (
                  <td key={k} className="pr-2 pb-1">
                    <input
                      aria-label={`${h}, range ${i + 1}`}
                      className="w-24 rounded border border-ink/30 px-1 py-0.5"
                      value={r[k]}
                      onChange={(e) => set(i, k, e.target.value)}
                      aria-invalid={errorOf(i) ? true : undefined}
                    />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {rows.map((_, i) => (errorOf(i) ? <p key={i} className="text-sm text-verdict-wrong">{`Range ${i + 1}: ${errorOf(i)}`}</p> : null))}
      <div className="mt-3 flex flex-wrap gap-3">
        <button type="submit" className="rounded bg-ink px-3 py-1 text-paper" disabled={save.isPending}>
          Save {profile.name}
        </button>
        <button
          type="button"
          className="rounded border border-ink/30 px-3 py-1"
          disabled={remove.isPending}
          onClick={() => {
            if (window.confirm(`Delete ${profile.name}? Labs not yet published that use it lose their instrument.`)) remove.mutate();
          }}
        >
          Delete
        </button>
      </div>
      <FormMessage message={note?.text} tone={note?.tone} />
    </form>
  );
}

export function CopyFromLibrary({ courseId, library }: { courseId: string; library: { libraryKey: string; name: string }[] }) {
  const router = useRouter();
  const [note, setNote] = useState<string | null>(null);
  const copy = useMutation({
    mutationFn: (key: string) => api(`/api/courses/${courseId}/instruments`, { method: "POST", body: { copyOf: key } }),
    onSuccess: () => {
      setNote(null);
      router.refresh();
    },
    onError: (e) => setNote(isApiError(e) ? e.message : "Could not copy; try again."),
  });
  return (
    <div className="mt-2 flex flex-wrap gap-2">
      {library.map((l) => (
        <button key={l.libraryKey} type="button" className="rounded border border-ink/30 px-3 py-1 text-sm" disabled={copy.isPending} onClick={() => copy.mutate(l.libraryKey)}>
          Copy the {l.name.toLowerCase()}
        </button>
      ))}
      <FormMessage message={note} />
    </div>
  );
}
