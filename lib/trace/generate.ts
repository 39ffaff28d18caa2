// Test traces: a square wave that sleeps, then wakes at the end of each period. Samples fall on the edges,
// so the closed forms of lib/grader/PHYSICS.md §8 hold exactly: Ī = D·I_a + (1 − D)·I_s, Q_wake = I_a·t_a.
import { CURRENT_DIVISOR, TIME_DIVISOR } from "./units";
import type { CurrentUnit, TimeUnit } from "./types";

export type SquareWaveSpec = {
  /** A */
  sleepCurrent: number;
  /** A */
  activeCurrent: number;
  /** s; a whole number of sample intervals */
  activeTime: number;
  /** s; a whole number of sample intervals */
  period: number;
  cycles: number;
  /** s */
  sampleInterval: number;
  /** Write a header row naming the columns and units (default true). */
  header?: boolean;
  /** Units the numbers are written in (default s and A). */
  units?: { time?: TimeUnit; current?: CurrentUnit };
  /** After every this many data rows, add one garbage line (text, empty cell, repeated header, earlier time, NaN in turn). */
  garbageEvery?: number;
  separator?: "," | ";" | "\t";
  /** Write numbers with a decimal comma (needs a separator other than a comma). */
  decimalComma?: boolean;
};

function steps(span: number, dt: number, what: string): number {
  const k = Math.round(span / dt);
  if (k < 1 || Math.abs(k * dt - span) > 1e-9 * span) throw new RangeError(`${what} must be a whole number of sample intervals`);
  return k;
}

/** The trace line by line (header and garbage lines included), without line ends. */
export function* squareWaveRows(spec: SquareWaveSpec): Generator<string> {
  const dt = spec.sampleInterval;
  const perPeriod = steps(spec.period, dt, "period");
  const perActive = steps(spec.activeTime, dt, "activeTime");
  if (perActive >= perPeriod) throw new RangeError("activeTime must be shorter than the period");
  if (!(Number.isInteger(spec.cycles) && spec.cycles >= 1)) throw new RangeError("cycles must be a positive whole number");
  const sep = spec.separator ?? ",";
  const comma = spec.decimalComma === true;
  if (comma && sep === ",") throw new RangeError("a decimal comma needs a semicolon or tab separator");
  const tu = spec.units?.time ?? "s";
  const iu = spec.units?.current ?? "A";
  const tStep = dt * TIME_DIVISOR[tu];
  const sleep = spec.sleepCurrent * CURRENT_DIVISOR[iu];
  const active = spec.activeCurrent * CURRENT_DIVISOR[iu];
  const num = (x: number) => {
    const s = String(Number(x.toPrecision(12)));
    return comma ? s.replace(".", ",") : s;
  };
  const sleepText = num(sleep);
  const activeText = num(active);
  const headerLine = `time (${tu})${sep}current (${iu})`;
  if (spec.header !== false) yield headerLine;

  const garbageEvery = spec.garbageEvery ?? 0;
  const last = spec.cycles * perPeriod;
  const wakeAt = perPeriod - perActive;
  let sinceGarbage = 0;
  let garbageKind = 0;
  let previous = "";
  for (let k = 0; k <= last; k++) {
    const time = num(k * tStep);
    yield `${time}${sep}${k % perPeriod >= wakeAt ? activeText : sleepText}`;
    if (garbageEvery > 0 && ++sinceGarbage === garbageEvery && k < last) {
      sinceGarbage = 0;
      const kind = garbageKind++ % 5;
      if (kind === 0) yield `glitch${sep}n/a`;
      else if (kind === 1) yield `${time}${sep}`;
      else if (kind === 2) yield headerLine;
      else if (kind === 3) yield `${previous || num(-tStep)}${sep}${activeText}`;
      else yield `${num((k + 0.5) * tStep)}${sep}NaN`;
    }
    previous = time;
  }
}

/** The trace as one CSV string (lines end in "\n"). */
export function squareWaveCsv(spec: SquareWaveSpec): string {
  const lines: string[] = [];
  for (const line of squareWaveRows(spec)) lines.push(line);
  return lines.join("\n") + "\n";
}
