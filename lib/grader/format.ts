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

function trimZeros(s: string, minDigits: number): string {
  if (s.indexOf(".") < 0 || /e/i.test(s)) return s;
  let out = s;
  while (out.endsWith("0") && significantDigits(out) > minDigits) out = out.slice(0, -1);
  if (out.endsWith(".")) out = out.slice(0, -1);
  return out;
}

function significantDigits(s: string): number {
  const digits = s.replace(/[-+.]/g, "").replace(/^0+/, "");
  return digits.length;
}

function numberText(x: number, digits: number, trim: boolean): string {
  if (x === 0) return "0";
  const s = x.toPrecision(digits);
  if (/e/.test(s)) {
    const [m, e] = s.split("e");
    return `${trim ? trimZeros(m, 1) : m}e${e.replace("+", "")}`;
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
export function quantityParts(value: number, unit: string, opts: FormatOptions = {}): Parts {
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
  const maxExp = unit === "s" ? 0 : 9;
  let e3 = Math.floor(Math.log10(Math.abs(value)) / 3) * 3;
  e3 = Math.max(-15, Math.min(maxExp, e3));
  let scaled = e3 >= 0 ? value / 10 ** e3 : value * 10 ** -e3;
  if (Math.abs(scaled) < 1 && e3 === -15) return { number: numberText(value, digits, trim), prefix: "", symbol };
  let text = numberText(scaled, digits, trim);
  if (Math.abs(Number(text)) >= 1000 && e3 < maxExp) {
    e3 += 3;
    scaled = e3 >= 0 ? value / 10 ** e3 : value * 10 ** -e3;
    text = numberText(scaled, digits, trim);
  }
  return { number: text, prefix: PREFIX_OF[e3], symbol };
}

/** "9.10 µA", "4.70 kΩ", "-0.9901 %", "620"; reads back through parseQuantity. */
export function formatQuantity(value: number, unit: string, opts?: FormatOptions): string {
  const p = quantityParts(value, unit, opts);
  const u = p.prefix + p.symbol;
  return u === "" ? p.number : `${p.number} ${u}`;
}

const TEX_SYMBOL: Record<string, string> = {
  Ω: "\\Omega",
  "%": "\\%",
  "°C": "^\\circ\\mathrm{C}",
  "V/A": "\\mathrm{V/A}",
};

/** LaTeX for a value with its unit, e.g. "3.267\,\mathrm{mA}", "4.7\,\mathrm{k}\Omega", "9.10\,\mu\mathrm{A}". */
export function texQuantity(value: number, unit: string, opts?: FormatOptions): string {
  const p = quantityParts(value, unit, opts);
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
