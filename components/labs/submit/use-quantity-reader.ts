"use client";
// The submission form's reader of typed quantities (read-quantities.ts, with the units library), loaded
// on first use instead of with the lab page: `load()` starts it (the form calls it when a field takes the
// focus), `ready()` waits for it (the form calls it before checking and sending). Loaded once per page.
import { useCallback, useState } from "react";

export type QuantityReader = typeof import("./read-quantities");

let loading: Promise<QuantityReader> | null = null;
let loaded: QuantityReader | null = null;

/** The reader when it has loaded, else null. */
export function loadedReader(): QuantityReader | null {
  return loaded;
}

function loadReader(): Promise<QuantityReader> {
  loading ??= import("./read-quantities").then((m) => (loaded = m));
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
    if (!reader) void ready();
  }, [reader, ready]);
  return { reader, load, ready };
}
