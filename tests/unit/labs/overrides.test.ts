// Staff points over the grader's: applied per question, the grader's points kept beside them, and
// removed again when the override goes. Check values are sums of the points written here (common practice, no source).
import { describe, expect, it } from "vitest";
import { applyOverrides } from "@/lib/labs/overrides";
import type { StoredResult } from "@/lib/labs/visible-results";

const result = {
  template: "shunt-burden",
  score: 7,
  maxScore: 10,
  graderVersion: "t",
  results: [
    { id: "q1", quantity: "indicatedCurrent", kind: "prediction", verdict: "correct", points: 4, maxPoints: 4 },
    { id: "q2", quantity: "trueCurrent", kind: "prediction", verdict: "wrong", points: 0, maxPoints: 3 },
    { id: "q3", quantity: "burdenVoltage", kind: "prediction", verdict: "close", points: 1.5, maxPoints: 3 },
  ],
} as unknown as StoredResult;

const o = (points: number) => ({ points, reason: "r", by: "u", at: "2026-12-02T05:00:00Z" });

describe("applyOverrides", () => {
  it("replaces the overridden question's points and keeps the grader's beside them", () => {
    const { result: r, rawScore, applied } = applyOverrides(result, { q2: o(2.5) });
    expect(rawScore).toBe(8);
    expect(applied).toEqual(["q2"]);
    expect(r.results[1]).toMatchObject({ points: 2.5, graderPoints: 0, override: { points: 2.5, reason: "r" } });
    expect(r.results[0]).not.toHaveProperty("override");
  });

  it("applies a second override over the grader's points, not over the first override", () => {
    const once = applyOverrides(result, { q2: o(2.5) }).result;
    const twice = applyOverrides(once, { q2: o(1), q3: o(3) });
    expect(twice.rawScore).toBe(8);
    expect(twice.result.results[1]).toMatchObject({ points: 1, graderPoints: 0 });
  });

  it("gives the grader's points back when the override is gone", () => {
    const once = applyOverrides(result, { q2: o(2.5) }).result;
    const back = applyOverrides(once, {});
    expect(back.rawScore).toBe(5.5);
    expect(back.result.results[1]).not.toHaveProperty("graderPoints");
    expect(back.result.results[1].points).toBe(0);
  });
});
