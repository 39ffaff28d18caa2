import { expect } from "vitest";

/** |actual − expected| ≤ rel·|expected| (lib/grader/PHYSICS.md §0: 5×10⁻⁴ for 4-significant-figure checks). */
export function expectClose(actual: number | null | undefined, expected: number, rel = 5e-4): void {
  expect(actual).not.toBeNull();
  expect(actual).not.toBeUndefined();
  const a = actual as number;
  const ok = Math.abs(a - expected) <= rel * Math.abs(expected);
  if (!ok) expect.fail(`expected ${a} to be within ${rel * 100} % of ${expected}`);
}

export const MAH = 3.6; // coulombs per mAh
export const HOUR = 3600;
export const DAY = 86400;

/** Closed forms of lib/grader/PHYSICS.md §8 for a square wave, written out here rather than taken from lib/trace. */
export function closedForm(p: { sleepCurrent: number; activeCurrent: number; activeTime: number; period: number; cycles: number }) {
  const D = p.activeTime / p.period;
  const average = D * p.activeCurrent + (1 - D) * p.sleepCurrent;
  return {
    dutyCycle: D,
    average,
    chargePerWake: p.activeCurrent * p.activeTime,
    duration: p.cycles * p.period,
    totalCharge: p.cycles * (p.activeCurrent * p.activeTime + p.sleepCurrent * (p.period - p.activeTime)),
  };
}
