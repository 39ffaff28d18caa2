// Every number the lessons state comes from lib/lessons/examples.ts through the grader. Here each is
// recomputed through lib/grader and compared with the lib/grader/PHYSICS.md check value (relative 5e-4); the source
// tag of each value is beside it in examples.ts and repeated in the test name.
import { describe, expect, it } from "vitest";
import { gradeAttempt, isTemplateKey, templates } from "@/lib/grader";
import { examples } from "@/lib/lessons/examples";
import { computeExample } from "@/lib/lessons/compute";
import { questions, renderPrompt } from "@/lib/lessons/questions";
import { teaching } from "@/lib/lessons/teaching";

describe("lesson examples agree with lib/grader", () => {
  for (const e of examples) {
    const values = computeExample(e);
    for (const c of e.checks) {
      it(`${e.id}: ${c.quantity} = ${c.expected} (${c.source})`, () => {
        const got = values.quantities[c.quantity];
        if (typeof c.expected === "string") expect(got).toBe(c.expected);
        else if (c.expected === 0) expect(Math.abs(got as number)).toBeLessThan(1e-15);
        else expect(Math.abs((got as number) / c.expected - 1)).toBeLessThanOrEqual(5e-4);
      });
    }
  }

  it("uses only template keys and quantities that the grader defines", () => {
    for (const e of examples) {
      if (e.kind !== "template") continue;
      expect(isTemplateKey(e.template), e.id).toBe(true);
      const keys = templates[e.template as keyof typeof templates].quantities.map((q) => q.key);
      for (const c of e.checks) expect(keys, `${e.id}.${c.quantity}`).toContain(c.quantity);
    }
  });
});

describe("teaching helpers the grader has no template for", () => {
  it("shot noise of 1 mA over 1 kHz is 566.1 pA rms (PHYSICS.md §7 7f [FORMULA: exact q])", () => {
    expect(teaching.shotNoise({ current: 1e-3, bandwidth: 1e3 }).noiseCurrent / 566.1e-12 - 1).toBeLessThan(5e-4);
  });
});

describe("check-yourself questions", () => {
  for (const q of questions) {
    it(`${q.id}: asks for a quantity of its template and fills its prompt`, () => {
      expect(isTemplateKey(q.template)).toBe(true);
      expect(templates[q.template as keyof typeof templates].quantities.map((x) => x.key)).toContain(q.quantity);
      const prompt = renderPrompt(q);
      expect(prompt).not.toMatch(/[{}]/);
      expect(prompt.length).toBeGreaterThan(30);
    });
  }

  // Answers typed as a student would, from the lib/grader/PHYSICS.md check values.
  const domainAnswers: [string, string, string][] = [
    ["safety-shunt-power", "326.7 mW", "PHYSICS.md §1 1h [FORMULA]"],
    ["burden-low-rail", "16.36 mA", "PHYSICS.md §2 2c [FORMULA]"],
    ["burden-motor-drop", "551 mV", "PHYSICS.md §2 2d [FORMULA]"],
    ["shunt-micro-e96", "3.01 kΩ", "PHYSICS.md §1 1i [FORMULA]"],
    ["range-radio-volts", "1.5 V", "PHYSICS.md §12.2 (1.500 V ↔ 300 µA on the 500 µA range) [FORMULA]"],
    ["autorange-edge-code", "163", "PHYSICS.md §3 3i [FORMULA]"],
    ["resolution-code", "1638", "PHYSICS.md §3 3g [FORMULA]"],
    ["resolution-step", "61.04 uA", "PHYSICS.md §3 3k [FORMULA]"],
    ["filter-cutoff", "159.2 Hz", "PHYSICS.md §6 6a [FORMULA]"],
    ["filter-settle", "46.05 ms", "PHYSICS.md §6 6b [FORMULA]"],
    ["bidir-discharge", "-120.0 uA", "PHYSICS.md §5 5i [FORMULA]"],
    ["bidir-code-6000", "-668.9 nA", "PHYSICS.md §5 5h [FORMULA]"],
    ["bidir-charge-code", "99.98 mA", "PHYSICS.md §5 5g [FORMULA]"],
    ["duty-average", "15.50 uA", "PHYSICS.md §8 8c [FORMULA]"],
    ["duty-life", "871.4 h", "PHYSICS.md §8 8b [FORMULA]"],
    ["unc-amp-expanded", "7.767 mA", "PHYSICS.md §9 9d [FORMULA]"],
    // by hand: 2.5 V/(16384 × 50) = 3.0518 µV, /√12 = 0.88097 µV, /0.1 Ω (GUM F.2.2.1)
    ["unc-chain-quantisation", "8.810 uA", "by hand, q/√12 [FORMULA]"],
    // by hand: (3 mV/50 GΩ + 10 pA)/2 nA (Ohm's law)
    ["leak-guarded-error", "0.503 %", "by hand [FORMULA]"],
    ["leak-unguarded", "300 pA", "15 V/50 GΩ, Ohm's law [FORMULA]"],
    // by hand: (20 µV + 3 µV/K × 2 K)/2 mΩ; −250 mA × 2 mΩ + 26 µV
    ["thermal-apparent", "13 mA", "by hand [FORMULA]"],
    ["thermal-reversal", "-474 uV", "by hand [FORMULA]"],
    // by hand: 40/8 ms; |1/0.95 s − 1 Hz|
    ["burst-min-rate", "5 kHz", "by hand [FORMULA]"],
    ["burst-alias", "52.63 mHz", "by hand [FORMULA]"],
    ["fb-settling", "2.164 ms", "PHYSICS.md §21 21b [FORMULA]"],
    ["fb-noise", "296.9 fA", "PHYSICS.md §21 21b [FORMULA]"],
  ];
  for (const [id, answer, source] of domainAnswers) {
    it(`${id}: "${answer}" is graded correct (${source})`, () => {
      const q = questions.find((x) => x.id === id)!;
      const r = gradeAttempt({
        template: q.template as keyof typeof templates,
        params: q.params,
        questions: [{ quantity: q.quantity, points: 1, kind: "prediction" }],
        readings: { [q.quantity]: answer },
      });
      expect(r.results[0].verdict).toBe("correct");
    });
  }
});
