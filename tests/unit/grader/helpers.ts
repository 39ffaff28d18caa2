import { expect } from "vitest";

/** Relative agreement to about 4 significant figures (lib/grader/PHYSICS.md §0: relative tolerance ≈ 5e-4). */
export function near(actual: unknown, expected: number, rel = 5e-4): void {
  expect(typeof actual).toBe("number");
  const a = actual as number;
  if (expected === 0) {
    expect(Math.abs(a)).toBeLessThan(1e-15);
    return;
  }
  const err = Math.abs(a / expected - 1);
  if (!(err <= rel)) throw new Error(`expected ${a} to be within ${rel} of ${expected} (relative error ${err})`);
}
