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
