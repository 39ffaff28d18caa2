// A three-range meter (1 mV/nA, 1 mV/µA, 1 mV/mA) feeding an N-bit ADC.
import type { Params, Template } from "../types";
import { allPositive, num, tq } from "./util";
import { texNumber } from "../format";

export const RANGES = [
  { name: "nA", sensitivity: 1e6, tex: "\\mathrm{nA}" },
  { name: "uA", sensitivity: 1e3, tex: "\\mu\\mathrm{A}" },
  { name: "mA", sensitivity: 1, tex: "\\mathrm{mA}" },
] as const;

const SHOWN = ["nA", "µA", "mA"];
const SENS = ["1 mV/nA", "1 mV/µA", "1 mV/mA"];

export interface RangeRow {
  range: "nA" | "uA" | "mA";
  /** V/A */
  sensitivity: number;
  outputVoltage: number;
  /** ADC code, truncating quantiser, clipped to the top code */
  code: number;
  /** output at or above the top code's voltage */
  saturated: boolean;
}

/** Output, code and saturation on every range, for the feedback and the lessons. */
export function rangeTable(p: Params): { rows: RangeRow[]; topVoltage: number; lsb: number } {
  const current = Math.abs(num(p, "current"));
  const vfs = num(p, "fullScaleVoltage");
  const bits = num(p, "adcBits");
  const vref = num(p, "adcReference");
  const levels = 2 ** bits;
  const lsb = vref / levels;
  const topVoltage = Math.min(vfs, (levels - 1) * lsb);
  const rows: RangeRow[] = [];
  for (const r of RANGES) {
    const out = current * r.sensitivity;
    rows.push({
      range: r.name,
      sensitivity: r.sensitivity,
      outputVoltage: out,
      code: Math.min(levels - 1, Math.floor((out * levels) / vref)),
      saturated: !(out < topVoltage),
    });
  }
  return { rows, topVoltage, lsb };
}

function values(p: Params) {
  const t = rangeTable(p);
  let best = -1;
  for (let i = 0; i < t.rows.length; i++) {
    if (!t.rows[i].saturated) {
      best = i;
      break;
    }
  }
  const row = best >= 0 ? t.rows[best] : undefined;
  return {
    rows: t.rows,
    topVoltage: t.topVoltage,
    lsb: t.lsb,
    best,
    bits: num(p, "adcBits"),
    vref: num(p, "adcReference"),
    current: num(p, "current"),
    bestRange: row ? row.range : "",
    outputVoltage: row ? row.outputVoltage : NaN,
    adcCode: row ? row.code : NaN,
    currentResolution: row ? t.lsb / row.sensitivity : NaN,
  };
}

function neighbours(best: number): number[] {
  return [best - 1, best + 1].filter((i) => i >= 0 && i < RANGES.length);
}

export const rangeResolution: Template = {
  key: "range-resolution",
  title: "Choosing a range and reading the ADC",
  summary:
    "Pick the most sensitive range that does not saturate, then find the output voltage, the ADC code and the current per code.",
  parameters: [
    { key: "current", label: "Current", symbol: "I", unit: "A", displayUnit: "µA", kind: "number", default: 500e-9, min: 1e-9, max: 3.2, suggestedRange: [1e-7, 3e-3] },
    { key: "fullScaleVoltage", label: "Full-scale output", symbol: "V_\\mathrm{FS}", unit: "V", displayUnit: "V", kind: "number", default: 3.3, min: 0.5, max: 10 },
    { key: "adcBits", label: "ADC resolution", symbol: "N", unit: "", displayUnit: "bit", kind: "integer", default: 12, min: 8, max: 24 },
    { key: "adcReference", label: "ADC reference", symbol: "V_\\mathrm{ref}", unit: "V", displayUnit: "V", kind: "number", default: 3.3, min: 0.5, max: 10 },
  ],
  quantities: [
    { key: "bestRange", label: "Best range", symbol: "\\text{range}", unit: "", displayUnit: "", kind: "category", choices: ["nA", "uA", "mA"], description: "The most sensitive range whose output stays below the top code's voltage." },
    { key: "outputVoltage", label: "Output voltage", symbol: "V_\\mathrm{out}", unit: "V", displayUnit: "V", kind: "number", description: "The range's output voltage for this current." },
    { key: "adcCode", label: "ADC code", symbol: "c", unit: "", displayUnit: "", kind: "number", discrete: true, description: "The code a truncating ADC returns (±1 code accepted)." },
    { key: "currentResolution", label: "Current per code", symbol: "I_\\mathrm{LSB}", unit: "A", displayUnit: "nA", kind: "number", description: "The current one ADC step stands for on the chosen range." },
  ],
  compute(p) {
    const v = values(p);
    return { bestRange: v.bestRange, outputVoltage: v.outputVoltage, adcCode: v.adcCode, currentResolution: v.currentResolution };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.current, num(p, "fullScaleVoltage"), v.vref)) return "current, full scale and reference must be positive";
    if (!Number.isInteger(v.bits) || v.bits < 1 || v.bits > 32) return "ADC resolution must be a whole number of bits";
    if (v.best < 0) return "the current saturates every range";
    if (!(v.adcCode >= 1)) return "the current is below one ADC code on every usable range";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const I = tq(v.current, "A");
    const steps: string[] = [];
    const vTop = tq(v.topVoltage, "V");
    const rangeSteps = v.rows.map((r, i) => {
      const out = `${I} \\times ${texNumber(r.sensitivity)}\\,\\mathrm{V/A} = ${tq(r.outputVoltage, "V")}`;
      return `${RANGES[i].tex}\\text{ range: } ${out} ${r.saturated ? `\\ge ${vTop}\\ \\text{(saturates)}` : `< ${vTop}`}`;
    });
    const row = v.rows[v.best];
    const name = RANGES[v.best]?.tex ?? "";
    steps.push(`V_\\mathrm{top} = (2^{${v.bits}} - 1)\\,\\frac{V_\\mathrm{ref}}{2^{${v.bits}}} = ${vTop}`);
    steps.push(...rangeSteps);
    steps.push(`\\text{best range: } ${name}\\ (S = ${texNumber(row?.sensitivity ?? NaN)}\\,\\mathrm{V/A})`);
    if (q === "bestRange") return steps;
    if (q === "outputVoltage") return [...steps, `V_\\mathrm{out} = I\\,S = ${tq(v.outputVoltage, "V")}`];
    if (q === "adcCode")
      return [
        ...steps,
        `c = \\left\\lfloor \\frac{V_\\mathrm{out}\\,2^{N}}{V_\\mathrm{ref}} \\right\\rfloor = \\left\\lfloor \\frac{${tq(v.outputVoltage, "V")} \\times ${2 ** v.bits}}{${tq(v.vref, "V")}} \\right\\rfloor = ${v.adcCode}\\quad(\\pm 1)`,
      ];
    if (q === "currentResolution")
      return [
        ...steps,
        `\\mathrm{LSB} = \\frac{V_\\mathrm{ref}}{2^{N}} = \\frac{${tq(v.vref, "V")}}{${2 ** v.bits}} = ${tq(v.lsb, "V")}`,
        `I_\\mathrm{LSB} = \\frac{\\mathrm{LSB}}{S} = ${tq(v.currentResolution, "A")}`,
      ];
    return steps;
  },
  mistakes(p, q) {
    const v = values(p);
    if (v.best < 0) return [];
    const out: { key: "wrong-range"; value: number | string; detail: string }[] = [];
    for (const i of neighbours(v.best)) {
      const r = v.rows[i];
      const detail = `You used the ${SHOWN[i]} range (${SENS[i]}); the best range is ${SHOWN[v.best]}${i < v.best ? `, because the ${SHOWN[i]} range saturates` : ", the most sensitive one that does not saturate"}.`;
      if (q === "bestRange") out.push({ key: "wrong-range", value: r.range, detail });
      if (q === "outputVoltage") out.push({ key: "wrong-range", value: Math.abs(v.current) * r.sensitivity, detail });
      if (q === "adcCode") out.push({ key: "wrong-range", value: r.code, detail });
      if (q === "currentResolution") out.push({ key: "wrong-range", value: v.lsb / r.sensitivity, detail });
    }
    return out;
  },
  answerNote(p, q, answer) {
    const v = values(p);
    const top = 2 ** v.bits - 1;
    if ((q === "adcCode" && answer >= top) || (q === "outputVoltage" && answer >= v.topVoltage))
      return `That reading is saturated (at or above the top code ${top}, ${v.topVoltage.toPrecision(4)} V): a saturated reading must be flagged, not used; move to a less sensitive range.`;
    return undefined;
  },
  exactBand(_p, q) {
    return q === "adcCode" ? 1 : undefined;
  },
};
