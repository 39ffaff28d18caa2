"use client";
// The submission form's reader of typed quantities and its checks (read-quantities.ts, with the units
// library and zod), loaded on first use instead of with the lab page: `load()` starts it (the form calls it
// when a field takes the focus), `ready()` waits for it (the form's resolver and submit handler call it).
// Loaded once per page; a load that failed (no connection) is tried again on the next use.
import { useCallback, useState } from "react";

export type QuantityReader = typeof import("./read-quantities");

let loading: Promise<QuantityReader> | null = null;
let loaded: QuantityReader | null = null;

function loadReader(): Promise<QuantityReader> {
  loading ??= import("./read-quantities").then(
    (m) => (loaded = m),
    (e: unknown) => {
      loading = null;
      throw e;
    },
  );
  return loading;
}

export function useQuantityReader(): { reader: QuantityReader | null; load: () => void; ready: () => Promise<QuantityReader> } {
  const [reader, setReader] = useState<QuantityReader | null>(loaded);
  const ready = useCallback(async () => {
    const m = await loadReader();
    setReader(m);
    return m;
  }, []);
  const load = useCallback(() => {
    if (!reader) ready().catch(() => undefined); // the submit handler says so if it still fails then
  }, [reader, ready]);
  return { reader, load, ready };
}
