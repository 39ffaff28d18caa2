// The feedback page's pure helpers: verdict words and counts, values, bands, score line, trace rows.
import { describe, expect, it } from "vitest";
import { bandText, expectedValue, scoreLine, studentValue, verdictCounts, verdictInfo, verdictSummary, VERDICTS } from "@/components/labs/feedback/verdict";
import { traceRowsNote, traceUnitsNote } from "@/components/labs/feedback/trace-numbers";

describe("verdicts", () => {
  it("every verdict has a word and an icon, not only a colour", () => {
    for (const v of Object.values(VERDICTS)) {
      expect(v.word).toMatch(/\w/);
      expect(v.icon.length).toBeGreaterThan(0);
    }
    expect(verdictInfo("something-new").word).toBe("Not accepted");
  });
  it("counts and summarises", () => {
    const rs = [{ verdict: "correct" }, { verdict: "correct" }, { verdict: "mistake" }, { verdict: "missing" }];
    expect(verdictCounts(rs)).toEqual({ correct: 2, close: 0, mistake: 1, unit: 0, wrong: 0, missing: 1 });
    expect(verdictSummary(rs)).toBe("2 correct, 1 recognised mistake, 1 no answer");
  });
});

describe("values", () => {
  const r = { unit: "A", displayUnit: "µA", answer: 9.1e-6, readAs: "9.10 µA", expected: 9.09e-6, band: [9.0e-6, 9.18e-6] as [number, number] };
  it("shows what the grader read, else what was typed", () => {
    expect(studentValue(r)).toBe("9.10 µA");
    expect(studentValue({ ...r, readAs: undefined, answer: null }, "9.1 mV")).toBe("“9.1 mV”");
    expect(studentValue({ ...r, readAs: undefined, answer: null })).toBe("no answer");
    expect(studentValue({ unit: "", displayUnit: "", answer: "uA" })).toBe("µA");
  });
  it("shows the expected value and band in the display unit", () => {
    expect(expectedValue(r)).toBe("9.09 µA");
    expect(bandText(r)).toBe("from 9.00 µA to 9.18 µA");
    expect(expectedValue({ ...r, expected: undefined })).toBeNull();
    expect(bandText({ ...r, band: null })).toBeNull();
  });
  it("spells out a late penalty", () => {
    expect(scoreLine({ score: 8, rawScore: 8, maxScore: 10, lateDays: 0, penaltyPercent: 0 })).toBe("8 of 10 points");
    expect(scoreLine({ score: 7.2, rawScore: 8, maxScore: 10, lateDays: 1, penaltyPercent: 10 })).toBe("7.2 of 10 points (8 before a late penalty of 10 % for 1 day late)");
  });
});

describe("trace notes", () => {
  const a = {
    rows: 4000,
    badRows: 2,
    badRowExamples: [{ line: 12, reason: "not a number" }, { line: 40, reason: "time not increasing" }],
    averageCurrent: 202e-6,
    minCurrent: 2e-6,
    maxCurrent: 20e-3,
    twoLevel: true,
    sleepLevel: 2e-6,
    activeLevel: 20e-3,
    dutyCycle: 0.01,
    wakes: 4,
    period: 1,
    activeTimePerWake: 0.01,
    chargePerWake: 200e-6,
    batteryLife: 3.6e6,
    duration: 4,
    units: { time: "ms" as const, current: "uA" as const, timeSource: "header" as const, currentSource: "header" as const, inferred: false },
  };
  it("reports bad rows and units", () => {
    expect(traceRowsNote(a)).toBe("4,000 rows read; 2 bad rows skipped (line 12: not a number; line 40: time not increasing).");
    expect(traceUnitsNote(a)).toBe("Time in ms, current in µA, as the header says.");
  });
});
