"use client";
// True once React runs in the browser. Until then a click on a form's button would submit it natively
// (a page reload), so buttons wait for this.
import { useSyncExternalStore } from "react";

const subscribeNothing = () => () => {};

export function useHydrated(): boolean {
  return useSyncExternalStore(subscribeNothing, () => true, () => false);
}
