import { describe, expect, it, vi } from "vitest";
import fc from "fast-check";
import { formatQuantity, parseQuantity, texQuantity } from "../../../lib/grader";

// thousands of generated cases: allow for a busy machine
vi.setConfig({ testTimeout: 60_000 });

const value = (text: string, unit: string) => {
  const r = parseQuantity(text, unit);
  if (!r.ok) throw new Error(`${text}: ${r.message}`);
  return r.value;
};

describe("parseQuantity", () => {
  it("returns the correctly rounded double of the typed decimal", () => {
    expect(value("9.1 uA", "A")).toBe(Number("9.1e-6"));
    expect(value("9.1 µA", "A")).toBe(Number("9.1e-6")); // U+00B5
    expect(value("9.1 μA", "A")).toBe(Number("9.1e-6")); // U+03BC
    expect(value("9.1uA", "A")).toBe(Number("9.1e-6"));
    expect(value("3.267 mA", "A")).toBe(Number("3.267e-3"));
    expect(value("32.67mV", "V")).toBe(Number("32.67e-3"));
    expect(value("0.1 nA", "A")).toBe(Number("0.1e-9"));
  });
  it("reads resistor codes, ohm spellings and bare kilo", () => {
    expect(value("4k7", "ohm")).toBe(4700);
    expect(value("0R1", "ohm")).toBe(0.1);
    expect(value("2M2", "ohm")).toBe(2.2e6);
    expect(value("1R0", "ohm")).toBe(1);
    expect(value("R47", "ohm")).toBe(0.47);
    expect(value("4.7 kΩ", "ohm")).toBe(4700);
    expect(value("4.7 kohm", "ohm")).toBe(4700);
    expect(value("10 ohms", "ohm")).toBe(10);
    expect(value("10k", "ohm")).toBe(10000);
    expect(value("47R", "ohm")).toBe(47);
    expect(value("4.7K", "ohm")).toBe(4700);
    expect(value("300 K", "K")).toBe(300);
  });
  it("reads decimal commas, scientific notation and signs", () => {
    expect(value("9,1 mA", "A")).toBe(Number("9.1e-3"));
    expect(value("9.1e-6 A", "A")).toBe(Number("9.1e-6"));
    expect(value("9.1E-3A", "A")).toBe(Number("9.1e-3"));
    expect(value("-844.3 nA", "A")).toBe(Number("-844.3e-9"));
    expect(value("−0.99 %", "%")).toBe(-0.99);
  });
  it("converts charge, time, temperature and sensitivity units", () => {
    expect(value("220 mAh", "C")).toBeCloseTo(792, 9);
    expect(value("1 Ah", "C")).toBe(3600);
    expect(value("871.4 h", "s")).toBeCloseTo(871.4 * 3600, 6);
    expect(value("36.31 d", "s")).toBeCloseTo(36.31 * 86400, 6);
    expect(value("2 min", "s")).toBe(120);
    expect(value("25 °C", "K")).toBeCloseTo(298.15, 9);
    expect(value("1 mV/uA", "V/A")).toBe(1000);
    expect(value("1 mV/nA", "V/A")).toBeCloseTo(1e6, 3);
  });
  it("falls back to mathjs for other forms", () => {
    expect(value("220 mA h", "C")).toBeCloseTo(792, 9);
    expect(value("1 kV / A", "V/A")).toBeCloseTo(1000, 9);
  });
  it("explains a wrong dimension, a typo and an empty field", () => {
    const dim = parseQuantity("3.3 V", "A");
    expect(dim).toMatchObject({ ok: false, reason: "dimension" });
    if (!dim.ok) expect(dim.message).toMatch(/voltage.*current/);
    expect(parseQuantity("4k7", "A")).toMatchObject({ ok: false, reason: "dimension" });
    expect(parseQuantity("abc", "A")).toMatchObject({ ok: false, reason: "syntax" });
    expect(parseQuantity("3..3 mA", "A")).toMatchObject({ ok: false, reason: "syntax" });
    expect(parseQuantity("   ", "A")).toMatchObject({ ok: false, reason: "empty" });
    expect(parseQuantity(null, "A")).toMatchObject({ ok: false, reason: "empty" });
  });
  it("asks for a unit on a bare number unless the quantity is a plain number or a percentage", () => {
    expect(parseQuantity("3.3", "A")).toMatchObject({ ok: false, reason: "syntax", hint: "no-unit" });
    expect(value("620", "")).toBe(620);
    expect(value("-0.99", "%")).toBe(-0.99);
  });
  it("never throws, whatever the input", () => {
    const units = ["A", "V", "ohm", "V/A", "F", "s", "Hz", "K", "C", "W", "%", ""];
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.string({ unit: "grapheme" }), fc.anything()), fc.constantFrom(...units), (t, u) => {
        const r = parseQuantity(t, u);
        expect(typeof r.ok).toBe("boolean");
        if (r.ok) expect(Number.isFinite(r.value)).toBe(true);
        else expect(r.message.length).toBeGreaterThan(0);
      }),
      { numRuns: 3000 },
    );
    // strings built from the characters a student might type
    const chars = fc.constantFrom(..."0123456789.,eE+-− µμumnkMRΩohm%/AVhd°C".split(""));
    fc.assert(
      fc.property(fc.array(chars, { maxLength: 14 }).map((a) => a.join("")), fc.constantFrom(...units), (t, u) => {
        expect(() => parseQuantity(t, u)).not.toThrow();
      }),
      { numRuns: 3000 },
    );
  });
});

describe("reading what students type (issue 8, one rule per case; rules in lib/grader/units.ts)", () => {
  const refused = (text: string, unit: string) => {
    const r = parseQuantity(text, unit);
    if (r.ok) throw new Error(`${text} was read as ${r.value}`);
    return r;
  };

  it("rule 1: a comma followed by exactly three digits is refused, showing both readings", () => {
    const a = refused("3,267 µA", "A");
    expect(a.reason).toBe("syntax");
    expect(a.message).toContain("3.267 µA");
    expect(a.message).toContain("3267 µA");
    expect(refused("4,700 Ω.", "ohm").message).toMatch(/4\.700 Ω \(comma as decimal mark\) or 4700 Ω \(comma/);
    const b = refused("1,000 mA", "A");
    expect(b.message).toContain("1.000 mA");
    expect(b.message).toContain("1000 mA");
  });
  it("rule 1: a comma followed by one, two, four or more digits is a decimal comma", () => {
    expect(value("9,1 mA", "A")).toBe(Number("9.1e-3"));
    expect(value("9,10 mA", "A")).toBe(Number("9.10e-3"));
    expect(value("1,2345 V", "V")).toBe(1.2345);
  });
  it("rule 1: commas that can only group thousands (two of them, or before a point) are read", () => {
    expect(value("1,000,000 uA", "A")).toBe(1);
    expect(value("1,000.5 mA", "A")).toBe(Number("1000.5e-3"));
  });
  it("rule 2: digits grouped by spaces in threes, as the SI brochure writes them (BIPM, The International System of Units, 9th ed. 2019, §5.4.4)", () => {
    expect(value("1 000 mA", "A")).toBe(1);
    expect(value("12 345.6 uA", "A")).toBe(Number("12345.6e-6"));
  });
  it("rule 3: hand-written powers of ten", () => {
    expect(value("3.27 x 10^-3 A", "A")).toBe(Number("3.27e-3"));
    expect(value("3.27×10^-3 A", "A")).toBe(Number("3.27e-3"));
    expect(value("3.27·10⁻³ A", "A")).toBe(Number("3.27e-3"));
    expect(value("3.27*10^(-3) A", "A")).toBe(Number("3.27e-3"));
  });
  it("rule 4: a full stop ending the sentence after the unit", () => {
    expect(value("3.267 mA.", "A")).toBe(Number("3.267e-3"));
    expect(parseQuantity("3.", "A")).toMatchObject({ ok: false, hint: "no-unit" }); // still a bare number
  });
  it("rule 5: lowercase unit letters are read where one unit of the asked kind fits; the prefix keeps its case", () => {
    expect(value("3 ma", "A")).toBe(Number("3e-3"));
    expect(value("5 mw", "W")).toBe(Number("5e-3"));
    expect(value("3 mv", "V")).toBe(Number("3e-3"));
    expect(value("220 mah", "C")).toBeCloseTo(792, 9); // 0.220 A × 3600 s
    expect(value("1.2 kHZ", "Hz")).toBe(1200);
    // M stays mega: SI prefixes are case-sensitive (BIPM SI brochure, 9th ed., §3)
    expect(value("3 MA", "A")).toBe(3e6);
    expect(value("3 mA", "A")).toBe(Number("3e-3"));
    // a current asked for a voltage is still a current
    expect(refused("3 ma", "V").reason).toBe("dimension");
  });
  it("rule 6: resistor codes with the ohm sign after a space, kilohm, megohm, meg and 10R", () => {
    expect(value("4k7 Ω", "ohm")).toBe(4700);
    expect(value("4.7 kilohm", "ohm")).toBe(4700);
    expect(value("2.2 megohm", "ohm")).toBe(2.2e6);
    expect(value("1 meg", "ohm")).toBe(1e6);
    expect(value("10R", "ohm")).toBe(10);
  });
  it("rule 7: a time written in parts adds up", () => {
    expect(value("1 h 30 min", "s")).toBe(5400);
    expect(value("1 min 30 s", "s")).toBe(90);
  });
  it("rule 8: a value of another kind is refused with a hint where the symbol is easily confused", () => {
    const c = refused("27 C", "K");
    expect(c.reason).toBe("dimension");
    expect(c.message).toMatch(/charge/);
    expect(c.message).toMatch(/°C/);
    const s = refused("2 mS", "s");
    expect(s.reason).toBe("dimension");
    expect(s.message).toMatch(/millisiemens|milli siemens/);
    expect(s.message).toMatch(/ms/);
    const h = refused("1 H", "s");
    expect(h.message).toMatch(/henry/);
  });
});

describe("formatQuantity", () => {
  it("uses an SI prefix and 3–4 significant figures", () => {
    expect(formatQuantity(9.1e-6, "A")).toBe("9.10 µA");
    expect(formatQuantity(4700, "ohm")).toBe("4.70 kΩ");
    expect(formatQuantity(4700, "ohm", { trim: true })).toBe("4.7 kΩ");
    expect(formatQuantity(3.2673267e-3, "A")).toBe("3.267 mA");
    expect(formatQuantity(-0.990099, "%")).toBe("-0.9901 %");
    expect(formatQuantity(620, "")).toBe("620");
    expect(formatQuantity(871.4 * 3600, "s", { displayUnit: "h" })).toBe("871.4 h");
    expect(formatQuantity(792, "C", { displayUnit: "mAh" })).toBe("220 mAh");
    expect(formatQuantity(999.96e-6, "A")).toBe("1.00 mA");
  });
  it("round-trips through parseQuantity", () => {
    const units = ["A", "V", "ohm", "V/A", "F", "s", "Hz", "C", "W", "%", "", "K"];
    fc.assert(
      fc.property(
        fc.double({ min: 1e-18, max: 1e15, noNaN: true }),
        fc.boolean(),
        fc.constantFrom(...units),
        fc.constantFrom(3, 4, 5),
        (mag, neg, unit, digits) => {
          const v = neg ? -mag : mag;
          const text = formatQuantity(v, unit, { digits });
          const r = parseQuantity(text, unit);
          expect(r.ok, text).toBe(true);
          if (r.ok) expect(Math.abs(r.value - v)).toBeLessThanOrEqual(Math.abs(v) * 0.5 * 10 ** (1 - Math.min(digits, 3)) + 1e-300);
        },
      ),
      { numRuns: 5000 },
    );
    for (const du of ["h", "d", "min"]) {
      const t = formatQuantity(3.137e6, "s", { displayUnit: du });
      const r = parseQuantity(t, "s");
      expect(r.ok && Math.abs(r.value / 3.137e6 - 1) < 5e-4).toBe(true);
    }
  });
  it("writes LaTeX that KaTeX accepts", async () => {
    const katex = (await import("katex")).default;
    for (const [v, u] of [[9.1e-6, "A"], [4700, "ohm"], [-0.99, "%"], [1e-20, "A"], [1000, "V/A"], [300, "K"]] as [number, string][]) {
      expect(() => katex.renderToString(texQuantity(v, u), { throwOnError: true })).not.toThrow();
    }
    expect(texQuantity(9.1e-6, "A")).toBe("9.10\\,\\mu\\mathrm{A}");
    expect(texQuantity(4700, "ohm")).toBe("4.70\\,\\mathrm{k}\\Omega");
  });
});
