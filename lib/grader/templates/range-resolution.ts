// A multi-range sampling meter: each range a shunt and amplifier with a fixed output per ampere, feeding an
// N-bit converter. The ranges are the lab's instrument profile (lib/instruments), by default the course's
// teaching meter; the converter is the lab's parameters.
import type { Params, Template } from "../types";
import { allPositive, num, tq } from "./util";
import { texNumber } from "../format";
import { TEACHING_BITS, TEACHING_REFERENCE_VOLTS, teachingMeter } from "../../instruments/library";
import type { InstrumentProfile } from "../../instruments/profile";

export interface MeterRange {
  /** the range's name by full scale, e.g. "500 µA": the answer a student gives for the best range */
  name: string;
  /** V/A */
  sensitivity: number;
  /** LaTeX of the name */
  tex: string;
  /** the sensitivity in the range's own unit, e.g. "5 mV/µA" */
  shown: string;
}

const UNIT_SCALE: Record<string, number> = { pA: 1e-12, nA: 1e-9, "µA": 1e-6, uA: 1e-6, mA: 1e-3, A: 1 };

/** "5 mV/µA" for 5000 V/A on the 500 µA range: the output per unit of the range's own current unit. */
export function sensitivityText(sensitivity: number, label: string): string {
  const unit = label.split(" ").pop() ?? "A";
  const perUnit = sensitivity * (UNIT_SCALE[unit] ?? 1);
  const n = (x: number) => String(Number(x.toPrecision(4)));
  return perUnit >= 1 ? `${n(perUnit)} V/${unit}` : `${n(perUnit * 1000)} mV/${unit}`;
}

function texLabel(label: string): string {
  const [n, unit = "A"] = label.split(" ");
  const u = unit.startsWith("µ") ? `\\mu\\mathrm{${unit.slice(1)}}` : `\\mathrm{${unit}}`;
  return `${n}\\,${u}`;
}

/** The ranges of a sampling-meter profile that have a sensitivity, smallest full scale first. */
export function meterRanges(profile: InstrumentProfile): MeterRange[] {
  return profile.ranges
    .filter((r) => r.sensitivity !== undefined)
    .map((r) => ({ name: r.label, sensitivity: r.sensitivity as number, tex: texLabel(r.label), shown: sensitivityText(r.sensitivity as number, r.label) }));
}

/** The teaching meter's ranges: the template's default instrument. */
export const RANGES: readonly MeterRange[] = meterRanges(teachingMeter);

export interface RangeRow {
  /** the range's name by full scale */
  range: string;
  /** V/A */
  sensitivity: number;
  outputVoltage: number;
  /** ADC code, truncating quantiser, clipped to the top code */
  code: number;
  /** output at or above the top code's voltage */
  saturated: boolean;
}

/** Output, code and saturation on every range, for the feedback and the lessons. */
export function rangeTable(p: Params, ranges: readonly MeterRange[] = RANGES): { rows: RangeRow[]; topVoltage: number; lsb: number } {
  const current = Math.abs(num(p, "current"));
  const vfs = num(p, "fullScaleVoltage");
  const bits = num(p, "adcBits");
  const vref = num(p, "adcReference");
  const levels = 2 ** bits;
  const lsb = vref / levels;
  const topVoltage = Math.min(vfs, (levels - 1) * lsb);
  const rows: RangeRow[] = [];
  for (const r of ranges) {
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
    { key: "current", label: "Current", symbol: "I", unit: "A", displayUnit: "µA", kind: "number", default: 500e-9, min: 1e-9, max: 0.99, suggestedRange: [1e-7, 40e-3] },
    { key: "fullScaleVoltage", label: "Full-scale output", symbol: "V_\\mathrm{FS}", unit: "V", displayUnit: "V", kind: "number", default: TEACHING_REFERENCE_VOLTS, min: 0.5, max: 10 },
    { key: "adcBits", label: "ADC resolution", symbol: "N", unit: "", displayUnit: "bit", kind: "integer", default: TEACHING_BITS, min: 8, max: 24 },
    { key: "adcReference", label: "ADC reference", symbol: "V_\\mathrm{ref}", unit: "V", displayUnit: "V", kind: "number", default: TEACHING_REFERENCE_VOLTS, min: 0.5, max: 10 },
  ],
  quantities: [
    { key: "bestRange", label: "Best range", symbol: "\\text{range}", unit: "", displayUnit: "", kind: "category", choices: RANGES.map((r) => r.name), description: "The most sensitive range whose output stays below the top code's voltage." },
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
      const detail = `You used the ${RANGES[i].name} range (${RANGES[i].shown}); the best range is ${RANGES[v.best].name}${i < v.best ? `, because the ${RANGES[i].name} range saturates` : ", the most sensitive one that does not saturate"}.`;
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
