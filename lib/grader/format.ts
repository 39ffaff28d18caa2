// Human-readable values ("9.10 µA", "4.70 kΩ", "871.4 h") and their LaTeX forms ("9.10\,\mu\mathrm{A}").
// Every string formatQuantity returns reads back through parseQuantity.

export interface FormatOptions {
  /** significant figures, default 4 (trailing zeros are dropped down to 3) */
  digits?: number;
  /** drop every trailing zero ("4.7 kΩ") */
  trim?: boolean;
  /** show in a non-SI display unit: "mAh" or "Ah" for C, "h", "d", "min" for s, "°C" for K; SI-prefixed forms like "mA" are also accepted */
  displayUnit?: string;
}

const SYMBOL: Record<string, string> = { ohm: "Ω" };
const PREFIX_EXP: Record<string, number> = { f: -15, p: -12, n: -9, µ: -6, u: -6, m: -3, "": 0, k: 3, M: 6, G: 9 };
const PREFIX_OF: Record<number, string> = { [-15]: "f", [-12]: "p", [-9]: "n", [-6]: "µ", [-3]: "m", 0: "", 3: "k", 6: "M", 9: "G" };

/** Units shown without SI prefixes. */
const NO_PREFIX = new Set(["K", "%", "", "°C", "h", "d", "min", "mAh", "Ah"]);

/** Non-prefix display units: factor from SI, offset, and the SI unit they belong to. */
const DISPLAY: Record<string, { si: string; factor: number; offset: number }> = {
  mAh: { si: "C", factor: 1 / 3.6, offset: 0 },
  Ah: { si: "C", factor: 1 / 3600, offset: 0 },
  h: { si: "s", factor: 1 / 3600, offset: 0 },
  d: { si: "s", factor: 1 / 86400, offset: 0 },
  min: { si: "s", factor: 1 / 60, offset: 0 },
  "°C": { si: "K", factor: 1, offset: -273.15 },
};

/** Drop trailing zeros after the decimal point while more than `minDigits` significant digits remain. */
function trimZeros(s: string, minDigits: number): string {
  const dot = s.indexOf(".");
  if (dot < 0) return s;
  // count significant digits: from the first non-zero digit to the end
  let first = -1;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c >= 49 && c <= 57) {
      first = i;
      break;
    }
  }
  if (first < 0) return s;
  let sig = s.length - first - (first < dot ? 1 : 0);
  let end = s.length;
  while (end > dot + 1 && s.charCodeAt(end - 1) === 48 && sig > minDigits) {
    end--;
    sig--;
  }
  if (end === dot + 1) end = dot;
  return end === s.length ? s : s.slice(0, end);
}

/** x.toPrecision(digits) for 1 ≤ |x| < 1000 without the general algorithm (integer rounding, then a decimal point). */
function fixedPrecision(x: number, digits: number): string | undefined {
  const a = Math.abs(x);
  if (!(a >= 1 && a < 1000) || digits < 3 || digits > 15) return undefined;
  const intDigits = a < 10 ? 1 : a < 100 ? 2 : 3;
  const decimals = digits - intDigits;
  const n = Math.round(a * 10 ** decimals);
  if (n >= 10 ** digits) return undefined; // carried into another digit: let toPrecision decide
  const t = String(n);
  const body = decimals === 0 ? t : `${t.slice(0, t.length - decimals)}.${t.slice(t.length - decimals)}`;
  return x < 0 ? `-${body}` : body;
}

function numberText(x: number, digits: number, trim: boolean): string {
  if (x === 0) return "0";
  const s = fixedPrecision(x, digits) ?? x.toPrecision(digits);
  const e = s.indexOf("e");
  if (e >= 0) {
    const m = s.slice(0, e);
    const exp = s.charCodeAt(e + 1) === 43 ? s.slice(e + 2) : s.slice(e + 1); // drop "+"
    return `${trim ? trimZeros(m, 1) : m}e${exp}`;
  }
  return trimZeros(s, trim ? 1 : Math.min(3, digits));
}

export interface Parts {
  /** the number as text, possibly with an "e" exponent */
  number: string;
  prefix: string;
  /** unit symbol for display ("Ω", "A", "mAh") */
  symbol: string;
}

/** Split a value into number, SI prefix and unit symbol. */
// POW10[i] = 10^(3(i-5)) for i = 0…8; beyond that the positive powers 1e12, 1e15 used for the smallest prefixes
const POW10 = [1e-15, 1e-12, 1e-9, 1e-6, 1e-3, 1, 1e3, 1e6, 1e9, 1e12, 1e15];
const PREFIX_BY_INDEX = ["f", "p", "n", "µ", "m", "", "k", "M", "G"];
const NO_OPTS: FormatOptions = {};

export function quantityParts(value: number, unit: string, opts: FormatOptions = NO_OPTS): Parts {
  const digits = opts.digits ?? 4;
  const trim = opts.trim ?? false;
  const display = opts.displayUnit ? DISPLAY[opts.displayUnit] : undefined;
  if (display && display.si === unit) {
    const shown = value * display.factor + display.offset;
    return { number: numberText(shown, digits, trim), prefix: "", symbol: opts.displayUnit! };
  }
  const symbol = SYMBOL[unit] ?? unit;
  if (!Number.isFinite(value)) return { number: String(value), prefix: "", symbol };
  if (NO_PREFIX.has(unit) || value === 0) {
    if (unit === "" && Number.isInteger(value) && Math.abs(value) < 1e15) return { number: String(value), prefix: "", symbol };
    return { number: numberText(value, digits, trim), prefix: "", symbol };
  }
  // A prefixed display unit ("mA", "kΩ") fixes the prefix.
  if (opts.displayUnit) {
    const p = opts.displayUnit.slice(0, 1);
    const rest = opts.displayUnit.slice(1).replace("Ω", "ohm");
    if (rest === unit && p in PREFIX_EXP) {
      return { number: numberText(value / 10 ** PREFIX_EXP[p], digits, trim), prefix: PREFIX_OF[PREFIX_EXP[p]], symbol };
    }
  }
  const maxIndex = unit === "s" ? 5 : 8;
  // index into POW10: 0 ↔ 1e-15 … 8 ↔ 1e9
  let idx = Math.floor(Math.log10(Math.abs(value)) / 3) + 5;
  idx = idx < 0 ? 0 : idx > maxIndex ? maxIndex : idx;
  let scaled = idx >= 5 ? value / POW10[idx] : value * POW10[10 - idx];
  if (Math.abs(scaled) < 1 && idx === 0) return { number: numberText(value, digits, trim), prefix: "", symbol };
  // rounding can carry 999.96 up to 1000: move to the next prefix
  if (Math.abs(scaled) >= 1000 - 5 * 10 ** (2 - digits) && idx < maxIndex) {
    idx += 1;
    scaled = idx >= 5 ? value / POW10[idx] : value * POW10[10 - idx];
  }
  return { number: numberText(scaled, digits, trim), prefix: PREFIX_BY_INDEX[idx], symbol };
}

/** "9.10 µA", "4.70 kΩ", "-0.9901 %", "620"; reads back through parseQuantity. */
export function formatQuantity(value: number, unit: string, opts?: FormatOptions): string {
  const p = quantityParts(value, unit, opts);
  const u = p.prefix + p.symbol;
  return u === "" ? p.number : `${p.number} ${u}`;
}

/**
 * A bounded memo for a formatter, keyed by unit (and display unit) and value: a worked solution repeats
 * the same parameter values in many steps and questions.
 */
function memoised(format: (value: number, unit: string, opts?: FormatOptions) => string) {
  // unit → display unit ("" for none) → value → text, each map cleared when it reaches the limit
  const memo = new Map<string, Map<string, Map<number, string>>>();
  const limit = 1024;
  return (value: number, unit: string, opts?: FormatOptions): string => {
    if (opts && (opts.digits !== undefined || opts.trim !== undefined)) return format(value, unit, opts);
    let byDisplay = memo.get(unit);
    if (!byDisplay) {
      byDisplay = new Map();
      memo.set(unit, byDisplay);
    }
    const display = opts?.displayUnit ?? "";
    let m = byDisplay.get(display);
    if (!m) {
      m = new Map();
      byDisplay.set(display, m);
    }
    let out = m.get(value);
    if (out === undefined) {
      out = format(value, unit, opts);
      if (m.size >= limit) m.clear();
      m.set(value, out);
    }
    return out;
  };
}

const TEX_SYMBOL: Record<string, string> = {
  Ω: "\\Omega",
  "%": "\\%",
  "°C": "^\\circ\\mathrm{C}",
  "V/A": "\\mathrm{V/A}",
};

/** LaTeX for a value with its unit, e.g. "3.267\\,\\mathrm{mA}", "4.7\\,\\mathrm{k}\\Omega", "9.10\\,\\mu\\mathrm{A}". */
export const texQuantity: (value: number, unit: string, opts?: FormatOptions) => string = memoised((value, unit, opts) =>
  texFromParts(quantityParts(value, unit, opts)),
);

function texFromParts(p: Parts): string {
  const num = texNumber(p.number);
  const special = TEX_SYMBOL[p.symbol];
  let u: string;
  if (p.symbol === "") u = "";
  else if (special) u = (p.prefix === "" ? "" : p.prefix === "µ" ? "\\mu" : `\\mathrm{${p.prefix}}`) + special;
  else u = p.prefix === "µ" ? `\\mu\\mathrm{${p.symbol}}` : `\\mathrm{${p.prefix}${p.symbol}}`;
  return u === "" ? num : `${num}\\,${u}`;
}

/** LaTeX for a plain number, with "1.2e-20" written as 1.2\times10^{-20}. */
export function texNumber(text: string | number, digits = 4): string {
  const s = typeof text === "number" ? numberText(text, digits, false) : text;
  const i = s.indexOf("e");
  if (i < 0) return s;
  return `${s.slice(0, i)}\\times10^{${s.slice(i + 1)}}`;
}
