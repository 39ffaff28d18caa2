// The course's meter is Shuntwise's own teaching meter. The seed document's former meter, whose set of values
// (three ranges at 1 mV per nA, per µA and per mA; a 3.3 V full scale; a 12-bit converter on a 3.3 V reference;
// a 1.65 V mid-scale offset) is one existing instrument's published specification, may appear only inside tests
// as check values marked common practice. This test fails when a lesson, a template default, a seed lab, a
// worked example, a check question, a diagram or a calculator uses that set again.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { templates, TEMPLATE_KEYS } from "@/lib/grader";
import { examples } from "@/lib/lessons/examples";
import { questions } from "@/lib/lessons/questions";
import { LIBRARY, teachingMeter } from "@/lib/instruments/library";

const root = path.resolve(__dirname, "../../..");
const FORMER = {
  // common practice: the seed document's meter, kept here only as the values to refuse
  sensitivities: [1e6, 1e3, 1],
  fullScaleVolts: 3.3,
  bits: 12,
  referenceVolts: 3.3,
  offsetVolts: 1.65,
};

function files(dir: string, ext: RegExp): string[] {
  const out: string[] = [];
  for (const e of fs.readdirSync(path.join(root, dir), { withFileTypes: true })) {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) out.push(...files(rel, ext));
    else if (ext.test(e.name)) out.push(rel);
  }
  return out;
}

/** Phrases that name the former meter's ranges or its converter, in any text a reader sees. */
const FORMER_TEXT = [
  /\b1\s*mV\s*(\/|per)\s*(nA|[µu]A|mA)\b/i,
  /\b1\.65\s*V\b/,
  /\b12-bit\b[^.]*\b3\.3\s*V\b/i,
  /\bteaching design, not a published instrument\b/i,
];

/** A parameter set that is the former meter's: its converter, its offset or its full scale with an offset. */
function formerParams(p: Record<string, unknown>): string | null {
  if (p.adcBits === FORMER.bits && p.adcReference === FORMER.referenceVolts) return "12-bit converter on 3.3 V";
  if (p.offsetVoltage === FORMER.offsetVolts) return "1.65 V offset";
  if (p.fullScaleVoltage === FORMER.fullScaleVolts && (p.adcBits !== undefined || p.offsetVoltage !== undefined)) return "3.3 V full scale";
  if (p.adcReference === FORMER.referenceVolts && p.adcBits !== undefined) return "3.3 V converter reference";
  return null;
}

/** A range named by a unit alone ("the nA range", "µA: 10 Ω"), not by its full scale ("the 500 µA range"). */
function unitOnlyRange(text: string): string | null {
  return /(?<![\d.]\s*)(?<!\w)(nA|[µu]A|mA)(\s+range\b|:\s*10)/.exec(text)?.[0] ?? null;
}

describe("no page of the course uses the former meter", () => {
  const sources = [
    ...files("content/lessons", /\.mdx$/),
    ...files("components/lesson", /\.tsx?$/),
    ...files("scripts/seed", /\.ts$/),
    ...files("lib/lessons", /\.ts$/),
    ...files("lib/grader/templates", /\.ts$/),
    ...files("lib/instruments", /\.ts$/),
  ];
  it("finds the files it scans", () => {
    expect(sources.length).toBeGreaterThan(30);
    expect(sources).toContain(path.join("content/lessons", "ranges-and-full-scale.mdx"));
  });
  for (const f of sources) {
    it(`${f} names none of the former meter's ranges, converter or offset`, () => {
      const text = fs.readFileSync(path.join(root, f), "utf8");
      for (const re of FORMER_TEXT) expect(text, `${f}: ${re}`).not.toMatch(re);
      expect(unitOnlyRange(text), f).toBeNull();
    });
  }

  it("no template default is the former meter's", () => {
    for (const key of TEMPLATE_KEYS) {
      const defaults = Object.fromEntries(templates[key].parameters.map((p) => [p.key, p.default]));
      expect(formerParams(defaults), key).toBeNull();
    }
  });

  it("no worked example and no check question uses the former meter's values", () => {
    for (const e of examples) expect(formerParams(e.params as Record<string, unknown>), e.id).toBeNull();
    for (const q of questions) expect(formerParams(q.params), q.id).toBeNull();
  });

  it("the range-resolution template's ranges are the teaching meter's, none of the former sensitivities", () => {
    const s = teachingMeter.ranges.map((r) => r.sensitivity);
    for (const x of FORMER.sensitivities) expect(s).not.toContain(x);
    expect(templates["range-resolution"].quantities.find((q) => q.key === "bestRange")?.choices).toEqual(teachingMeter.ranges.map((r) => r.label));
  });

  it("no built-in profile has the former meter's converter, offset or three 1 mV-per-unit ranges", () => {
    for (const p of LIBRARY) {
      const s = p.ranges.map((r) => r.sensitivity).filter((x) => x !== undefined);
      expect(FORMER.sensitivities.every((x) => s.includes(x)), p.name).toBe(false);
      expect(p.offset?.volts, p.name).not.toBe(FORMER.offsetVolts);
      for (const r of p.ranges) {
        if ("bits" in r.resolution) expect(r.resolution.bits === FORMER.bits && r.resolution.referenceVolts === FORMER.referenceVolts, `${p.name} ${r.label}`).toBe(false);
      }
    }
  });

  it("the seed's demo labs draw none of the former meter's values", () => {
    const seed = fs.readFileSync(path.join(root, "scripts/seed/labs.ts"), "utf8");
    expect(seed).not.toMatch(/offsetVoltage:\s*fixed\(1\.65\)/);
    expect(seed).not.toMatch(/adcReference:\s*fixed\(3\.3\)/);
    expect(seed).not.toMatch(/fullScaleVoltage:\s*fixed\(3\.3\)/);
  });
});
