// Reading what a student types: "9.1 uA", "4k7", "0R1", "9,1 mA", "3.3e-3 A", "220 mAh", "2 h".
// A fast path handles "number [prefix]unit" by shifting the decimal exponent in the string, so
// "9.1 uA" is exactly Number("9.1e-6"). Anything else goes to mathjs units.
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
  voltage: "1.65 V",
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
const CODE_RE = /^(\d*)([RrKkMG])(\d+)(?:ohms?|Ω)?$/;
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

function normalise(text: string): string {
  let t = text.trim();
  t = t.replace(/[µμ]/g, "u").replace(/[ΩΩ]/g, "ohm").replace(/[−–]/g, "-");
  // A single comma and no point is a decimal comma ("9,1 mA").
  if (t.indexOf(",") >= 0 && t.indexOf(".") < 0 && t.indexOf(",") === t.lastIndexOf(",")) t = t.replace(",", ".");
  return t;
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
    const t = normalise(original);
    if (t === "") return fail("empty", "No answer given.");

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
      const info = unitText === "K" && want === "resistance" ? TOKENS.get("kohm") : tokenFor(unitText);
      if (info) {
        if (info.dim !== want) return fail("dimension", dimensionMessage(info.dim, want));
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
