// Display formatting for lesson text: a value in SI shown in a chosen display unit ("mA", "kΩ", "h").
// Pure presentation (no physics); used by <V/>, <Eq/> and the check-yourself prompts.

const prefixes: Record<string, number> = { f: 1e-15, p: 1e-12, n: 1e-9, u: 1e-6, "µ": 1e-6, "μ": 1e-6, m: 1e-3, "": 1, k: 1e3, M: 1e6, G: 1e9 };
const bases = ["Ω", "A", "V", "F", "s", "Hz", "W", "C", "K"];
const special: Record<string, number> = { h: 3600, d: 86400, mAh: 3.6, "%": 1, "": 1, LSB: 1, "V/A": 1, "mV/nA": 1e6, "mV/µA": 1e3, "mV/mA": 1 };

/** How many SI units one display unit is (e.g. "mA" → 1e-3, "h" → 3600). */
export function unitScale(unit: string): number {
  if (unit in special) return special[unit];
  for (const b of bases) {
    if (unit.endsWith(b)) {
      const p = unit.slice(0, unit.length - b.length);
      if (p in prefixes) return prefixes[p];
    }
  }
  throw new Error(`unknown display unit "${unit}"`);
}

/** `counts`: an integer (an ADC code, a count) is printed whole. */
export type FormatOptions = { sig?: number; trim?: boolean; counts?: boolean };

/** The number part: `sig` significant figures (4 by default); `trim` drops trailing zeros. */
export function formatNumber(value: number, { sig = 4, trim = false, counts = false }: FormatOptions = {}): { mantissa: string; exponent: number | null } {
  if (value === 0) return { mantissa: "0", exponent: null };
  if (Number.isInteger(value) && Math.abs(value) < 1e6 && (trim || counts)) return { mantissa: String(value), exponent: null };
  let s = value.toPrecision(sig);
  let exponent: number | null = null;
  const m = /^(-?[\d.]+)e([+-]\d+)$/.exec(s);
  if (m) {
    s = m[1];
    exponent = Number(m[2]);
  }
  if (trim && s.includes(".")) s = s.replace(/0+$/, "").replace(/\.$/, "");
  return { mantissa: s, exponent };
}

const superscripts: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

/** Plain text, e.g. "3.267 mA", "1.136 × 10⁴ h", "−0.9901 %". */
export function formatText(valueSI: number, unit: string, opts?: FormatOptions): string {
  const { mantissa, exponent } = formatNumber(valueSI / unitScale(unit), { counts: unit === "", ...opts });
  const num = mantissa.replace(/^-/, "−") + (exponent === null ? "" : ` × 10${String(exponent).replace(/./g, (c) => superscripts[c] ?? c)}`);
  const u = unit === "uA" ? "µA" : unit;
  return u ? `${num}\u00a0${u}` : num;
}

const texUnits: Record<string, string> = { "%": "\\%", "Ω": "\\Omega", h: "\\mathrm{h}", d: "\\mathrm{d}", mAh: "\\mathrm{mAh}", LSB: "\\,\\mathrm{LSB}" };

export function texUnit(unit: string): string {
  if (unit === "") return "";
  if (unit in texUnits) return texUnits[unit];
  const m = /^([fpnuµμmkMG]?)(Ω|Hz|A|V|F|s|W|C|K)$/.exec(unit);
  if (!m) return `\\mathrm{${unit}}`;
  const prefix = m[1] === "u" || m[1] === "µ" || m[1] === "μ" ? "\\mu" : m[1] ? `\\mathrm{${m[1]}}` : "";
  const base = m[2] === "Ω" ? "\\Omega" : `\\mathrm{${m[2]}}`;
  return `${prefix}${base}`;
}

/** LaTeX, e.g. "3.267\,\mathrm{mA}" or "1.136\times10^{4}\,\mathrm{h}". */
export function formatTex(valueSI: number, unit: string, opts?: FormatOptions): string {
  const { mantissa, exponent } = formatNumber(valueSI / unitScale(unit), { counts: unit === "", ...opts });
  const num = mantissa + (exponent === null ? "" : `\\times10^{${exponent}}`);
  const u = texUnit(unit);
  return u ? `${num}\\,${u}` : num;
}

const autoPrefixes: [number, string][] = [
  [1e9, "G"], [1e6, "M"], [1e3, "k"], [1, ""], [1e-3, "m"], [1e-6, "µ"], [1e-9, "n"], [1e-12, "p"], [1e-15, "f"],
];

/** Chooses an engineering prefix: formatAuto(3.267e-3, "A") → "3.267 mA". */
export function formatAuto(valueSI: number, baseUnit: string, opts?: FormatOptions): string {
  if (!Number.isFinite(valueSI)) return "—";
  const a = Math.abs(valueSI);
  if (a === 0) return formatText(0, baseUnit, opts);
  // Round first so that 999.96e-6 shows as 1.000 mA, not 1000 µA.
  const rounded = Number(a.toPrecision(opts?.sig ?? 4));
  const [, prefix] = autoPrefixes.find(([f]) => rounded >= f) ?? autoPrefixes[autoPrefixes.length - 1];
  return formatText(valueSI, prefix + baseUnit, opts);
}
