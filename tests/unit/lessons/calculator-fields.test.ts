// The lesson calculators' fields read what their hints show, and refuse with the field's name and the reason
// (issue "Physics that an expert would sign", §2 Calculators). Values: the hint texts of components/lesson.
import { describe, expect, it } from "vitest";
import { readField, type FieldDef } from "@/components/lesson/fields";

const rIn: FieldDef = { label: "Ammeter input resistance R_in", unit: "ohm", initial: "10 Ω", hint: "The shunt plus fuse and leads, e.g. 10, 1R8, 100 ohm" };
const current: FieldDef = { label: "Current to measure", unit: "A", initial: "500 nA" };
const width: FieldDef = { label: "Width of a current pulse", unit: "s", initial: "1 ms" };

describe("calculator fields", () => {
  it("read every example the resistance hint shows: 10, 1R8, 100 ohm", () => {
    expect(readField("10", rIn)).toEqual({ ok: true, value: 10 });
    expect(readField("1R8", rIn)).toEqual({ ok: true, value: 1.8 });
    expect(readField("100 ohm", rIn)).toEqual({ ok: true, value: 100 });
    expect(readField("4k7", rIn)).toEqual({ ok: true, value: 4700 });
    expect(readField("0,5", rIn)).toEqual({ ok: true, value: 0.5 });
  });
  it("refuses a zero or negative resistance, naming the field", () => {
    for (const t of ["0", "-10", "-4k7", "0 ohm"]) {
      const r = readField(t, rIn);
      expect(r.ok, t).toBe(false);
      if (!r.ok) expect(r.message, t).toMatch(/^Ammeter input resistance R_in/);
    }
  });
  it("still asks for a unit where a bare number is ambiguous (a current: A, mA or µA?), naming the field", () => {
    const r = readField("3.3", current);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/^Current to measure: .*unit/i);
  });
  it("refuses a zero time and an unreadable text, each saying what is wrong", () => {
    expect(readField("0 ms", width)).toEqual({ ok: false, message: "Width of a current pulse must be above zero." });
    const junk = readField("abc", width);
    expect(junk.ok).toBe(false);
    if (!junk.ok) expect(junk.message.length).toBeGreaterThan("Width of a current pulse: ".length + 10);
  });
});
