// Pairing the unseated students of a section at random, and naming new benches.
import { describe, expect, it } from "vitest";
import { nextBenchNames, randomPairs } from "@/lib/benches/pairing";
import { benchesSchema } from "@/lib/validation/benches";

const people = (n: number) => Array.from({ length: n }, (_, i) => ({ userId: `u${i}` }));

describe("randomPairs", () => {
  it("seats everyone once, in pairs, and puts an odd one out into the last pair (no one alone)", () => {
    for (const n of [2, 5, 9, 40]) {
      const groups = randomPairs(people(n));
      expect(groups.flat().map((p) => p.userId).sort()).toEqual(people(n).map((p) => p.userId).sort());
      expect(groups.map((g) => g.length).sort()).toEqual(n % 2 ? [...Array(groups.length - 1).fill(2), 3] : Array(groups.length).fill(2));
    }
    expect(randomPairs(people(1))).toEqual([[{ userId: "u0" }]]);
    expect(randomPairs([])).toEqual([]);
  });

  it("depends on the random source: two different sources give two different pairings of 20", () => {
    const seq = (seed: number) => () => ((seed = (seed * 16807) % 2147483647) - 1) / 2147483646; // Park–Miller minimal standard generator (Park & Miller, CACM 1988)
    const a = randomPairs(people(20), seq(1)).map((g) => g.map((p) => p.userId).join("+"));
    const b = randomPairs(people(20), seq(2)).map((g) => g.map((p) => p.userId).join("+"));
    expect(a).not.toEqual(b);
  });
});

describe("nextBenchNames", () => {
  it("skips names already taken, whatever their case", () => {
    expect(nextBenchNames(["Bench 01", "bench 03"], 3)).toEqual(["Bench 02", "Bench 04", "Bench 05"]);
  });
});

describe("benchesSchema", () => {
  const id = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;
  it("names the field of a student on two benches, a duplicate name and a fifth student", () => {
    const r = benchesSchema.safeParse({
      benches: [
        { name: "Bench 01", memberIds: [id(1), id(2)] },
        { name: "bench 01", memberIds: [id(2)] },
      ],
    });
    expect(r.error!.issues.map((i) => i.path.join("."))).toEqual(["benches.1.name", "benches.1.memberIds.0"]);
    const five = benchesSchema.safeParse({ benches: [{ name: "Bench 03", memberIds: [id(3), id(4), id(5), id(6), id(7)] }] });
    expect(five.error!.issues.map((i) => i.path.join("."))).toEqual(["benches.0.memberIds"]);
  });

  it("refuses control characters in a bench name and trims it", () => {
    expect(benchesSchema.safeParse({ benches: [{ name: "Bench\u000001", memberIds: [] }] }).success).toBe(false);
    expect(benchesSchema.parse({ benches: [{ name: "  Bench 02 ", section: "", memberIds: [] }] }).benches[0]).toEqual({ name: "Bench 02", section: null, memberIds: [] });
  });
});
