"use client";
// Live calculators for the lessons. Every physical result comes from lib/grader (templates[…].compute,
// nearestStandard); this file only reads inputs, lays out results and draws plots with uPlot.
import { useMemo, useState } from "react";
import { nearestStandard, templates } from "@/lib/grader";
import { formatAuto, formatText } from "@/lib/lessons/format";
import { teaching } from "@/lib/lessons/teaching";
import { QuantityInput } from "@/components/ui/field";
import { CalculatorCard, Output, useQuantityFields } from "./fields";
import { Plot } from "./Plot";

type Computed = Record<string, number | string>;
function compute(template: string, params: Record<string, number | string>): Computed | null {
  const t = (templates as Record<string, { compute(p: Record<string, number | string>): Computed }>)[template];
  try {
    const out = t.compute(params);
    return Object.values(out).every((v) => typeof v === "string" || Number.isFinite(v)) ? out : null;
  } catch {
    return null;
  }
}
const num = (c: Computed | null, k: string) => (c && typeof c[k] === "number" ? (c[k] as number) : NaN);

function Fields<K extends string>({ f, defs }: { f: ReturnType<typeof useQuantityFields<K>>; defs: Record<K, { label: string; hint?: string }> }) {
  return (
    <div className="no-print grid gap-3 sm:grid-cols-2">
      {(Object.keys(defs) as K[]).map((k) => (
        <QuantityInput key={k} className="" label={defs[k].label} hint={defs[k].hint} value={f.texts[k]} onChange={(e) => f.setText(k, e.target.value)} error={f.errors[k]} />
      ))}
    </div>
  );
}

const invalid = <p className="text-sm text-ink-soft">Fix the highlighted input to see the results.</p>;

// ---------------------------------------------------------------- burden explorer
const burdenDefs = {
  supplyVoltage: { label: "Supply voltage Vs", unit: "V", initial: "3.3 V" },
  loadResistance: { label: "Load resistance RL", unit: "ohm", initial: "1k" },
  shuntResistance: { label: "Ammeter input resistance R_in", unit: "ohm", initial: "10 Ω", hint: "The shunt plus fuse and leads, e.g. 10, 1R8, 100 ohm" },
};

export function BurdenExplorer() {
  const f = useQuantityFields(burdenDefs);
  const c = f.allOk ? compute("shunt-burden", f.values as Record<string, number>) : null;
  return (
    <CalculatorCard title="burden explorer" testId="burden-explorer">
      <Fields f={f} defs={burdenDefs} />
      {c ? (
        <dl className="mt-4 mb-0" aria-live="polite">
          <Output label="True current (no meter)" value={formatAuto(num(c, "trueCurrent"), "A")} testId="true-current" />
          <Output label="Indicated current (meter in circuit)" value={formatAuto(num(c, "indicatedCurrent"), "A")} testId="indicated-current" />
          <Output label="Burden voltage across the meter" value={formatAuto(num(c, "burdenVoltage"), "V")} />
          <Output label="Loading error" value={`${num(c, "loadingErrorPercent").toPrecision(4)} %`} testId="loading-error" />
        </dl>
      ) : (
        invalid
      )}
    </CalculatorCard>
  );
}

// ---------------------------------------------------------------- shunt picker
const pickerDefs = {
  maxCurrent: { label: "Largest current to measure", unit: "A", initial: "3.3 A" },
  maxBurden: { label: "Largest burden allowed", unit: "V", initial: "100 mV" },
};
const seriesChoices = ["E12", "E24", "E96"] as const;

export function ShuntPicker() {
  const f = useQuantityFields(pickerDefs);
  const [series, setSeries] = useState<(typeof seriesChoices)[number]>("E24");
  const c = f.allOk ? compute("shunt-selection", { ...(f.values as Record<string, number>), series }) : null;
  const ideal = num(c, "idealShunt");
  const nearest = Number.isFinite(ideal) ? nearestStandard(ideal, series, "nearest") : NaN;
  // Ohm's law for the "nearest" alternative, only to show why it can break the limit.
  const nearestBurden = nearest * (f.values.maxCurrent ?? NaN);
  const over = nearest > ideal * (1 + 1e-9);
  return (
    <CalculatorCard title="shunt picker" testId="shunt-picker">
      <Fields f={f} defs={pickerDefs} />
      <fieldset className="no-print mt-3">
        <legend className="field-label">Resistor series</legend>
        <div className="mt-1 flex gap-4">
          {seriesChoices.map((s) => (
            <label key={s} className="flex items-center gap-1">
              <input type="radio" name="series" value={s} checked={series === s} onChange={() => setSeries(s)} /> {s}
            </label>
          ))}
        </div>
      </fieldset>
      {c ? (
        <dl className="mt-4 mb-0" aria-live="polite">
          <Output label="Ideal shunt (burden limit ÷ current)" value={formatAuto(ideal, "Ω")} />
          <Output label={`Largest ${series} value at or below it (fit this)`} value={formatAuto(num(c, "standardShunt"), "Ω")} testId="floor-shunt" />
          <Output label="Burden at full current" value={formatAuto(num(c, "burdenAtFullScale"), "V")} />
          <Output label="Power in the shunt at full current" value={formatAuto(num(c, "shuntPower"), "W")} />
          <Output label="Rate the resistor for at least (2 × P)" value={formatAuto(2 * num(c, "shuntPower"), "W")} />
          <Output label={`Nearest ${series} value (for comparison)`} value={formatAuto(nearest, "Ω")} testId="nearest-shunt" />
          {over && (
            <p className="mt-2 mb-0 text-sm text-verdict-wrong">
              The nearest value is above the ideal one: at full current it would drop {formatAuto(nearestBurden, "V")}, more than the limit. Use the smaller value.
            </p>
          )}
        </dl>
      ) : (
        invalid
      )}
    </CalculatorCard>
  );
}

// ---------------------------------------------------------------- range and ADC-code picker
const rangeDefs = { current: { label: "Current to measure", unit: "A", initial: "500 nA", hint: "e.g. 500 nA, 2 mA, 3.4e-3 A" } };
const rangeLabel: Record<string, string> = { nA: "nA range (1 mV/nA)", uA: "µA range (1 mV/µA)", mA: "mA range (1 mV/mA)" };

export function RangePicker() {
  const f = useQuantityFields(rangeDefs);
  const c = f.allOk ? compute("range-resolution", { current: f.values.current!, fullScaleVoltage: 3.3, adcBits: 12, adcReference: 3.3 }) : null;
  const best = c ? String(c.bestRange) : "";
  const step = num(c, "currentResolution");
  return (
    <CalculatorCard title="range and ADC code" testId="range-picker">
      <Fields f={f} defs={rangeDefs} />
      {c ? (
        <dl className="mt-4 mb-0" aria-live="polite">
          <Output label="Most sensitive range that does not saturate" value={rangeLabel[best] ?? best} testId="best-range" />
          <Output label="Output voltage" value={formatAuto(num(c, "outputVoltage"), "V")} />
          <Output label="ADC code (12 bit, truncating)" value={String(c.adcCode)} testId="adc-code" />
          <Output label="Current per ADC step on this range" value={formatAuto(step, "A")} />
          <Output label="One step as a share of the reading" value={`${((100 * step) / Math.abs(f.values.current!)).toPrecision(3)} %`} />
        </dl>
      ) : (
        invalid
      )}
    </CalculatorCard>
  );
}

// ---------------------------------------------------------------- duty-cycle calculator with plot
const dutyDefs = {
  sleepCurrent: { label: "Sleep current", unit: "A", initial: "2 uA" },
  activeCurrent: { label: "Active (wake) current", unit: "A", initial: "20 mA" },
  activeTime: { label: "Active time per wake", unit: "s", initial: "10 ms" },
  period: { label: "Wake period", unit: "s", initial: "1 s" },
  batteryCapacity: { label: "Battery capacity", unit: "C", initial: "220 mAh", hint: "mAh is accepted" },
  usableFraction: { label: "Usable fraction of capacity", unit: "", initial: "0.8" },
};

/** Samples of i(t) over three periods (with the edges included) and its running average Q(t)/t. */
function dutyWaveform(sleep: number, active: number, ta: number, period: number) {
  const periods = 3;
  const ts = new Set<number>();
  const n = 600;
  for (let k = 0; k <= n; k++) ts.add((periods * period * k) / n);
  for (let p = 0; p < periods; p++) {
    ts.add(p * period);
    ts.add(p * period + ta);
    ts.add(p * period + ta * 0.5);
  }
  const x = [...ts].filter((t) => t <= periods * period).sort((a, b) => a - b);
  const level = (t: number) => (t - Math.floor(t / period) * period < ta ? active : sleep);
  const current = x.map(level);
  // Running average: integrate the piecewise-constant current exactly between samples.
  const avg: number[] = [];
  let q = 0;
  for (let i = 0; i < x.length; i++) {
    if (i > 0) q += level((x[i - 1] + x[i]) / 2) * (x[i] - x[i - 1]);
    avg.push(i === 0 ? active : q / x[i]);
  }
  return { x, current, avg };
}

export function DutyCycleCalculator() {
  const f = useQuantityFields(dutyDefs);
  const v = f.values;
  const sane = f.allOk && v.activeTime! > 0 && v.period! > v.activeTime! && v.sleepCurrent! > 0 && v.activeCurrent! > 0;
  const c = sane ? compute("duty-cycle", v as Record<string, number>) : null;
  const average = num(c, "averageCurrent");
  const ok = c !== null;
  const { sleepCurrent, activeCurrent, activeTime, period } = v;
  const wave = useMemo(
    () => (ok ? dutyWaveform(sleepCurrent!, activeCurrent!, activeTime!, period!) : null),
    [ok, sleepCurrent, activeCurrent, activeTime, period],
  );
  const series = useMemo(
    () =>
      wave
        ? [
            { label: "current i(t)", values: wave.current, color: "#a4532c" },
            { label: "running average", values: wave.avg, color: "#1f5f8b" },
            { label: "average (grader)", values: wave.x.map(() => average), color: "#46505c", dash: [6, 4] },
          ]
        : [],
    [wave, average],
  );
  const life = num(c, "batteryLife");
  return (
    <CalculatorCard title="duty-cycled load and battery life" testId="duty-cycle-calculator">
      <Fields f={f} defs={dutyDefs} />
      {!sane && f.allOk && <p className="field-error">The active time must be positive and shorter than the period, and both currents above zero.</p>}
      {c && wave ? (
        <>
          <dl className="mt-4 mb-0" aria-live="polite">
            <Output label="Average current" value={formatAuto(average, "A")} testId="average-current" />
            <Output label="Charge per wake" value={formatAuto(num(c, "chargePerWake"), "C")} />
            <Output label="Battery life" value={`${formatText(life, "h")} = ${formatText(life, "d")}`} testId="battery-life" />
          </dl>
          <Plot
            testId="duty-plot"
            x={wave.x}
            series={series}
            xLabel="time (s)"
            yLabel="current (A)"
            yLog
            caption={`Three wake periods on a logarithmic current axis. The running average starts at the wake current and settles towards the time-weighted average of ${formatAuto(average, "A")}, not towards the midpoint of the two levels.`}
          />
        </>
      ) : (
        f.allOk || invalid
      )}
    </CalculatorCard>
  );
}

// ---------------------------------------------------------------- RC step response
const rcDefs = {
  filterResistance: { label: "Filter resistance R", unit: "ohm", initial: "10k" },
  filterCapacitance: { label: "Filter capacitance C", unit: "F", initial: "100 nF" },
  pulseWidth: { label: "Width of a current pulse", unit: "s", initial: "1 ms", hint: "A wake burst, to see how the filter under-reads its peak" },
};

export function RcStepResponse() {
  const f = useQuantityFields(rcDefs);
  const v = f.values;
  const sane = f.allOk && v.filterResistance! > 0 && v.filterCapacitance! > 0 && v.pulseWidth! > 0;
  const c = sane ? compute("filter-noise", { filterResistance: v.filterResistance!, filterCapacitance: v.filterCapacitance!, shuntResistance: 10e3, temperature: 300 }) : null;
  const tau = num(c, "timeConstant");
  const tp = v.pulseWidth ?? NaN;
  const ok = c !== null;
  const data = useMemo(() => {
    if (!ok) return null;
    const end = Math.max(8 * tau, 2 * tp);
    const n = 400;
    const x = Array.from({ length: n + 1 }, (_, i) => (end * i) / n);
    const step = x.map((t) => 1 - Math.exp(-t / tau));
    const pulse = x.map((t) => (t <= tp ? 1 - Math.exp(-t / tau) : (1 - Math.exp(-tp / tau)) * Math.exp(-(t - tp) / tau)));
    const input = x.map((t) => (t <= tp ? 1 : 0));
    return { x: x.map((t) => t * 1e3), step, pulse, input };
  }, [tau, tp, ok]);
  const series = useMemo(
    () =>
      data
        ? [
            { label: "step response", values: data.step, color: "#1f5f8b" },
            { label: "pulse in", values: data.input, color: "#7a828c", dash: [4, 4] },
            { label: "pulse out", values: data.pulse, color: "#a4532c" },
          ]
        : [],
    [data],
  );
  const peak = c ? teaching.pulsePeak({ pulseCurrent: 1, pulseWidth: tp, timeConstant: tau }).peakPercent : NaN;
  return (
    <CalculatorCard title="RC low-pass: step and pulse response" testId="rc-step">
      <Fields f={f} defs={rcDefs} />
      {c && data ? (
        <>
          <dl className="mt-4 mb-0" aria-live="polite">
            <Output label="Time constant τ = RC" value={formatAuto(tau, "s")} testId="time-constant" />
            <Output label="Cut-off frequency" value={formatAuto(num(c, "cutoffFrequency"), "Hz")} />
            <Output label="Settling to 1 %" value={formatAuto(num(c, "settlingTime1pct"), "s")} />
            <Output label="Noise bandwidth" value={formatAuto(num(c, "noiseBandwidth"), "Hz")} />
            <Output label="Peak of the filtered pulse" value={`${peak.toPrecision(4)} % of the true peak`} testId="pulse-peak" />
          </dl>
          <Plot
            testId="rc-plot"
            x={data.x}
            series={series}
            xLabel="time (ms)"
            yLabel="output / final value"
            caption={`Output of the filter for a unit step and for a ${formatAuto(tp, "s")} pulse. With τ = ${formatAuto(tau, "s")} the filtered pulse reaches ${peak.toPrecision(3)} % of its true height, though its area (the charge) is unchanged.`}
          />
        </>
      ) : (
        invalid
      )}
    </CalculatorCard>
  );
}

/** The template's own check first (a reason in words), then its compute. */
function checked(template: string, params: Record<string, number>): { c: Computed | null; problem: string | null } {
  const t = (templates as Record<string, { check(p: Record<string, number>): string | null }>)[template];
  const problem = t.check(params);
  return problem ? { c: null, problem } : { c: compute(template, params), problem: null };
}
const pct = (x: number) => `${x.toPrecision(4)} %`;

// ---------------------------------------------------------------- leakage and guarding
const leakageDefs = {
  sourceVoltage: { label: "Voltage across the insulation V_s", unit: "V", initial: "10 V" },
  insulationResistance: { label: "Insulation resistance R_ins", unit: "ohm", initial: "100 GΩ" },
  measuredCurrent: { label: "Current being measured I", unit: "A", initial: "1 nA" },
  biasCurrent: { label: "Amplifier input bias current I_b", unit: "A", initial: "5 pA" },
  guardVoltage: { label: "Guard's residual voltage V_g", unit: "V", initial: "2 mV", hint: "How closely the guard follows the input (the amplifier's offset)" },
};

export function LeakageGuardCalculator() {
  const f = useQuantityFields(leakageDefs);
  const { c, problem } = f.allOk ? checked("leakage-guard", f.values as Record<string, number>) : { c: null, problem: null };
  return (
    <CalculatorCard title="leakage, bias current and a guard" testId="leakage-calculator">
      <Fields f={f} defs={leakageDefs} />
      {problem && <p className="field-error">Check the inputs: {problem}.</p>}
      {c ? (
        <dl className="mt-4 mb-0" aria-live="polite">
          <Output label="Leakage without a guard" value={formatAuto(num(c, "leakageCurrent"), "A")} testId="leakage-current" />
          <Output label="Leakage error" value={pct(num(c, "leakageErrorPercent"))} />
          <Output label="Bias-current error" value={pct(num(c, "biasErrorPercent"))} />
          <Output label="Total error without a guard" value={pct(num(c, "unguardedErrorPercent"))} testId="unguarded-error" />
          <Output label="Leakage with the guard" value={formatAuto(num(c, "guardedLeakage"), "A")} />
          <Output label="Total error with the guard" value={pct(num(c, "guardedErrorPercent"))} testId="guarded-error" />
        </dl>
      ) : (
        problem || invalid
      )}
    </CalculatorCard>
  );
}

// ---------------------------------------------------------------- offsets, thermoelectric voltages and reversal
const thermalDefs = {
  shuntResistance: { label: "Shunt resistance R", unit: "ohm", initial: "1 mΩ" },
  current: { label: "Current I", unit: "A", initial: "100 mA" },
  offsetVoltage: { label: "Amplifier offset V_os (signed)", unit: "V", initial: "10 uV" },
  seebeckMicrovoltsPerKelvin: { label: "Junction coefficient S, in µV/K", unit: "", initial: "5", hint: "About 0.2 for copper to copper, a few for copper to tin-lead solder" },
  junctionTemperatureDifference: { label: "Temperature difference ΔT", unit: "K", initial: "1 K" },
};

export function ThermalReversalCalculator() {
  const f = useQuantityFields(thermalDefs);
  const { c, problem } = f.allOk ? checked("offset-thermal", f.values as Record<string, number>) : { c: null, problem: null };
  return (
    <CalculatorCard title="offsets, thermoelectric voltage and current reversal" testId="thermal-calculator">
      <Fields f={f} defs={thermalDefs} />
      {problem && <p className="field-error">Check the inputs: {problem}.</p>}
      {c ? (
        <dl className="mt-4 mb-0" aria-live="polite">
          <Output label="Thermoelectric voltage" value={formatAuto(num(c, "thermalEmf"), "V")} />
          <Output label="Apparent current from the offsets" value={formatAuto(num(c, "apparentCurrent"), "A")} testId="apparent-current" />
          <Output label="Error at this current" value={pct(num(c, "offsetErrorPercent"))} />
          <Output label="Reading, current forward" value={formatAuto(num(c, "forwardVoltage"), "V")} />
          <Output label="Reading, current reversed" value={formatAuto(num(c, "reverseVoltage"), "V")} />
          <Output label="Current from half the difference" value={formatAuto(num(c, "reversedCurrent"), "A")} testId="reversed-current" />
        </dl>
      ) : (
        problem || invalid
      )}
    </CalculatorCard>
  );
}

// ---------------------------------------------------------------- sampling short bursts
const burstDefs = {
  sampleRate: { label: "Fast logger's sample rate f_s", unit: "Hz", initial: "1 kHz" },
  burstWidth: { label: "Burst width t_b", unit: "s", initial: "5 ms" },
  requiredSamples: { label: "Samples wanted per burst N", unit: "", initial: "20" },
  wakePeriod: { label: "Wake period T", unit: "s", initial: "1.02 s" },
  logRate: { label: "Slow logger's sample rate f_log", unit: "Hz", initial: "1 Hz" },
  activeCurrent: { label: "Burst current I_a", unit: "A", initial: "20 mA" },
  sleepCurrent: { label: "Sleep current I_s", unit: "A", initial: "2 uA" },
};

/** What the slow logger records: one sample every 1/f_log, high when it lands inside a burst. */
function slowRecord(T: number, tb: number, flog: number, ia: number, is: number, alias: number) {
  const span = alias > 0 ? Math.min(2.5 / alias, 400 / flog) : 60 / flog;
  const n = Math.max(2, Math.min(400, Math.floor(span * flog)));
  const x: number[] = [];
  const y: number[] = [];
  for (let k = 0; k < n; k++) {
    const t = k / flog;
    x.push(t);
    y.push(t - Math.floor(t / T) * T < tb ? ia : is);
  }
  return { x, y };
}

export function BurstSamplingCalculator() {
  const f = useQuantityFields(burstDefs);
  const { c, problem } = f.allOk ? checked("sampling-burst", f.values as Record<string, number>) : { c: null, problem: null };
  const v = f.values;
  const alias = num(c, "apparentWakeFrequency");
  const ok = c !== null;
  const { wakePeriod, burstWidth, logRate, activeCurrent, sleepCurrent } = v;
  const record = useMemo(
    () => (ok ? slowRecord(wakePeriod!, burstWidth!, logRate!, activeCurrent!, sleepCurrent!, alias) : null),
    [ok, wakePeriod, burstWidth, logRate, activeCurrent, sleepCurrent, alias],
  );
  const series = useMemo(() => (record ? [{ label: "slow logger's samples", values: record.y, color: "#a4532c", stepped: true }] : []), [record]);
  return (
    <CalculatorCard title="samples in a burst, and what a slow logger sees" testId="burst-calculator">
      <Fields f={f} defs={burstDefs} />
      {problem && <p className="field-error">Check the inputs: {problem}.</p>}
      {c && record ? (
        <>
          <dl className="mt-4 mb-0" aria-live="polite">
            <Output label="Samples per burst" value={num(c, "samplesPerBurst").toPrecision(4)} testId="samples-per-burst" />
            <Output label="Lowest rate for N samples per burst" value={formatAuto(num(c, "minimumSampleRate"), "Hz")} testId="minimum-rate" />
            <Output label="Apparent wake frequency on the slow logger" value={formatAuto(alias, "Hz")} testId="alias-frequency" />
            <Output label="Worst-case error of the average" value={`${formatAuto(num(c, "worstCaseAverageError"), "A")} (${pct(num(c, "worstCaseErrorPercent"))})`} />
          </dl>
          <Plot
            testId="burst-plot"
            x={record.x}
            series={series}
            xLabel="time (s)"
            yLabel="current (A)"
            yLog
            caption={`The slow logger's record: one sample every ${formatAuto(1 / logRate!, "s")}. A wake every ${formatAuto(wakePeriod!, "s")} ${
              alias > 0 ? `appears to repeat every ${formatAuto(1 / alias, "s")}` : "lands at the same phase every time: the logger sees every wake or none"
            }.`}
          />
        </>
      ) : (
        problem || invalid
      )}
    </CalculatorCard>
  );
}
