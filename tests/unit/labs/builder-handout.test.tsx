// The handout's Markdown (instructions written in the builder, rendered by react-markdown): the blocks and
// inline marks it shows, and that typed HTML stays text.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Handout, Markdown, type HandoutData } from "@/components/labs/handout";

const html = (src: string) => renderToStaticMarkup(<Markdown source={src} />);

describe("handout Markdown", () => {
  it("renders paragraphs, headings, lists and code blocks", () => {
    const out = html("# Setup\nFirst line\nsecond line\n\n- one\n- two\n  continued\n\n1. a\n2) b\n\n```\nI = V / R\n```\nlast");
    // CommonMark: "2)" after "1." starts a second numbered list; the lazy line "continued" joins item two.
    expect(out.replace(/\n/g, " ")).toBe(
      '<h3 class="mt-4 mb-1 text-base font-semibold">Setup</h3> <p class="my-2">First line second line</p> ' +
        '<ul class="my-2 list-disc pl-6"> <li>one</li> <li>two continued</li> </ul> ' +
        '<ol class="my-2 list-decimal pl-6"> <li>a</li> </ol> <ol class="my-2 list-decimal pl-6"> <li>b</li> </ol> ' +
        '<pre class="my-2 overflow-x-auto rounded-md bg-paper-sunk p-3 font-mono text-sm"><code>I = V / R</code></pre> <p class="my-2">last</p>',
    );
  });

  it("renders bold, italic and code inline", () => {
    expect(html("Keep **the supply off** while *wiring*, then read `I_meas`.")).toBe(
      '<p class="my-2">Keep <strong>the supply off</strong> while <em>wiring</em>, then read <code class="rounded bg-paper-sunk px-1 font-mono text-[0.9em]">I_meas</code>.</p>',
    );
    expect(html("a snake_case_name stays")).toContain("snake_case_name");
  });

  it("headings start below the handout's own", () => {
    expect(html("## Readings")).toMatch(/^<h4/);
  });

  it("never turns typed HTML into markup", () => {
    const out = html('<script>alert(1)</script> and <img src=x onerror="y">');
    expect(out).not.toContain("<script>");
    expect(out).not.toContain("<img");
    expect(out).toContain("&lt;script&gt;");
  });
});

describe("the handout", () => {
  const handout = {
    lab: {
      id: "00000000-0000-4000-8000-000000000001",
      courseId: "00000000-0000-4000-8000-000000000002",
      title: "Burden on the bench",
      templateKey: "shunt-burden",
      status: "published",
      opensAt: new Date("2026-12-01T08:00:00Z"),
      dueAt: new Date("2026-12-08T17:00:00Z"),
      attemptsAllowed: 3,
      counting: "best",
      version: 1,
      questions: [{ id: "q1", quantity: "burdenVoltage", kind: "bench", points: 2 }],
      latePenaltyPercentPerDay: 10,
      lateFloorPercent: 50,
      showExpected: "after_due",
      instructions: "Measure **carefully**.",
      safetyNotes: "Keep the supply below 6 V.",
    },
    template: { key: "shunt-burden", title: "Burden voltage of a shunt ammeter" },
    params: { supplyVoltage: 3.3, loadResistance: 4700, shuntResistance: 10 },
    parameters: [
      { key: "loadResistance", label: "Load resistance", symbol: "R_\\mathrm{L}", unit: "ohm", displayUnit: "Ω", kind: "resistor", value: 4700, shown: "4.70 kΩ", tolerancePercent: 5, series: "E12" },
    ],
    questions: [
      { id: "q1", quantity: "burdenVoltage", label: "Burden voltage", description: "The voltage across the shunt.", symbol: "V_\\mathrm{B}", unit: "V", displayUnit: "mV", kind: "bench", answerKind: "number", choices: undefined, points: 2 },
    ],
  } as unknown as HandoutData;

  it("shows the dates, the rules, the safety box, the diagram, the student's values and the questions", () => {
    const out = renderToStaticMarkup(<Handout handout={handout} timeZone="UTC" />);
    expect(out).toContain("<h1");
    expect(out).toContain("Burden on the bench");
    expect(out).toContain("Tuesday, 8 December 2026 at 17:00 UTC");
    expect(out).toContain("3 attempts; the best one counts");
    expect(out).toContain("10 % off per day");
    expect(out).toContain("Keep the supply below 6 V.");
    expect(out).toContain("lab rules");
    expect(out).toContain('data-template="shunt-burden"');
    expect(out).toContain("4.70 kΩ");
    expect(out).toContain("± 5 % (E12 series)");
    expect(out).toContain("bench reading · 2 points");
    expect(out).toContain("for example in mV");
    expect(out).toContain("<strong>carefully</strong>");
  });
});
