// Reading what a student types: "9.1 uA", "4k7", "0R1", "9,1 mA", "3.3e-3 A", "220 mAh", "2 h".
// A fast path handles "number [prefix]unit" by shifting the decimal exponent in the string, so
// "9.1 uA" is exactly Number("9.1e-6"). Anything else goes to mathjs units.
//
// The rules, each with its cases in tests/unit/grader/parse.test.ts:
// 1. A comma followed by exactly three digits is ambiguous ("3,267 µA": 3.267 or 3267?) and is refused
//    with both readings; a comma followed by one, two, four or more digits is a decimal comma. Commas
//    before a decimal point, or more than one comma, each followed by three digits, group thousands.
// 2. Digits grouped by spaces in threes ("1 000 mA", as the SI brochure writes them) are one number.
// 3. Powers of ten written by hand ("3.27 x 10^-3 A", "3.27×10^-3 A", "3.27·10⁻³ A") are scientific notation.
// 4. A full stop ending the answer after its unit ends a sentence ("3.267 mA.").
// 5. The prefix is read as typed (SI is case-sensitive: m is milli, M is mega); the unit's own letters
//    may be in the wrong case ("3 ma", "5 mw", "220 mah", "1.2 kHZ") when only one unit of the asked
//    kind matches, and the letters are not another SI unit (mS is millisiemens, H is the henry).
// 6. Resistor codes may carry the ohm sign after a space ("4k7 Ω"); "kilohm", "megohm", "meg" (mega-ohm)
//    and "10R" are read.
// 7. A time may be written in parts that add up ("1 h 30 min").
// 8. A value of another kind is refused naming its kind, with a hint where a symbol is easily confused:
//    "27 C" for a temperature is a charge (write °C), "2 mS" for a time is millisiemens (write ms).
import { unit as mathUnit } from "mathjs";

export type Dimension =
  | "current"
  | "voltage"
  | "resistance"
  | "capacitance"
  | "time"
  | "frequency"
  | "temperature"
  | "charge"
  | "power"
  | "percent"
  | "conductance"
  | "currentPerResistance"
  | "number";

export type ParseResult =
  | { ok: true; value: number }
  | { ok: false; reason: "syntax" | "dimension" | "empty"; message: string; hint?: "no-unit" };

const NOUN: Record<Dimension, string> = {
  current: "a current",
  voltage: "a voltage",
  resistance: "a resistance",
  capacitance: "a capacitance",
  time: "a time",
  frequency: "a frequency",
  temperature: "a temperature",
  charge: "a charge",
  power: "a power",
  percent: "a percentage",
  conductance: "a current per volt (A/V)",
  currentPerResistance: "a current per ohm (A/Ω)",
  number: "a plain number",
};

/** Dimension of each SI unit string used by parameter and quantity specs. */
export const UNIT_DIMENSION: Record<string, Dimension> = {
  A: "current",
  V: "voltage",
  ohm: "resistance",
  "V/A": "resistance",
  F: "capacitance",
  s: "time",
  Hz: "frequency",
  K: "temperature",
  C: "charge",
  W: "power",
  "%": "percent",
  "A/V": "conductance",
  "A/ohm": "currentPerResistance",
  "": "number",
};

/** An example a message can suggest for each dimension. */
const EXAMPLE: Record<Dimension, string> = {
  current: "3.27 mA",
  voltage: "1.25 V",
  resistance: "4.7 kΩ",
  capacitance: "100 nF",
  time: "4.6 ms",
  frequency: "159 Hz",
  temperature: "300 K",
  charge: "220 mAh",
  power: "0.33 W",
  percent: "-0.99 %",
  conductance: "100 mA/V",
  currentPerResistance: "-1 mA/Ω",
  number: "620",
};

interface TokenInfo {
  dim: Dimension;
  /** decimal exponent shift of the prefix */
  exp: number;
  /** extra non-decimal factor (hours, ampere-hours) */
  factor: number;
  /** affine offset after scaling (degrees Celsius) */
  offset: number;
}

const PREFIXES: [string, number][] = [
  ["f", -15],
  ["p", -12],
  ["n", -9],
  ["u", -6],
  ["m", -3],
  ["", 0],
  ["k", 3],
  ["M", 6],
  ["G", 9],
];

const TOKENS = new Map<string, TokenInfo>();
function add(symbols: string[], dim: Dimension, prefixes: [string, number][], factor = 1, offset = 0) {
  for (const s of symbols) for (const [p, exp] of prefixes) TOKENS.set(p + s, { dim, exp, factor, offset });
}
add(["A", "amp", "amps"], "current", PREFIXES);
add(["V", "volt", "volts"], "voltage", PREFIXES);
add(["ohm", "ohms", "Ohm", "Ohms", "R"], "resistance", [...PREFIXES, ["K", 3]]);
add(["kilohm", "kilohms", "kiloohm", "kiloohms"], "resistance", [["", 3]]);
add(["megohm", "megohms", "megaohm", "megaohms", "meg", "Meg", "MEG"], "resistance", [["", 6]]);
// "10k", "2M" on their own mean kilo-ohms and mega-ohms, as on a resistor's label
for (const [p, exp] of [["k", 3], ["K", 3], ["M", 6], ["G", 9]] as [string, number][])
  TOKENS.set(p, { dim: "resistance", exp, factor: 1, offset: 0 });
add(["F"], "capacitance", PREFIXES);
add(["s", "sec"], "time", PREFIXES.filter(([p]) => p !== "k" && p !== "M" && p !== "G"));
add(["min"], "time", [["", 0]], 60);
add(["h", "hr", "hrs", "hour", "hours"], "time", [["", 0]], 3600);
add(["d", "day", "days"], "time", [["", 0]], 86400);
add(["Hz", "hz"], "frequency", [...PREFIXES, ["K", 3]]);
add(["K"], "temperature", [["", 0]]);
add(["°C", "degC", "ºC"], "temperature", [["", 0]], 1, 273.15);
add(["C"], "charge", PREFIXES);
add(["Ah"], "charge", [["u", -6], ["m", -3], ["", 0]], 3600);
add(["W"], "power", PREFIXES);
add(["%"], "percent", [["", 0]]);

const NUMBER_RE = /^([+-]?)(\d+\.?\d*|\.\d+)(?:[eE]([+-]?\d+))?(.*)$/;
const CODE_RE = /^(\d*)([RrKkMG])(\d+)\s*(?:ohms?|Ω)?$/;
const TIME_PARTS_RE = /^(?:\s*\d+(?:\.\d+)?\s*(?:d|days?|h|hr|hrs|hours?|min|s|sec)\b){2,}\s*$/;
const CODE_EXP: Record<string, number> = { R: 0, r: 0, K: 3, k: 3, M: 6, G: 9 };

function fail(reason: "syntax" | "dimension" | "empty", message: string, hint?: "no-unit"): ParseResult {
  return hint ? { ok: false, reason, message, hint } : { ok: false, reason, message };
}

function dimensionMessage(got: Dimension, want: Dimension): string {
  return `That is ${NOUN[got]}; this asks for ${NOUN[want]} (for example ${EXAMPLE[want]}).`;
}

function syntaxMessage(text: string, want: Dimension): string {
  const shown = text.length > 40 ? text.slice(0, 40) + "…" : text;
  return `Could not read "${shown}" as a number with a unit. Write it like ${EXAMPLE[want]}.`;
}

/** Build the double nearest to sign·mantissa·10^exp from the typed digits. */
function decimal(sign: string, mantissa: string, exp: number): number {
  return Number(`${sign}${mantissa}e${exp}`);
}

const SUPERSCRIPT: Record<string, string> = { "⁰": "0", "¹": "1", "²": "2", "³": "3", "⁴": "4", "⁵": "5", "⁶": "6", "⁷": "7", "⁸": "8", "⁹": "9", "⁻": "-", "⁺": "+" };

/** Rules 1–4: the typed text as the fast path reads it, or why it cannot be read. */
function normalise(text: string): { text: string } | { ambiguous: [string, string] } {
  let t = text.trim();
  t = t.replace(/[µμ]/g, "u").replace(/[ΩΩ]/g, "ohm").replace(/[−–]/g, "-");
  t = t.replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺]+/g, (s) => "^" + [...s].map((c) => SUPERSCRIPT[c]).join(""));
  // rule 4: a sentence's full stop after the unit
  if (/[^\d\s.]\.$/.test(t)) t = t.slice(0, -1).trimEnd();
  // rule 1: commas
  const commas = t.match(/,/g)?.length ?? 0;
  if (commas > 0) {
    const number = /^[+-]?\d{1,3}(,\d+)+(\.\d*)?/.exec(t)?.[0] ?? "";
    const groups = number.split(".")[0].split(",").slice(1);
    const grouping = groups.every((g) => g.length === 3);
    if (commas === 1 && !t.includes(".") && /,\d(?!\d)|,\d\d(?!\d)|,\d{4,}/.test(t)) t = t.replace(",", ".");
    else if (number && grouping && (commas > 1 || number.includes("."))) t = number.replace(/,/g, "") + t.slice(number.length);
    else if (commas === 1 && number && grouping) {
      // both readings keep the unit as the student typed it (µ, Ω), less a sentence's full stop
      let rest = text.trim().slice(number.length);
      if (/[^\d\s.]\.$/.test(rest)) rest = rest.slice(0, -1).trimEnd();
      return { ambiguous: [number.replace(",", ".") + rest, number.replace(",", "") + rest] };
    }
  }
  // rule 2: digits grouped in threes by spaces
  t = t.replace(/^([+-]?\d{1,3})((?: \d{3})+)(?=[.,eE\s]|[^\d]|$)/, (_, head: string, tail: string) => head + tail.replace(/ /g, ""));
  // rule 3: a hand-written power of ten
  t = t.replace(/^([+-]?(?:\d+\.?\d*|\.\d+))\s*[xX×·*⋅]\s*10\s*\^\s*\(?\s*([+-]?\d+)\s*\)?/, "$1e$2");
  return { text: t };
}

/** Unit symbols of other SI quantities that a student may type in place of a unit asked for (rule 5, 8). */
const OTHER_SYMBOLS: Record<string, [name: string, kind: string]> = {
  S: ["siemens", "a conductance"],
  H: ["henry", "an inductance"],
  T: ["tesla", "a magnetic flux density"],
  J: ["joule", "an energy"],
  N: ["newton", "a force"],
  Pa: ["pascal", "a pressure"],
};

/** Rule 5: the prefix as typed, the unit's letters in any case, when exactly one unit of the asked kind fits. */
function caseRelaxed(unitText: string, want: Dimension): TokenInfo | undefined {
  const found = new Map<string, TokenInfo>();
  for (const [p] of PREFIXES) {
    if (!unitText.startsWith(p)) continue;
    const rest = unitText.slice(p.length);
    if (rest === "" || rest in OTHER_SYMBOLS) continue;
    for (const [key, info] of TOKENS) {
      if (info.dim !== want || !key.startsWith(p) || key.slice(p.length).toLowerCase() !== rest.toLowerCase()) continue;
      if (p === "" && PREFIXES.some(([q]) => q !== "" && key.startsWith(q) && TOKENS.has(key.slice(q.length)))) continue;
      found.set(`${info.exp}:${info.factor}:${info.offset}`, info);
    }
  }
  return found.size === 1 ? [...found.values()][0] : undefined;
}

/** Rule 8: a hint where the typed symbol is easily taken for another. */
function confusedSymbol(unitText: string, got: Dimension | undefined, want: Dimension): string | undefined {
  if (want === "temperature" && got === "charge" && unitText === "C") return "C alone is the coulomb; for degrees Celsius write °C or degC (for example 27 °C).";
  for (const [p] of PREFIXES) {
    const rest = unitText.slice(p.length);
    if (unitText.startsWith(p) && rest in OTHER_SYMBOLS) {
      const prefixWord = { f: "femto", p: "pico", n: "nano", u: "micro", m: "milli", "": "", k: "kilo", M: "mega", G: "giga" }[p] ?? "";
      const lower = TOKENS.get(p + rest.toLowerCase());
      const instead = lower && lower.dim === want ? ` For ${NOUN[want]} write ${p === "u" ? "µ" : p}${rest.toLowerCase()}.` : "";
      const [name, kind] = OTHER_SYMBOLS[rest];
      return `${p === "u" ? "µ" : p}${rest} is ${prefixWord ? `${prefixWord}${name}` : `the ${name}`}, ${kind}, not ${NOUN[want]}.${instead}`;
    }
  }
  return undefined;
}

function tokenFor(unitText: string): TokenInfo | undefined {
  const direct = TOKENS.get(unitText);
  if (direct) return direct;
  // sensitivities: "mV/uA", "V/A"
  const slash = unitText.indexOf("/");
  if (slash > 0) {
    const top = TOKENS.get(unitText.slice(0, slash));
    const bottom = TOKENS.get(unitText.slice(slash + 1));
    if (top && bottom && top.dim === "voltage" && bottom.dim === "current")
      return { dim: "resistance", exp: top.exp - bottom.exp, factor: 1, offset: 0 };
  }
  return undefined;
}

function scale(sign: string, mantissa: string, exp: number, info: TokenInfo): number {
  const v = decimal(sign, mantissa, exp + info.exp);
  return (info.factor === 1 ? v : v * info.factor) + info.offset;
}

const DIM_PROBES: [Dimension, string][] = [
  ["current", "A"],
  ["voltage", "V"],
  ["resistance", "ohm"],
  ["capacitance", "F"],
  ["time", "s"],
  ["frequency", "Hz"],
  ["temperature", "K"],
  ["charge", "C"],
  ["power", "W"],
];

function viaMathjs(t: string, want: Dimension, wantUnit: string, original: string): ParseResult {
  let u;
  try {
    u = mathUnit(t);
  } catch {
    return fail("syntax", syntaxMessage(original, want));
  }
  try {
    if (u.value === null || u.value === undefined) return fail("syntax", syntaxMessage(original, want));
    const target = want === "percent" || want === "number" ? null : wantUnit === "V/A" ? "ohm" : wantUnit;
    if (target && u.equalBase(mathUnit(target))) {
      const v = u.toNumber(target);
      return Number.isFinite(v) ? { ok: true, value: v } : fail("syntax", syntaxMessage(original, want));
    }
    for (const [dim, probe] of DIM_PROBES) {
      if (u.equalBase(mathUnit(probe))) return fail("dimension", dimensionMessage(dim, want));
    }
    return fail("dimension", `That unit is not ${NOUN[want]}; write it like ${EXAMPLE[want]}.`);
  } catch {
    return fail("syntax", syntaxMessage(original, want));
  }
}

/**
 * Read a typed value and return it in the SI unit `unit` ("A", "V", "ohm", "V/A", "F", "s", "Hz", "K",
 * "C", "W", "%", ""). Never throws.
 *
 * A bare number is accepted only when `unit` is "" or "%": for a physical quantity the student must
 * say which unit (and prefix) they mean, and the message says so (reason "syntax", hint "no-unit").
 */
export function parseQuantity(text: unknown, unit: string): ParseResult {
  const want: Dimension = UNIT_DIMENSION[unit] ?? "number";
  try {
    if (text === null || text === undefined) return fail("empty", "No answer given.");
    const original = typeof text === "string" ? text : String(text);
    const n = normalise(original);
    if ("ambiguous" in n) {
      const [a, b] = n.ambiguous;
      return fail(
        "syntax",
        `"${original.trim()}" can be read two ways: ${a} (comma as decimal mark) or ${b} (comma between thousands). Write one of them without the comma.`,
      );
    }
    const t = n.text;
    if (t === "") return fail("empty", "No answer given.");

    // rule 7: a time in parts, "1 h 30 min"
    if (want === "time" && TIME_PARTS_RE.test(t)) {
      let total = 0;
      for (const part of t.match(/\d+(?:\.\d+)?\s*[a-z]+/g) ?? []) {
        const r = parseQuantity(part, "s");
        if (!r.ok) return r;
        total += r.value;
      }
      return { ok: true, value: total };
    }

    const code = CODE_RE.exec(t);
    if (code && (code[1] !== "" || code[2] === "R" || code[2] === "r")) {
      // resistor code (IEC 60062): 4k7, 0R1, R10, 2M2, 1R0
      if (want !== "resistance") return fail("dimension", dimensionMessage("resistance", want));
      const v = decimal("", `${code[1] || "0"}.${code[3]}`, CODE_EXP[code[2]]);
      return { ok: true, value: v };
    }

    const m = NUMBER_RE.exec(t);
    if (m) {
      const [, sign, mantissa, expText, rest] = m;
      const exp = expText ? parseInt(expText, 10) : 0;
      const unitText = rest.replace(/\s+/g, "");
      if (unitText === "") {
        if (want === "number" || want === "percent") {
          const v = decimal(sign, mantissa, exp);
          return Number.isFinite(v) ? { ok: true, value: v } : fail("syntax", syntaxMessage(original, want));
        }
        return fail(
          "syntax",
          `Add a unit, for example ${EXAMPLE[want]}: a bare number does not say which prefix you meant.`,
          "no-unit",
        );
      }
      // a capital K alone is kelvin, except where a resistance is asked for ("4.7K" on a resistor)
      let info = unitText === "K" && want === "resistance" ? TOKENS.get("kohm") : tokenFor(unitText);
      if (!info) {
        const relaxed = caseRelaxed(unitText, want);
        if (relaxed) info = relaxed;
      }
      if (!info) {
        const hint = confusedSymbol(unitText, undefined, want);
        if (hint) return fail("dimension", hint);
        // the letters in another case read as a unit of another kind only ("3 ma" for a voltage)
        const other = (Object.keys(NOUN) as Dimension[]).filter((d) => d !== want && caseRelaxed(unitText, d));
        if (other.length === 1) return fail("dimension", dimensionMessage(other[0], want));
      }
      if (info) {
        if (info.dim !== want) {
          const hint = confusedSymbol(unitText, info.dim, want);
          return fail("dimension", hint ? `That is ${NOUN[info.dim]}: ${hint}` : dimensionMessage(info.dim, want));
        }
        const v = scale(sign, mantissa, exp, info);
        return Number.isFinite(v) ? { ok: true, value: v } : fail("syntax", syntaxMessage(original, want));
      }
    }
    if (want === "number" || want === "percent") return fail("syntax", syntaxMessage(original, want));
    return viaMathjs(t, want, unit, original);
  } catch {
    return fail("syntax", `Could not read that answer. Write it like ${EXAMPLE[want]}.`);
  }
}
