// Kits: one bag per bench with everyone's parts, a bag per student at no bench, totals against the shelf.
import { describe, expect, it } from "vitest";
import { buildKits } from "@/lib/benches/kits";
import type { VariantSpec } from "@/lib/grader";

const spec = { template: "shunt-burden", parameters: { loadResistance: { mode: "fixed", value: 470, tolerancePercent: 1 }, shuntResistance: { mode: "fixed", value: 10, tolerancePercent: 5 } } } as unknown as VariantSpec;
const circuit = (load: number, shunt: number) => ({ supplyVoltage: 5, loadResistance: load, shuntResistance: shunt });

describe("buildKits", () => {
  it("counts the parts of everyone at a bench in one bag and compares the totals with the shelf (tighter tolerance counts)", () => {
    const a = { userId: "a", name: "A" };
    const b = { userId: "b", name: "B" };
    const c = { userId: "c", name: "C" };
    const { kits, totals } = buildKits(
      "shunt-burden",
      spec,
      [{ name: "Bench 01", members: [a, b] }, { name: "Bench 02", members: [] }],
      [c],
      new Map([
        ["a", circuit(470, 10)],
        ["b", circuit(330, 10)],
        ["c", circuit(470, 22)],
      ]),
      [
        { kind: "resistor", value: 470, tolerancePercent: 0.5, quantity: 1 },
        { kind: "resistor", value: 10, tolerancePercent: 10, quantity: 5 },
        { kind: "capacitor", value: 470, tolerancePercent: 1, quantity: 9 },
      ],
    );
    expect(kits.map((k) => [k.bench, k.student?.name ?? null, k.parts.map((p) => `${p.count}×${p.value}`)])).toEqual([
      ["Bench 01", null, ["2×10", "1×330", "1×470"]],
      [null, "C", ["1×22", "1×470"]],
    ]);
    // hand count: 470 Ω 1 % needed twice, one 0.5 % on the shelf (as tight or tighter); 10 Ω 5 % needed twice, the 10 % ones do not count; capacitors never match
    expect(totals.map((t) => [t.value, t.needed, t.inStock])).toEqual([
      [10, 2, 0],
      [22, 1, 0],
      [330, 1, 0],
      [470, 2, 1],
    ]);
  });
});
