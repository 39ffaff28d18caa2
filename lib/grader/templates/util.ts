import type { Params } from "../types";
import { texQuantity, type FormatOptions } from "../format";

/** A numeric parameter (NaN when absent or not a number). */
export function num(params: Params, key: string): number {
  const v = params[key];
  return typeof v === "number" ? v : NaN;
}

/** LaTeX for a value with its unit. */
export function tq(value: number, unit: string, opts?: FormatOptions): string {
  return texQuantity(value, unit, opts);
}

/** True when every listed value is a finite number > 0. */
export function allPositive(...values: number[]): boolean {
  return values.every((v) => Number.isFinite(v) && v > 0);
}
