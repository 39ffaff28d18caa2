// Pure helpers of the gradebook page: filtering by section and search, markers, histogram bins, and the
// questions most students missed. Expected values are worked out by hand (common practice, no source).
import { describe, expect, it } from "vitest";
import { histogram, mostMissed } from "@/lib/gradebook/stats";
import { cellMarkers, filterStudents, formatScore, sectionsOf } from "@/lib/gradebook/view";
import { labWeightsSchema } from "@/lib/validation/gradebook";

const people = [
  { name: "Ada Brook", email: "ada@test.example", section: "Tue" },
  { name: "Ben Carr", email: "ben@test.example", section: "Wed" },
  { name: "Cleo Dunn", email: "cleo@other.example", section: "Tue" },
  { name: "Dev Ellis", email: "dev@test.example", section: null },
];

describe("gradebook filtering", () => {
  it("keeps one section, and matches the search against name or e-mail in any case", () => {
    expect(filterStudents(people, "Tue", "").map((p) => p.name)).toEqual(["Ada Brook", "Cleo Dunn"]);
    expect(filterStudents(people, "", "OTHER").map((p) => p.name)).toEqual(["Cleo Dunn"]);
    expect(filterStudents(people, "", " carr ").map((p) => p.name)).toEqual(["Ben Carr"]);
    expect(filterStudents(people, "Wed", "ada")).toEqual([]);
    expect(sectionsOf(people)).toEqual(["Tue", "Wed"]);
  });
});

describe("cell markers", () => {
  it("marks a missing cell, and late, staff-changed, open-review and simulated-bench attempts", () => {
    expect(cellMarkers(null).map((m) => m.key)).toEqual(["missing"]);
    const c = { score: 5, maxScore: 10, attemptId: "a", attempts: 1, late: true, changedByStaff: true, reviewOpen: true, simulated: true };
    expect(cellMarkers(c).map((m) => m.key)).toEqual(["late", "staff", "review", "simulated"]);
    expect(cellMarkers({ ...c, late: false, changedByStaff: false, reviewOpen: false, simulated: false })).toEqual([]);
    expect(formatScore(7.125)).toBe("7.13");
    expect(formatScore(8)).toBe("8");
  });
});

describe("statistics helpers", () => {
  it("puts percentages in ten bands, 100 % in the last", () => {
    const bins = histogram([0, 9.9, 10, 55, 100, 100]);
    expect(bins.map((b) => b.count)).toEqual([2, 1, 0, 0, 0, 1, 0, 0, 0, 2]);
    expect(bins[9]).toEqual({ from: 90, to: 100, count: 2 });
  });

  it("ranks the questions by how many students missed them", () => {
    const q = (id: string, mistake: number, wrong: number, missing: number, notSubmitted = 0) => ({
      labId: "l",
      questionId: id,
      quantity: "x",
      position: 1,
      templateKey: "shunt-burden",
      correct: 10 - mistake - wrong - missing,
      close: 0,
      mistake,
      wrong,
      missing,
      notSubmitted,
      topMistake: null,
      topMistakeCount: 0,
    });
    const ranked = mostMissed([q("a", 1, 0, 0), q("b", 2, 2, 0), q("c", 0, 4, 0), q("d", 3, 0, 0), q("e", 0, 0, 0), q("f", 0, 0, 9, 9)]);
    // b misses 4 with 2 mistakes, c misses 4 with none, d misses 3; f was only not submitted
    expect(ranked.map((x) => x.questionId)).toEqual(["b", "c", "d"]);
  });
});

describe("the weights schema", () => {
  it("reads the form's text and the API's numbers, and names a bad field", () => {
    const id = "6f1c2b1e-8a3d-4c5e-9f10-1a2b3c4d5e6f";
    expect(labWeightsSchema.parse({ weights: [{ labId: id, weight: "2,5" }] }).weights[0].weight).toBe(2.5);
    expect(labWeightsSchema.parse({ weights: [{ labId: id, weight: "" }] }).weights[0].weight).toBeNull();
    expect(labWeightsSchema.parse({ weights: [{ labId: id, weight: 3 }] }).weights[0].weight).toBe(3);
    const bad = labWeightsSchema.safeParse({ weights: [{ labId: id, weight: "abc" }] });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(["weights", 0, "weight"]);
    expect(labWeightsSchema.safeParse({ weights: [{ labId: id, weight: -1 }] }).success).toBe(false);
  });
});
