"use client";

// The Benches page's editor: the instructor seats students, moves them, swaps two, pairs the unseated
// students of a section at random and saves the whole arrangement at once (PUT, checked by the same schema
// as the route). Teaching assistants see the arrangement without the controls.
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { FormMessage } from "@/components/ui/field";
import { api, isApiError } from "@/lib/http/client";
import { nextBenchNames, randomPairs } from "@/lib/benches/pairing";
import { benchesSchema, MAX_AT_BENCH } from "@/lib/validation/benches";

export interface EditorStudent {
  userId: string;
  name: string;
  section: string | null;
}

export interface EditorBench {
  name: string;
  section: string | null;
  memberIds: string[];
}

interface Draft {
  key: string;
  name: string;
  section: string;
  memberIds: string[];
}

const NO_SECTION = "";
let keys = 0;
const newKey = () => `b${++keys}`;

export function BenchEditor({ courseId, students, initial, canEdit }: { courseId: string; students: EditorStudent[]; initial: EditorBench[]; canEdit: boolean }) {
  const router = useRouter();
  const byId = useMemo(() => new Map(students.map((s) => [s.userId, s])), [students]);
  const [benches, setBenches] = useState<Draft[]>(() => initial.map((b) => ({ key: newKey(), name: b.name, section: b.section ?? "", memberIds: b.memberIds })));
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [note, setNote] = useState<{ text: string; tone: "error" | "info" } | null>(null);
  const [swapA, setSwapA] = useState("");
  const [swapB, setSwapB] = useState("");
  const sections = useMemo(() => [...new Set(students.map((s) => s.section ?? NO_SECTION))].sort(), [students]);
  const [pairSection, setPairSection] = useState(sections[0] ?? NO_SECTION);

  const seatOf = new Map<string, number>();
  benches.forEach((b, i) => b.memberIds.forEach((id) => seatOf.set(id, i)));
  const unseated = students.filter((s) => !seatOf.has(s.userId));
  const nameOf = (id: string) => byId.get(id)?.name ?? "a former student";

  const change = (next: Draft[]) => {
    setBenches(next);
    setNote(null);
  };
  const without = (list: Draft[], userId: string) => list.map((b) => ({ ...b, memberIds: b.memberIds.filter((m) => m !== userId) }));
  const move = (userId: string, to: number | null) => {
    const next = without(benches, userId);
    if (to !== null) next[to] = { ...next[to], memberIds: [...next[to].memberIds, userId] };
    change(next);
  };
  const swap = () => {
    if (!swapA || !swapB || swapA === swapB) return setNote({ text: "Choose two different students to swap.", tone: "error" });
    // a student at no bench takes the other's seat, and the other is left at none
    const next = benches.map((d) => ({ ...d, memberIds: d.memberIds.map((m) => (m === swapA ? swapB : m === swapB ? swapA : m)) }));
    change(next);
    setNote({ text: `${nameOf(swapA)} and ${nameOf(swapB)} swapped places. Save to keep it.`, tone: "info" });
  };
  const addBench = () => change([...benches, { key: newKey(), name: nextBenchNames(benches.map((b) => b.name), 1)[0], section: pairSection, memberIds: [] }]);
  const pair = () => {
    const pool = unseated.filter((s) => (s.section ?? NO_SECTION) === pairSection);
    if (!pool.length) return setNote({ text: "Every student of that section already sits at a bench.", tone: "info" });
    const groups = randomPairs(pool);
    const names = nextBenchNames(benches.map((b) => b.name), groups.length);
    change([...benches, ...groups.map((g, i) => ({ key: newKey(), name: names[i], section: pairSection, memberIds: g.map((s) => s.userId) }))]);
    setNote({ text: `${pool.length} students paired at ${groups.length} new bench${groups.length === 1 ? "" : "es"}. Save to keep it.`, tone: "info" });
  };

  const save = useMutation({
    mutationFn: (body: unknown) => api(`/api/courses/${courseId}/benches`, { method: "PUT", body }),
  });
  const submit = async () => {
    const body = { benches: benches.map((b) => ({ name: b.name, section: b.section, memberIds: b.memberIds })) };
    const parsed = benchesSchema.safeParse(body);
    if (!parsed.success) {
      const f: Record<string, string[]> = {};
      for (const i of parsed.error.issues) (f[i.path.join(".")] ??= []).push(i.message);
      setFields(f);
      return setNote({ text: "Check the benches marked below; nothing was saved.", tone: "error" });
    }
    try {
      await save.mutateAsync(body);
      setFields({});
      setNote({ text: "The benches are saved.", tone: "info" });
      router.refresh();
    } catch (e) {
      setFields(isApiError(e) ? (e.fields ?? {}) : {});
      setNote({ text: isApiError(e) ? e.message : "The benches could not be saved.", tone: "error" });
    }
  };

  const errorsAt = (i: number) => Object.entries(fields).filter(([k]) => k === `benches.${i}` || k.startsWith(`benches.${i}.`)).flatMap(([, v]) => v);

  return (
    <div>
      <FormMessage message={note?.text} tone={note?.tone} />
      {canEdit ? (
        <section aria-label="Arrange" className="card mb-6 flex flex-wrap items-end gap-4 p-4 text-sm">
          <label className="flex flex-col gap-1">
            Section
            <select className="field-input mt-0 w-auto py-1" value={pairSection} onChange={(e) => setPairSection(e.target.value)}>
              {sections.map((s) => (
                <option key={s} value={s}>{s === NO_SECTION ? "no section" : s}</option>
              ))}
            </select>
          </label>
          <button type="button" className="btn-quiet" onClick={pair}>Pair the unseated students of this section at random</button>
          <button type="button" className="btn-quiet" onClick={addBench}>Add a bench</button>
          <span className="flex flex-wrap items-end gap-2">
            <label className="flex flex-col gap-1">
              Swap
              <StudentSelect label="First student to swap" students={students} value={swapA} onChange={setSwapA} />
            </label>
            <label className="flex flex-col gap-1">
              with
              <StudentSelect label="Second student to swap" students={students} value={swapB} onChange={setSwapB} />
            </label>
            <button type="button" className="btn-quiet" onClick={swap}>Swap</button>
          </span>
        </section>
      ) : null}

      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {benches.map((b, i) => {
          const errors = errorsAt(i);
          return (
            <section key={b.key} className="card p-4" aria-label={b.name || `Bench ${i + 1}`} data-testid="bench">
              {canEdit ? (
                <div className="flex flex-wrap gap-2">
                  <input aria-label={`Name of bench ${i + 1}`} className="field-input mt-0 w-36 py-1 font-semibold" value={b.name} maxLength={40} onChange={(e) => change(benches.map((d, j) => (j === i ? { ...d, name: e.target.value } : d)))} />
                  <input aria-label={`Section of ${b.name}`} placeholder="section" className="field-input mt-0 w-20 py-1" value={b.section} maxLength={40} onChange={(e) => change(benches.map((d, j) => (j === i ? { ...d, section: e.target.value } : d)))} />
                  <button type="button" className="btn-quiet px-2 py-1" aria-label={`Remove ${b.name}`} onClick={() => change(benches.filter((_, j) => j !== i))}>Remove</button>
                </div>
              ) : (
                <h2 className="text-lg">
                  {b.name} {b.section ? <span className="text-sm text-ink-soft">section {b.section}</span> : null}
                </h2>
              )}
              {errors.length ? (
                <p className="mt-1 field-error" role="alert">{errors.join(" ")}</p>
              ) : null}
              <ul className="mt-2 space-y-1 text-sm">
                {b.memberIds.length === 0 ? <li className="text-ink-faint">Nobody sits here yet.</li> : null}
                {b.memberIds.map((id) => (
                  <li key={id} className="flex flex-wrap items-center gap-2">
                    <span className="min-w-0 flex-1">{nameOf(id)}</span>
                    {canEdit ? (
                      <select aria-label={`Move ${nameOf(id)}`} className="field-input mt-0 w-auto py-0.5" value={i} onChange={(e) => move(id, e.target.value === "" ? null : Number(e.target.value))}>
                        {benches.map((d, j) => (
                          <option key={d.key} value={j}>{d.name}</option>
                        ))}
                        <option value="">no bench</option>
                      </select>
                    ) : null}
                  </li>
                ))}
              </ul>
              {canEdit && b.memberIds.length < MAX_AT_BENCH && unseated.length ? (
                <select aria-label={`Seat a student at ${b.name}`} className="field-input mt-2 w-full py-1 text-sm" value="" onChange={(e) => e.target.value && move(e.target.value, i)}>
                  <option value="">Seat a student here…</option>
                  {unseated.map((s) => (
                    <option key={s.userId} value={s.userId}>{s.name}{s.section ? ` (section ${s.section})` : ""}</option>
                  ))}
                </select>
              ) : null}
            </section>
          );
        })}
      </div>

      <section aria-labelledby="unseated-heading" className="mt-8">
        <h2 id="unseated-heading" className="text-xl">At no bench ({unseated.length})</h2>
        {unseated.length === 0 ? (
          <p className="text-sm text-ink-soft">Every student sits at a bench.</p>
        ) : (
          <ul className="mt-2 grid gap-1 text-sm sm:grid-cols-2" data-testid="unseated">
            {unseated.map((s) => (
              <li key={s.userId}>
                {s.name} <span className="text-ink-faint">{s.section ? `section ${s.section}` : "no section"}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
      {canEdit ? (
        <p className="mt-6">
          <button type="button" className="btn-primary" onClick={submit} disabled={save.isPending}>
            {save.isPending ? "Saving…" : "Save the benches"}
          </button>
        </p>
      ) : null}
    </div>
  );
}

function StudentSelect({ label, students, value, onChange }: { label: string; students: EditorStudent[]; value: string; onChange: (v: string) => void }) {
  return (
    <select aria-label={label} className="field-input mt-0 w-auto max-w-[12rem] py-1" value={value} onChange={(e) => onChange(e.target.value)}>
      <option value="">choose…</option>
      {students.map((s) => (
        <option key={s.userId} value={s.userId}>{s.name}</option>
      ))}
    </select>
  );
}
