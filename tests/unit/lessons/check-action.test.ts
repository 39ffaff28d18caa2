// The check-yourself server action: the question is looked up by id, the answer graded by gradeAttempt,
// and the worked solution comes back as KaTeX HTML rendered on the server.
import { describe, expect, it } from "vitest";
import { checkLessonAnswer as checkAnswer } from "@/lib/lessons/check";

describe("checkAnswer", () => {
  it("accepts the right answer with its unit and returns a typeset solution", async () => {
    const r = await checkAnswer("burden-low-rail", "16.36 mA"); // PHYSICS.md §2 2c [FORMULA]
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.verdict).toBe("correct");
    expect(r.solutionHtml.length).toBeGreaterThan(0);
    expect(r.solutionHtml.join("")).toContain('class="katex');
  });
  it("names the ignored-burden slip", async () => {
    const r = await checkAnswer("burden-low-rail", "18 mA"); // PHYSICS.md §12.1: Vs/RL, the meter ignored
    expect(r.ok && r.verdict).toBe("mistake");
  });
  it("refuses a wrong dimension", async () => {
    const r = await checkAnswer("burden-low-rail", "16.36 mV");
    expect(r.ok && r.verdict).toBe("unit");
  });
  it("asks for an answer when the field is empty, and rejects unknown questions", async () => {
    expect(await checkAnswer("burden-low-rail", "  ")).toMatchObject({ ok: false });
    expect(await checkAnswer("no-such-question", "1 mA")).toMatchObject({ ok: false });
  });
});

describe("feedback for a reader of the lesson", () => {
  // the lesson's questions are not graded: no lab tolerance, no points, and each thing said once
  const jargon = /lab tolerance|points|accepted band|The answer is/;
  it("speaks of the worked solution, not of bands and points, for every verdict", async () => {
    const cases: [string, string][] = [
      ["16.36 mA", "correct"], // PHYSICS.md §2 2c [FORMULA]
      ["16.6 mA", "close"], // 1.5 % off, within twice the 1 % band (by hand)
      ["18 mA", "mistake"], // PHYSICS.md §12.1: V_s/R_L
      ["16.36 mV", "unit"],
      ["30 mA", "wrong"],
    ];
    for (const [answer, verdict] of cases) {
      const r = await checkAnswer("burden-low-rail", answer);
      expect(r.ok && r.verdict, answer).toBe(verdict);
      if (!r.ok) continue;
      expect(r.feedback, answer).not.toMatch(jargon);
      expect(r.feedback.length, answer).toBeGreaterThan(10);
    }
  });
  it("names what the student did: the shunt counted in the true current is not 'burden ignored'", async () => {
    // PHYSICS.md §2 2c [FORMULA]: 1.8 V, 100 Ω, 10 Ω: true 18.00 mA, indicated 16.36 mA
    const { gradeAttempt } = await import("@/lib/grader");
    const r = gradeAttempt({
      template: "shunt-burden",
      params: { supplyVoltage: 1.8, loadResistance: 100, shuntResistance: 10 },
      questions: [{ quantity: "trueCurrent", kind: "prediction", points: 1 }],
      readings: ["16.36 mA"],
    }).results[0];
    expect(r.mistake).toBe("ignored-burden");
    expect(r.feedback).toMatch(/Meter's shunt counted in the true current\./);
    expect(r.feedback).not.toMatch(/Burden voltage ignored/);
  });
});
