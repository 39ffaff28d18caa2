// Units of the two columns, and finding the time and current columns in a header row.
import type { CurrentUnit, TimeUnit } from "./types";

// Divisors from the column's unit to SI (dividing by 1000 rounds once; multiplying by 1e-3 rounds twice).
export const TIME_DIVISOR: Record<TimeUnit, number> = { s: 1, ms: 1e3, us: 1e6 };
export const CURRENT_DIVISOR: Record<CurrentUnit, number> = { A: 1, mA: 1e3, uA: 1e6, nA: 1e9 };

// Unit words and symbols, lower-cased, with the micro sign and the Greek mu both read as "u".
const TIME_WORDS: Record<string, TimeUnit> = {
  s: "s", sec: "s", secs: "s", second: "s", seconds: "s",
  ms: "ms", msec: "ms", msecs: "ms", millisecond: "ms", milliseconds: "ms",
  us: "us", usec: "us", usecs: "us", microsecond: "us", microseconds: "us",
};
const CURRENT_WORDS: Record<string, CurrentUnit> = {
  a: "A", amp: "A", amps: "A", ampere: "A", amperes: "A",
  ma: "mA", milliamp: "mA", milliamps: "mA", milliampere: "mA", milliamperes: "mA",
  ua: "uA", microamp: "uA", microamps: "uA", microampere: "uA", microamperes: "uA",
  na: "nA", nanoamp: "nA", nanoamps: "nA", nanoampere: "nA", nanoamperes: "nA",
};
const TIME_NAMES = new Set(["t", "time", "timestamp", "elapsed", "x"]);
const CURRENT_NAMES = new Set(["i", "current", "curr", "amperage", "load", "y"]);

function words(cell: string): string[] {
  return cell
    .toLowerCase()
    .replace(/[µμ]/g, "u")
    .split(/[^a-z0-9]+/)
    .filter((w) => w.length > 0);
}

export type ColumnGuess = { kind: "time"; unit: TimeUnit | null } | { kind: "current"; unit: CurrentUnit | null } | null;

/** What a header cell names: "time (ms)" → time in ms, "current_uA" → current in µA, "seconds" → time in s. */
export function readHeaderCell(cell: string): ColumnGuess {
  const w = words(cell);
  if (w.length === 0) return null;
  const timeUnit = w.map((x) => TIME_WORDS[x]).find((u) => u !== undefined) ?? null;
  const currentUnit = w.map((x) => CURRENT_WORDS[x]).find((u) => u !== undefined) ?? null;
  const namesTime = w.some((x) => TIME_NAMES.has(x));
  const namesCurrent = w.some((x) => CURRENT_NAMES.has(x));
  // A name decides the kind; a lone unit ("ms", "uA") decides it otherwise.
  if (namesTime && !namesCurrent) return { kind: "time", unit: timeUnit };
  if (namesCurrent && !namesTime) return { kind: "current", unit: currentUnit };
  if (timeUnit && !currentUnit) return { kind: "time", unit: timeUnit };
  if (currentUnit && !timeUnit) return { kind: "current", unit: currentUnit };
  return null;
}

export type HeaderColumns = {
  timeColumn: number;
  currentColumn: number;
  timeUnit: TimeUnit | null;
  currentUnit: CurrentUnit | null;
};

/** Picks the time and current columns of a header; falls back to the first two columns. */
export function columnsFromHeader(cells: string[]): HeaderColumns {
  const guesses = cells.map(readHeaderCell);
  let timeColumn = guesses.findIndex((g) => g?.kind === "time");
  let currentColumn = guesses.findIndex((g) => g?.kind === "current");
  if (timeColumn < 0) timeColumn = currentColumn === 0 ? 1 : 0;
  if (currentColumn < 0) currentColumn = [0, 1, 2].find((c) => c !== timeColumn && c < Math.max(cells.length, 2)) ?? 1;
  const tg = guesses[timeColumn];
  const ig = guesses[currentColumn];
  return {
    timeColumn,
    currentColumn,
    timeUnit: tg?.kind === "time" ? tg.unit : null,
    currentUnit: ig?.kind === "current" ? ig.unit : null,
  };
}
