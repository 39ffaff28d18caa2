"use client";
// The calculators' state: quantity texts read the way the grader does (parseQuantity): "4k7", "2 uA",
// "0,5 mA", "1e-3 A". The inputs themselves are QuantityInput from components/ui/field.tsx.
import { useId, useMemo, useState } from "react";
import { parseQuantity, templates } from "@/lib/grader";
import { QuantityInput } from "@/components/ui/field";

export type FieldDef = { label: string; unit: string; initial: string; hint?: string };

/** Quantities that only make sense above zero in every calculator (a resistance, a capacitance, a time, a rate). */
const POSITIVE_UNITS = new Set(["ohm", "F", "s", "Hz", "C"]);

/**
 * One calculator field read as the grader reads answers (parseQuantity), with two differences that suit a
 * field whose unit is fixed by its label: a bare number in a resistance field is ohms (resistor values are
 * written bare, and the hints show them so), and a resistance, capacitance, time, rate or charge must be
 * above zero. Every refusal names the field and says what is wrong.
 */
export function readField(text: string, def: FieldDef): { ok: true; value: number } | { ok: false; message: string } {
  let r = parseQuantity(text, def.unit);
  if (!r.ok && def.unit === "ohm" && /^\s*[-+]?(\d+([.,]\d*)?|[.,]\d+)([eE][-+]?\d+)?\s*$/.test(text)) r = parseQuantity(`${text.trim()} ohm`, "ohm");
  if (!r.ok) return { ok: false, message: `${def.label}: ${r.message}` };
  if (POSITIVE_UNITS.has(def.unit) && !(r.value > 0)) return { ok: false, message: `${def.label} must be above zero.` };
  return { ok: true, value: r.value };
}

export function useQuantityFields<K extends string>(defs: Record<K, FieldDef>) {
  const [texts, setTexts] = useState<Record<K, string>>(() => {
    const out = {} as Record<K, string>;
    for (const k of Object.keys(defs) as K[]) out[k] = defs[k].initial;
    return out;
  });
  const parsed = useMemo(() => {
    const values = {} as Record<K, number | undefined>;
    const errors = {} as Record<K, string | undefined>;
    for (const k of Object.keys(defs) as K[]) {
      const r = readField(texts[k], defs[k]);
      if (r.ok) values[k] = r.value;
      else errors[k] = r.message;
    }
    return { values, errors };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [texts]);
  const allOk = (Object.keys(defs) as K[]).every((k) => parsed.values[k] !== undefined);
  return {
    texts,
    setText: (k: K, t: string) => setTexts((s) => ({ ...s, [k]: t })),
    values: parsed.values,
    errors: parsed.errors,
    allOk,
  };
}

/** A calculator's frame: a titled card; controls are hidden in print, results stay. */
export function CalculatorCard({ title, children, testId }: { title: string; children: React.ReactNode; testId?: string }) {
  const id = useId();
  return (
    <section className="card my-6 break-inside-avoid" aria-labelledby={id} data-testid={testId}>
      <h3 id={id} className="mt-0 mb-3 text-lg">
        Try it: {title}
      </h3>
      {children}
    </section>
  );
}

export function Output({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex justify-between gap-4 border-b border-ink/10 py-1">
      <dt className="text-ink-soft">{label}</dt>
      <dd className="m-0 font-semibold tabular-nums" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

// ---------------------------------------------------------------- shared by the calculators

export type Computed = Record<string, number | string>;
export function compute(template: string, params: Record<string, number | string>): Computed | null {
  const t = (templates as Record<string, { compute(p: Record<string, number | string>): Computed }>)[template];
  try {
    const out = t.compute(params);
    return Object.values(out).every((v) => typeof v === "string" || Number.isFinite(v)) ? out : null;
  } catch {
    return null;
  }
}
export const num = (c: Computed | null, k: string) => (c && typeof c[k] === "number" ? (c[k] as number) : NaN);

export function Fields<K extends string>({ f, defs }: { f: ReturnType<typeof useQuantityFields<K>>; defs: Record<K, { label: string; hint?: string }> }) {
  return (
    <div className="no-print grid gap-3 sm:grid-cols-2">
      {(Object.keys(defs) as K[]).map((k) => (
        <QuantityInput key={k} className="" label={defs[k].label} hint={defs[k].hint} value={f.texts[k]} onChange={(e) => f.setText(k, e.target.value)} error={f.errors[k]} />
      ))}
    </div>
  );
}

export const invalid = <p className="text-sm text-ink-soft">Fix the highlighted input to see the results.</p>;

/** The template's own check first (a reason in words), then its compute. */
export function checked(template: string, params: Record<string, number>): { c: Computed | null; problem: string | null } {
  const t = (templates as Record<string, { check(p: Record<string, number>): string | null }>)[template];
  const problem = t.check(params);
  return problem ? { c: null, problem } : { c: compute(template, params), problem: null };
}
export const pct = (x: number) => `${x.toPrecision(4)} %`;
