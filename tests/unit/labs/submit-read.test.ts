// The submission form's pure helpers: the "read as" echo, payloads, server field errors, messages.
import { describe, expect, it } from "vitest";
import { echoText, mapServerFields, measuredPayload, newIdempotencyKey, submitErrorMessage, toPayload, uploadErrorMessage, type FormQuestion } from "@/components/labs/submit/form-helpers";
import { echoReading, measuredProblems, readingProblems, submissionResolver } from "@/components/labs/submit/read-quantities";
import { utcDate } from "@/lib/dates";
import { attemptsLeftText, lateRuleText } from "@/lib/labs/wording";

const current: FormQuestion = { id: "q1", label: "True current", unit: "A", displayUnit: "µA", answerKind: "number", points: 2 };
const range: FormQuestion = { id: "q2", label: "Best range", unit: "", displayUnit: "", answerKind: "category", choices: ["nA", "uA", "mA"], points: 1 };

describe("echoReading", () => {
  it("reads the three spellings of 9.1 µA the same way", () => {
    for (const text of ["9.1 uA", "0.0091 mA", "9.1e-6 A", "9.1 µA"]) {
      const e = echoReading(text, "A", "µA");
      expect(e).toMatchObject({ status: "ok", readAs: "9.10 µA" });
      expect(echoText(e)).toBe("Read as 9.10 µA");
    }
  });

  it("refuses a wrong dimension with the grader's message", () => {
    const e = echoReading("9.1 mV", "A");
    expect(e.status).toBe("error");
    expect(echoText(e)).toMatch(/asks for a current/);
  });

  it("asks for a unit on a bare number", () => {
    const e = echoReading("9.1", "A");
    expect(e.status).toBe("error");
    if (e.status === "error") expect(e.message).toMatch(/unit/i);
  });

  it("is silent for an empty field", () => {
    expect(echoReading("   ", "A")).toEqual({ status: "empty" });
    expect(echoText({ status: "empty" })).toBe("");
  });

  it("also shows a display unit of its own (hours for a battery life)", () => {
    const e = echoReading("10 h", "s", "h");
    expect(e).toMatchObject({ status: "ok" });
    if (e.status === "ok") expect(e.readAs).toBe("10.0 h");
    expect(echoReading("220 mAh", "C", "mAh")).toMatchObject({ readAs: "220 mAh (= 792 C)" });
  });

  it("does not repeat a prefixed display unit", () => {
    const e = echoReading("4k7", "ohm", "kΩ");
    expect(e).toMatchObject({ status: "ok", readAs: "4.70 kΩ" });
  });
});

describe("payloads", () => {
  it("trims readings and turns blanks into null", () => {
    expect(toPayload({ q1: " 9.1 uA ", q2: "", q3: undefined })).toEqual({ q1: "9.1 uA", q2: null, q3: null });
  });
  it("sends only the measured values that were filled in", () => {
    expect(measuredPayload({ loadResistance: "1.02 kΩ", shuntResistance: " " })).toEqual({ loadResistance: "1.02 kΩ" });
  });
});

describe("client-side checks", () => {
  it("names only the fields that do not read", () => {
    expect(readingProblems([current, range], { q1: "9.1 uA", q2: "uA" })).toEqual({});
    const p = readingProblems([current, range], { q1: "9.1 mV", q2: "kA" });
    expect(Object.keys(p)).toEqual(["q1", "q2"]);
    expect(p.q2).toBe("Choose one of: nA, uA, mA.");
  });
  it("shows the problem of an ambiguous comma before submitting, and how a lowercase unit is read", () => {
    expect(readingProblems([current], { q1: "3,267 µA" }).q1).toMatch(/3\.267 µA .* or 3267 µA/);
    expect(echoText(echoReading("3 ma", "A"))).toBe("Read as 3.00 mA");
  });
  it("refuses a measured value of zero", () => {
    const comps = [{ key: "loadResistance", label: "Load resistance", unit: "ohm", displayUnit: "kΩ", shown: "1.00 kΩ" }];
    expect(measuredProblems(comps, { loadResistance: "0 ohm" }).loadResistance).toMatch(/greater than zero/);
    expect(measuredProblems(comps, { loadResistance: "" })).toEqual({});
  });
});

describe("the form's resolver", () => {
  const comps = [{ key: "loadResistance", label: "Load resistance", unit: "ohm", displayUnit: "kΩ", shown: "1.00 kΩ" }];
  const values = (readings: Record<string, string>, measured: Record<string, string> = {}) => ({ idempotencyKey: "form-key-0001", readings, measured, uploadIds: [] });
  const resolve = (v: ReturnType<typeof values>) =>
    submissionResolver([current, range], comps)(v, undefined, { fields: {}, shouldUseNativeValidation: false });

  it("passes readings that read, with the schema's output", async () => {
    const r = await resolve(values({ q1: "9.1 uA", q2: "uA" }, { loadResistance: "1.02 kΩ" }));
    expect(r.errors).toEqual({});
    expect(r.values).toMatchObject({ readings: { q1: "9.1 uA", q2: "uA" }, measured: { loadResistance: "1.02 kΩ" }, uploadIds: [] });
  });

  it("names each field that does not read, and applies the route's schema (its length limit)", async () => {
    const r = await resolve(values({ q1: "9.1 mV", q2: "x".repeat(201) }, { loadResistance: "0 ohm" }));
    const errors = r.errors as { readings?: Record<string, { message?: string }>; measured?: Record<string, { message?: string }> };
    expect(errors.readings?.q1?.message).toMatch(/asks for a current/);
    expect(errors.readings?.q2?.message).toBe("Use at most 200 characters.");
    expect(errors.measured?.loadResistance?.message).toMatch(/greater than zero/);
  });
});

describe("idempotency keys", () => {
  it("uses randomUUID when there is one", () => {
    expect(newIdempotencyKey({ randomUUID: () => "11111111-2222-4333-8444-555555555555", getRandomValues: (a: Uint8Array) => a } as never)).toBe("11111111-2222-4333-8444-555555555555");
  });
  it("falls back to 128 random bits in hex", () => {
    const key = newIdempotencyKey({ getRandomValues: <T extends ArrayBufferView | null>(a: T) => { (a as unknown as Uint8Array).fill(171); return a; } });
    expect(key).toBe("ab".repeat(16));
  });
  it("differs between two forms", () => {
    expect(newIdempotencyKey()).not.toBe(newIdempotencyKey());
  });
});

describe("server errors", () => {
  it("maps readings and measured fields onto the form, the rest to files or the form", () => {
    const m = mapServerFields(
      { "readings.q2": ["That unit is not a voltage."], "readings.q9": ["This lab has no such question."], "measured.loadResistance": ["Bad."], uploadIds: ["Not yours."] },
      { readings: ["q1", "q2"], measured: ["loadResistance"] },
    );
    expect(m.fields).toEqual([
      { path: "readings.q2", message: "That unit is not a voltage." },
      { path: "measured.loadResistance", message: "Bad." },
    ]);
    expect(m.files).toEqual(["Not yours."]);
    expect(m.form).toEqual(["This lab has no such question."]);
  });
  it("says what happened for each status", () => {
    expect(submitErrorMessage(0, {})).toMatch(/did not reach the server/);
    expect(submitErrorMessage(409, { message: "You have used all 3 attempts of this lab." })).toBe("You have used all 3 attempts of this lab.");
    expect(uploadErrorMessage(413, { message: "The file is 12 MB; the limit is 10 MB." })).toBe("The file is 12 MB; the limit is 10 MB.");
    expect(uploadErrorMessage(415, {})).toMatch(/PNG or JPEG/);
  });
});

describe("lab rules in words", () => {
  it("counts attempts left", () => {
    expect(attemptsLeftText(1, 3)).toBe("2 of 3 attempts left.");
    expect(attemptsLeftText(3, 3)).toBe("You have used all 3 attempts.");
    expect(attemptsLeftText(0, 1)).toBe("1 of 1 attempt left.");
  });
  it("writes dates in UTC the same on server and browser", () => {
    expect(utcDate(new Date("2027-03-12T17:05:00Z"))).toBe("12 Mar 2027, 17:05 UTC");
    expect(utcDate(null)).toBe("");
  });
  it("states the late rule", () => {
    expect(lateRuleText({ dueAt: null, closesAt: null, latePenaltyPercentPerDay: 10, lateFloorPercent: 50 })).toBe("This lab has no due date.");
    expect(lateRuleText({ dueAt: "2027-03-12T17:00:00Z", closesAt: "2027-03-17T17:00:00Z", latePenaltyPercentPerDay: 10, lateFloorPercent: 50 })).toBe(
      "Due 12 Mar 2027, 17:00 UTC. Each day late (or part of a day) takes 10 % off the score, but a late attempt keeps at least 50 % of its score. Closes 17 Mar 2027, 17:00 UTC: no attempt is accepted after that.",
    );
    expect(lateRuleText({ dueAt: "2027-03-12T17:00:00Z", closesAt: "2027-03-12T17:00:00Z", latePenaltyPercentPerDay: 0, lateFloorPercent: 0 })).toBe(
      "Due 12 Mar 2027, 17:00 UTC. Closes 12 Mar 2027, 17:00 UTC: no attempt is accepted after that.",
    );
  });
});
