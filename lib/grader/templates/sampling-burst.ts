// Sampling a duty-cycled load: a node sleeps at I_s and wakes to I_a for a burst t_b once every period T.
// A logger sampling at f_s puts t_b·f_s samples in a burst; N samples need f_s ≥ N/t_b. A slow logger at
// f_log sees the wake rate 1/T at its alias |1/T − n·f_log| (n the integer nearest (1/T)/f_log). Where a
// burst's edges fall between samples, the burst's charge is off by up to one sample interval of (I_a − I_s),
// so the average over a period is off by up to (I_a − I_s)/(f_s·T).
import type { MistakeCandidate, Params, Template } from "../types";
import { allPositive, num, tq } from "./util";
import { texNumber } from "../format";

function values(p: Params) {
  const fs = num(p, "sampleRate");
  const tb = num(p, "burstWidth");
  const n = num(p, "requiredSamples");
  const T = num(p, "wakePeriod");
  const flog = num(p, "logRate");
  const ia = num(p, "activeCurrent");
  const is = num(p, "sleepCurrent");
  const fw = 1 / T;
  const nearest = Math.round(fw / flog);
  const average = (ia * tb + is * (T - tb)) / T;
  const worst = (ia - is) / (fs * T);
  return {
    fs, tb, n, T, flog, ia, is, fw, nearest, average,
    samplesPerBurst: tb * fs,
    minimumSampleRate: n / tb,
    apparentWakeFrequency: Math.abs(fw - nearest * flog),
    worstCaseAverageError: worst,
    worstCaseErrorPercent: (100 * worst) / average,
  };
}

export const samplingBurst: Template = {
  key: "sampling-burst",
  title: "Sampling the short bursts of a duty-cycled load",
  summary:
    "Count the samples that fall inside a burst, find the rate a burst needs, see where a slow logger puts the wakes (aliasing), and bound the error of the average when a burst's edges fall between samples.",
  parameters: [
    { key: "sampleRate", label: "Sample rate of the fast logger", symbol: "f_\\mathrm{s}", unit: "Hz", displayUnit: "kHz", kind: "number", default: 1000, min: 1e-3, max: 1e8, suggestedRange: [500, 5000] },
    { key: "burstWidth", label: "Burst (wake) width", symbol: "t_\\mathrm{b}", unit: "s", displayUnit: "ms", kind: "number", default: 5e-3, min: 1e-7, max: 3600, suggestedRange: [2e-3, 20e-3] },
    { key: "requiredSamples", label: "Samples wanted per burst", symbol: "N", unit: "", displayUnit: "samples", kind: "integer", default: 20, min: 1, max: 100000 },
    { key: "wakePeriod", label: "Wake period", symbol: "T", unit: "s", displayUnit: "s", kind: "number", default: 1.02, min: 1e-4, max: 86400, suggestedRange: [0.9, 1.1] },
    { key: "logRate", label: "Sample rate of the slow logger", symbol: "f_\\mathrm{log}", unit: "Hz", displayUnit: "Hz", kind: "number", default: 1, min: 1e-4, max: 1e6 },
    { key: "activeCurrent", label: "Current during a burst", symbol: "I_\\mathrm{a}", unit: "A", displayUnit: "mA", kind: "number", default: 20e-3, min: 1e-9, max: 10, suggestedRange: [5e-3, 50e-3] },
    { key: "sleepCurrent", label: "Sleep current", symbol: "I_\\mathrm{s}", unit: "A", displayUnit: "µA", kind: "number", default: 2e-6, min: 1e-12, max: 1, suggestedRange: [1e-6, 10e-6] },
  ],
  quantities: [
    { key: "samplesPerBurst", label: "Samples per burst", symbol: "n_\\mathrm{b}", unit: "", displayUnit: "samples", kind: "number", counted: true, description: "Burst width times sample rate (a burst catches the whole number below or above it, by phase)." },
    { key: "minimumSampleRate", label: "Lowest sample rate for N samples per burst", symbol: "f_\\mathrm{s,min}", unit: "Hz", displayUnit: "kHz", kind: "number", description: "The required number of samples divided by the burst width." },
    { key: "apparentWakeFrequency", label: "Apparent wake frequency on the slow logger", symbol: "f_\\mathrm{a}", unit: "Hz", displayUnit: "mHz", kind: "number", description: "The wake rate 1/T as the slow logger shows it: its distance to the nearest multiple of f_log." },
    { key: "worstCaseAverageError", label: "Worst-case error of the average", symbol: "\\Delta\\bar I", unit: "A", displayUnit: "µA", kind: "number", description: "One sample interval of (I_a − I_s) per wake period." },
    { key: "worstCaseErrorPercent", label: "Worst-case error of the average in percent", symbol: "\\Delta\\bar I / \\bar I", unit: "%", displayUnit: "%", kind: "number", description: "The worst-case error as a percentage of the true time-weighted average." },
  ],
  compute(p) {
    const v = values(p);
    return {
      samplesPerBurst: v.samplesPerBurst,
      minimumSampleRate: v.minimumSampleRate,
      apparentWakeFrequency: v.apparentWakeFrequency,
      worstCaseAverageError: v.worstCaseAverageError,
      worstCaseErrorPercent: v.worstCaseErrorPercent,
    };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.fs, v.tb, v.n, v.T, v.flog, v.ia, v.is)) return "rates, times, currents and the number of samples must be positive";
    if (!Number.isInteger(v.n)) return "the number of samples must be a whole number";
    if (!(v.tb < v.T)) return "the burst must be shorter than the wake period";
    if (!(v.ia > v.is)) return "the burst current must be larger than the sleep current";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const avg = `\\bar I = \\frac{I_\\mathrm{a} t_\\mathrm{b} + I_\\mathrm{s}(T - t_\\mathrm{b})}{T} = ${tq(v.average, "A")}`;
    const worst = [`\\Delta\\bar I = \\frac{(I_\\mathrm{a} - I_\\mathrm{s})\\,/f_\\mathrm{s}}{T} = \\frac{(${tq(v.ia, "A")} - ${tq(v.is, "A")}) \\times ${tq(1 / v.fs, "s")}}{${tq(v.T, "s")}} = ${tq(v.worstCaseAverageError, "A")}`];
    if (q === "samplesPerBurst")
      return [`n_\\mathrm{b} = t_\\mathrm{b}\\,f_\\mathrm{s} = ${tq(v.tb, "s")} \\times ${tq(v.fs, "Hz")} = ${texNumber(v.samplesPerBurst)}`];
    if (q === "minimumSampleRate")
      return [`f_\\mathrm{s,min} = \\frac{N}{t_\\mathrm{b}} = \\frac{${texNumber(v.n)}}{${tq(v.tb, "s")}} = ${tq(v.minimumSampleRate, "Hz")}`];
    if (q === "apparentWakeFrequency")
      return [
        `f_\\mathrm{w} = \\frac{1}{T} = \\frac{1}{${tq(v.T, "s")}} = ${tq(v.fw, "Hz")}`,
        `n = \\operatorname{round}\\!\\left(\\frac{f_\\mathrm{w}}{f_\\mathrm{log}}\\right) = ${texNumber(v.nearest)}`,
        `f_\\mathrm{a} = |f_\\mathrm{w} - n\\,f_\\mathrm{log}| = |${tq(v.fw, "Hz")} - ${texNumber(v.nearest)} \\times ${tq(v.flog, "Hz")}| = ${tq(v.apparentWakeFrequency, "Hz")}`,
      ];
    if (q === "worstCaseAverageError") return worst;
    if (q === "worstCaseErrorPercent") return [...worst, avg, `\\frac{\\Delta\\bar I}{\\bar I} = \\frac{${tq(v.worstCaseAverageError, "A")}}{${tq(v.average, "A")}} = ${tq(v.worstCaseErrorPercent, "%")}`];
    return [];
  },
  mistakes(p, q) {
    const v = values(p);
    const out: MistakeCandidate[] = [];
    const period = "You used the wake period T where the burst width t_b belongs.";
    if (q === "samplesPerBurst") out.push({ key: "period-for-burst", value: v.T * v.fs, detail: period });
    if (q === "minimumSampleRate") out.push({ key: "period-for-burst", value: v.n / v.T, detail: period });
    if (q === "apparentWakeFrequency") out.push({ key: "ignored-aliasing", value: v.fw, detail: "You gave the true wake rate; the slow logger cannot show it." });
    return out;
  },
  bandFloor(p, q, rel) {
    // an alias can land on (or next to) zero: a tenth of the tolerance applied to the logger's rate
    return q === "apparentWakeFrequency" ? 0.1 * rel * num(p, "logRate") : 0;
  },
};
