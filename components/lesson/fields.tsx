"use client";
// The calculators' state: quantity texts read the way the grader does (parseQuantity): "4k7", "2 uA",
// "0,5 mA", "1e-3 A". The inputs themselves are QuantityInput from components/ui/field.tsx.
import { useId, useMemo, useState } from "react";
import { parseQuantity } from "@/lib/grader";

export type FieldDef = { label: string; unit: string; initial: string; hint?: string };

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
      const r = parseQuantity(texts[k], defs[k].unit);
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
