// "Check yourself" questions. Each is answered in the page and checked (ungraded) by gradeAttempt on
// the server. Prompts quote the inputs through {p.name|unit} placeholders filled from `params`, so the
// numbers a student reads are the numbers the grader uses.
import { formatText } from "./format";

export type LessonQuestion = {
  id: string;
  lesson: string;
  template: string;
  params: Record<string, number | string>;
  quantity: string;
  /** the display unit suggested for the answer ("" for a plain count) */
  unit: string;
  prompt: string;
};

const mAh = 3.6;
// the teaching meter (lib/instruments/library.ts): 14-bit converter on a 2.5 V reference, 1.25 V offset
const LSB = 2.5 / 16384;
const range = { fullScaleVoltage: 2.5, adcBits: 14, adcReference: 2.5 };

export const questions: LessonQuestion[] = [
  {
    id: "safety-shunt-power",
    lesson: "bench-safety",
    template: "shunt-selection",
    params: { maxCurrent: 3.3, maxBurden: 0.1, series: "E24" },
    quantity: "shuntPower",
    unit: "mW",
    prompt:
      "The amp range of the bench meter uses the largest E24 shunt that keeps the burden under {p.maxBurden|mV} at {p.maxCurrent|A}. How much power does that shunt dissipate at full current? (Then compare it with half of the resistor's rating.)",
  },
  {
    id: "burden-low-rail",
    lesson: "burden-voltage",
    template: "shunt-burden",
    params: { supplyVoltage: 1.8, loadResistance: 100, shuntResistance: 10 },
    quantity: "indicatedCurrent",
    unit: "mA",
    prompt:
      "A {p.supplyVoltage|V} rail feeds a {p.loadResistance|Ω} load through an ammeter whose input resistance is {p.shuntResistance|Ω}. What current does the ammeter indicate?",
  },
  {
    id: "burden-motor-drop",
    lesson: "burden-voltage",
    template: "shunt-burden",
    params: { supplyVoltage: 3.0, loadResistance: 8, shuntResistance: 1.8 },
    quantity: "burdenVoltage",
    unit: "mV",
    prompt:
      "A {p.supplyVoltage|V} supply drives an {p.loadResistance|Ω} load through a meter with {p.shuntResistance|Ω} of input resistance. What is the burden voltage across the meter while it measures?",
  },
  {
    id: "shunt-micro-e96",
    lesson: "choosing-a-shunt",
    template: "shunt-selection",
    params: { maxCurrent: 3.3e-6, maxBurden: 10e-3, series: "E96" },
    quantity: "standardShunt",
    unit: "kΩ",
    prompt:
      "Full scale is {p.maxCurrent|µA} and the burden must stay at or below {p.maxBurden|mV}. Which E96 resistor do you fit?",
  },
  {
    id: "shunt-floor-e24",
    lesson: "choosing-a-shunt",
    template: "shunt-selection",
    params: { maxCurrent: 120e-3, maxBurden: 50e-3, series: "E24" },
    quantity: "standardShunt",
    unit: "Ω",
    prompt:
      "A radio module draws up to {p.maxCurrent|mA} and tolerates at most {p.maxBurden|mV} of burden. Which E24 value do you fit? (Careful: the nearest value is not always allowed.)",
  },
  {
    id: "range-radio-volts",
    lesson: "ranges-and-full-scale",
    template: "range-resolution",
    params: { current: 300e-6, ...range },
    quantity: "outputVoltage",
    unit: "V",
    prompt: "The node draws {p.current|µA} while its sensor warms up. On the best range of the course meter, what output voltage do you read?",
  },
  {
    id: "autorange-edge-code",
    lesson: "auto-ranging",
    template: "range-resolution",
    params: { current: 5e-6, ...range },
    quantity: "adcCode",
    unit: "",
    prompt:
      "A steady {p.current|µA} has pushed the meter off its 5 µA range. Which code does the 14-bit converter report on the range it is now on (truncating converter)?",
  },
  {
    id: "resolution-code",
    lesson: "resolution",
    template: "range-resolution",
    params: { current: 500e-9, ...range },
    quantity: "adcCode",
    unit: "",
    prompt: "The node sleeps at {p.current|nA}. Which 14-bit code does the teaching meter's converter report on the best range (truncating converter)?",
  },
  {
    id: "resolution-step",
    lesson: "resolution",
    template: "range-resolution",
    params: { current: 0.2, ...range },
    quantity: "currentResolution",
    unit: "µA",
    prompt: "At {p.current|mA} the meter must use its least sensitive range. What current does one ADC step represent there?",
  },
  {
    id: "filter-cutoff",
    lesson: "filtering-and-settling",
    template: "filter-noise",
    params: { filterResistance: 10e3, filterCapacitance: 100e-9, shuntResistance: 10e3, temperature: 300 },
    quantity: "cutoffFrequency",
    unit: "Hz",
    prompt: "The output filter is {p.filterResistance|kΩ} and {p.filterCapacitance|nF}. What is its −3 dB cut-off frequency?",
  },
  {
    id: "filter-settle",
    lesson: "filtering-and-settling",
    template: "filter-noise",
    params: { filterResistance: 1e3, filterCapacitance: 10e-6, shuntResistance: 10e3, temperature: 300 },
    quantity: "settlingTime1pct",
    unit: "ms",
    prompt: "With {p.filterResistance|kΩ} and {p.filterCapacitance|µF}, how long after a step must you wait before the output is within 1 % of its final value?",
  },
  {
    id: "bidir-discharge",
    lesson: "bidirectional-currents",
    template: "bidirectional-offset",
    params: { offsetVoltage: 1.25, sensitivity: 5e3, outputVoltage: 0.65, fullScaleVoltage: 2.5 },
    quantity: "signedCurrent",
    unit: "µA",
    prompt:
      "In bipolar mode the zero-current output is {p.offsetVoltage|V}; the 500 µA range gives 5 mV per µA. The output reads {p.outputVoltage|V}. What current flows, with its sign?",
  },
  {
    id: "bidir-charge-code",
    lesson: "bidirectional-currents",
    template: "bidirectional-offset",
    params: { offsetVoltage: 1.25, sensitivity: 2.5, outputVoltage: 9830 * LSB, fullScaleVoltage: 2.5 },
    quantity: "signedCurrent",
    unit: "mA",
    prompt:
      "The cell is charging. On the 1 A range (2.5 V per A) with the zero at {p.offsetVoltage|V}, the output reads {p.outputVoltage|V|5}. What current flows, with its sign (into the cell is positive)?",
  },
  {
    id: "bidir-code-6000",
    lesson: "bidirectional-currents",
    template: "bidirectional-offset",
    params: { offsetVoltage: 1.25, sensitivity: 5e5, outputVoltage: 6000 * LSB, fullScaleVoltage: 2.5 },
    quantity: "signedCurrent",
    unit: "nA",
    prompt:
      "On the 5 µA range (0.5 mV per nA) with the zero at {p.offsetVoltage|V}, the output reads {p.outputVoltage|V|4}. What current flows, with its sign?",
  },
  {
    id: "duty-average",
    lesson: "duty-cycled-loads",
    template: "duty-cycle",
    params: { sleepCurrent: 3e-6, activeCurrent: 25e-3, activeTime: 5e-3, period: 10, batteryCapacity: 220 * mAh, usableFraction: 0.8 },
    quantity: "averageCurrent",
    unit: "µA",
    prompt:
      "A node sleeps at {p.sleepCurrent|µA} and wakes every {p.period|s} for {p.activeTime|ms} at {p.activeCurrent|mA}. What is its average current?",
  },
  {
    id: "duty-life",
    lesson: "duty-cycled-loads",
    template: "duty-cycle",
    params: { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 10e-3, period: 1, batteryCapacity: 220 * mAh, usableFraction: 0.8 },
    quantity: "batteryLife",
    unit: "h",
    prompt:
      "The node sleeps at {p.sleepCurrent|µA}, and once every {p.period|s} wakes for {p.activeTime|ms} at {p.activeCurrent|mA}. Its cell holds {p.batteryCapacity|mAh} and you count on {p.usableFraction|%x} of it. How long does it run?",
  },
  {
    id: "noise-megohm",
    lesson: "noise-floor",
    template: "filter-noise",
    params: { filterResistance: 10e3, filterCapacitance: 100e-9, shuntResistance: 1e6, temperature: 300 },
    quantity: "thermalNoiseCurrent",
    unit: "pA",
    prompt:
      "A {p.shuntResistance|MΩ} shunt at {p.temperature|K} is read by an amplifier whose output passes through a {p.filterResistance|kΩ} / {p.filterCapacitance|nF} low-pass filter, as in the drawing (the amplifier keeps the shunt out of the filter's time constant). What rms noise current does the shunt's thermal noise amount to in the filter's noise bandwidth?",
  },
  {
    id: "unc-amp-expanded",
    lesson: "uncertainty-budget",
    template: "uncertainty",
    params: { reading: 50e-3, readingAccuracyPercent: 0.5, readingCounts: 2, countSize: 0.1e-3, shuntResistance: 0.1, shuntTolerancePercent: 1, coverageFactor: 2 },
    quantity: "expandedUncertainty",
    unit: "mA",
    prompt:
      "The voltmeter reads {p.reading|mV} across a {p.shuntResistance|Ω} ±{p.shuntTolerancePercent|%} shunt. Its specification is ±({p.readingAccuracyPercent|%} of reading + {p.readingCounts|} counts), one count being {p.countSize|mV}. State the expanded uncertainty of the current for k = {p.coverageFactor|}.",
  },
  {
    id: "unc-chain-quantisation",
    lesson: "uncertainty-budget",
    template: "uncertainty",
    params: { reading: 20e-3, readingAccuracyPercent: 0, readingCounts: 0, countSize: 1e-3, shuntResistance: 0.1, shuntTolerancePercent: 1, coverageFactor: 2, amplifierGain: 50, adcBits: 14, adcReference: 2.5 },
    quantity: "quantisationContribution",
    unit: "µA",
    prompt:
      "The teaching meter reads the {p.reading|mV} across a {p.shuntResistance|Ω} shunt through a ×{p.amplifierGain|} amplifier into a {p.adcBits|}-bit converter with a {p.adcReference|V} reference. What standard uncertainty of the current does rounding to one converter step contribute?",
  },
  {
    id: "leak-guarded-error",
    lesson: "leakage-and-guarding",
    template: "leakage-guard",
    params: { sourceVoltage: 15, insulationResistance: 50e9, measuredCurrent: 2e-9, biasCurrent: 10e-12, guardVoltage: 3e-3 },
    quantity: "guardedErrorPercent",
    unit: "%",
    prompt:
      "A trace at {p.sourceVoltage|V} runs past the input of a feedback ammeter measuring {p.measuredCurrent|nA}; the board's insulation between them is {p.insulationResistance|GΩ} and the amplifier's bias current is {p.biasCurrent|pA}. A guard ring is added and held within {p.guardVoltage|mV} of the input. What error, as a percentage of the current measured, remains?",
  },
  {
    id: "leak-unguarded",
    lesson: "leakage-and-guarding",
    template: "leakage-guard",
    params: { sourceVoltage: 15, insulationResistance: 50e9, measuredCurrent: 2e-9, biasCurrent: 10e-12, guardVoltage: 3e-3 },
    quantity: "leakageCurrent",
    unit: "pA",
    prompt: "Before the guard: how much current does the {p.sourceVoltage|V} trace push through {p.insulationResistance|GΩ} of insulation into the input?",
  },
  {
    id: "thermal-apparent",
    lesson: "offsets-and-thermoelectric-voltages",
    template: "offset-thermal",
    params: { shuntResistance: 2e-3, current: 0.25, offsetVoltage: 20e-6, seebeckMicrovoltsPerKelvin: 3, junctionTemperatureDifference: 2 },
    quantity: "apparentCurrent",
    unit: "mA",
    prompt:
      "A {p.shuntResistance|mΩ} shunt is read by an amplifier with {p.offsetVoltage|µV} of input offset, through two junctions of {p.seebeckMicrovoltsPerKelvin|} µV/K that differ by {p.junctionTemperatureDifference|K}. With no current flowing, what current does it appear to read?",
  },
  {
    id: "thermal-reversal",
    lesson: "offsets-and-thermoelectric-voltages",
    template: "offset-thermal",
    params: { shuntResistance: 2e-3, current: 0.25, offsetVoltage: 20e-6, seebeckMicrovoltsPerKelvin: 3, junctionTemperatureDifference: 2 },
    quantity: "reverseVoltage",
    unit: "µV",
    prompt:
      "The same set-up now carries {p.current|mA}, then the current is reversed. What voltage (with its sign) do you read across the {p.shuntResistance|mΩ} shunt in the reversed polarity?",
  },
  {
    id: "burst-min-rate",
    lesson: "sampling-short-bursts",
    template: "sampling-burst",
    params: { sampleRate: 2000, burstWidth: 8e-3, requiredSamples: 40, wakePeriod: 0.95, logRate: 1, activeCurrent: 15e-3, sleepCurrent: 3e-6 },
    quantity: "minimumSampleRate",
    unit: "kHz",
    prompt: "A radio burst lasts {p.burstWidth|ms} and you want {p.requiredSamples|} samples inside it. What is the lowest sample rate that gives them?",
  },
  {
    id: "burst-alias",
    lesson: "sampling-short-bursts",
    template: "sampling-burst",
    params: { sampleRate: 2000, burstWidth: 8e-3, requiredSamples: 40, wakePeriod: 0.95, logRate: 1, activeCurrent: 15e-3, sleepCurrent: 3e-6 },
    quantity: "apparentWakeFrequency",
    unit: "mHz",
    prompt:
      "The node wakes every {p.wakePeriod|s}. A slow data logger samples its current at {p.logRate|Hz}, so each sample lands a little further along the wake cycle. At what frequency does the sampling phase come back to the same point of the cycle (the alias of the wake rate)?",
  },
  {
    id: "fb-settling",
    lesson: "feedback-ammeter",
    template: "filter-noise",
    params: { filterResistance: 100e6, filterCapacitance: 4.7e-12, shuntResistance: 100e6, temperature: 300 },
    quantity: "settlingTime1pct",
    unit: "ms",
    prompt:
      "A feedback ammeter's 20 nA range uses a {p.filterResistance|MΩ} feedback resistor with {p.filterCapacitance|pF} across it. How long after a step of current does its output take to come within 1 % of the final value?",
  },
  {
    id: "fb-noise",
    lesson: "feedback-ammeter",
    template: "filter-noise",
    params: { filterResistance: 100e6, filterCapacitance: 4.7e-12, shuntResistance: 100e6, temperature: 300 },
    quantity: "thermalNoiseCurrent",
    unit: "fA",
    prompt:
      "On the same range at {p.temperature|K}, what rms noise current does the {p.shuntResistance|MΩ} feedback resistor's own thermal noise add, over the noise bandwidth of its {p.filterCapacitance|pF} feedback capacitor?",
  },
];

/** Fills {p.name|unit} (optionally |sig) placeholders with the question's own inputs. "%x" shows a fraction as a percentage. */
export function renderPrompt(q: LessonQuestion): string {
  return q.prompt.replace(/\{p\.([A-Za-z0-9]+)\|([^|}]*)(?:\|(\d+))?\}/g, (_, name: string, unit: string, sig?: string) => {
    const v = q.params[name];
    if (v === undefined) throw new Error(`question ${q.id} has no parameter ${name}`);
    if (typeof v === "string") return v;
    if (unit === "%x") return formatText(v * 100, "%", { trim: true });
    return formatText(v, unit, { trim: !sig, sig: sig ? Number(sig) : 4 });
  });
}

export function questionsFor(lesson: string): LessonQuestion[] {
  return questions.filter((q) => q.lesson === lesson);
}

export function getQuestion(id: string): LessonQuestion | undefined {
  return questions.find((q) => q.id === id);
}
