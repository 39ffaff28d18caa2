// The gradebook links a missed question to the lesson that teaches its quantity, not merely one lesson of
// its template. Expected lessons are read off each lesson's own objectives (content/lessons/*.mdx), e.g.
// resolution.mdx: "Convert one LSB into a current on each range"; noise-floor.mdx: "Use the noise
// bandwidth of a first-order filter".
import { describe, expect, it } from "vitest";
import { templates } from "@/lib/grader";
import { readLessonFiles } from "@/lib/lessons/files";
import { lessonFor } from "@/lib/lessons/lesson-for";

const lessons = readLessonFiles();

describe("lessonFor", () => {
  it.each([
    ["range-resolution", "bestRange", "ranges-and-full-scale"],
    ["range-resolution", "outputVoltage", "ranges-and-full-scale"],
    ["range-resolution", "currentResolution", "resolution"],
    ["range-resolution", "adcCode", "resolution"],
    ["filter-noise", "cutoffFrequency", "filtering-and-settling"],
    ["filter-noise", "settlingTime1pct", "filtering-and-settling"],
    ["filter-noise", "noiseBandwidth", "noise-floor"],
    ["filter-noise", "thermalNoiseCurrent", "noise-floor"],
    ["shunt-selection", "standardShunt", "choosing-a-shunt"],
    ["shunt-selection", "shuntPower", "choosing-a-shunt"],
    ["shunt-burden", "burdenVoltage", "burden-voltage"],
    ["uncertainty", "combinedStandardUncertainty", "uncertainty-budget"],
  ])("%s / %s is taught in %s", (template, quantity, slug) => {
    expect(lessonFor(lessons, template, quantity)?.slug).toBe(slug);
  });

  it("names only quantities that the lesson's templates have", () => {
    for (const l of lessons) {
      const known = new Set(l.templates.flatMap((t) => templates[t].quantities.map((q) => q.key)));
      for (const q of l.quantities ?? []) expect(known, `${l.slug}: ${q}`).toContain(q);
    }
  });

  it("finds, for every quantity of every template, a lesson that names it or teaches all its template's quantities", () => {
    for (const t of Object.values(templates)) {
      for (const q of t.quantities) {
        const l = lessonFor(lessons, t.key, q.key);
        expect(l, `${t.key}/${q.key}`).toBeDefined();
        expect(l!.quantities === undefined || l!.quantities.includes(q.key), `${t.key}/${q.key} → ${l!.slug}`).toBe(true);
      }
    }
  });

  it("falls back to a lesson of the template when none names the quantity, and to nothing for an unknown template", () => {
    const two = [
      { slug: "b", title: "B", order: 2, templates: ["duty-cycle" as const], quantities: ["batteryLife"] },
      { slug: "a", title: "A", order: 1, templates: ["duty-cycle" as const], quantities: ["averageCurrent"] },
    ];
    expect(lessonFor(two, "duty-cycle", "batteryLife")?.slug).toBe("b");
    expect(lessonFor(two, "duty-cycle", "chargePerWake")?.slug).toBe("a");
    expect(lessonFor(two, "uncertainty", "current")).toBeUndefined();
  });
});
