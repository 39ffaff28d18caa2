"use client";
// Live calculators for lessons 1-10. Every physical result comes from lib/grader (templates[…].compute,
// nearestStandard); this file only reads inputs, lays out results and draws plots. The calculators of the
// newer lessons are in calculators-depth.tsx; what both share is in fields.tsx.
import { useMemo, useState } from "react";
import { nearestStandard, RANGES } from "@/lib/grader";
import { TEACHING_BITS, TEACHING_REFERENCE_VOLTS } from "@/lib/instruments/library";
import { formatAuto, formatText } from "@/lib/lessons/format";
import { teaching } from "@/lib/lessons/teaching";
import { CalculatorCard, compute, Fields, invalid, num, Output, useQuantityFields } from "./fields";
import { Plot } from "./Plot";

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
const rangeDefs = { current: { label: "Current to measure", unit: "A", initial: "500 nA", hint: "e.g. 500 nA, 2 mA, 0.6e-3 A" } };
/** the teaching meter's ranges with their sensitivities, e.g. "500 µA range (5 mV/µA)" */
const rangeLabel: Record<string, string> = Object.fromEntries(RANGES.map((r) => [r.name, `${r.name} range (${r.shown})`]));
const meter = { fullScaleVoltage: TEACHING_REFERENCE_VOLTS, adcBits: TEACHING_BITS, adcReference: TEACHING_REFERENCE_VOLTS };

export function RangePicker() {
  const f = useQuantityFields(rangeDefs);
  const c = f.allOk ? compute("range-resolution", { current: f.values.current!, ...meter }) : null;
  const best = c ? String(c.bestRange) : "";
  const step = num(c, "currentResolution");
  return (
    <CalculatorCard title="range and ADC code" testId="range-picker">
      <Fields f={f} defs={rangeDefs} />
      {c ? (
        <dl className="mt-4 mb-0" aria-live="polite">
          <Output label="Most sensitive range that does not saturate" value={rangeLabel[best] ?? best} testId="best-range" />
          <Output label="Output voltage" value={formatAuto(num(c, "outputVoltage"), "V")} />
          <Output label={`ADC code (${TEACHING_BITS} bit, truncating)`} value={String(c.adcCode)} testId="adc-code" />
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
