"use client";
// Live calculators for the lessons on leakage and guarding, thermoelectric offsets and sampling short
// bursts. Every physical result comes from lib/grader; the shared pieces are in fields.tsx.
import { useMemo } from "react";
import { formatAuto } from "@/lib/lessons/format";
import { CalculatorCard, checked, Fields, invalid, num, Output, pct, useQuantityFields } from "./fields";
import { Plot } from "./Plot";

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

/**
 * Whether the slow record shows every pass of the phase through the burst (PHYSICS.md §16 16e, 16f): each
 * sample moves f_a·T/f_log through the cycle; a burst at least that wide shows once every 1/f_a, a narrower
 * one on average once every T/(t_b·f_log), or never, by phase.
 */
function burstCaption(T: number, tb: number, flog: number, alias: number): string {
  if (!(alias > 0)) return `A wake every ${formatAuto(T, "s")} lands at the same phase every time: the logger sees every wake or none.`;
  const step = (alias * T) / flog;
  return tb >= step
    ? `Each sample moves ${formatAuto(step, "s")} through the wake cycle, less than the burst: a burst shows once every ${formatAuto(1 / alias, "s")}.`
    : `Each sample moves ${formatAuto(step, "s")} through the wake cycle, more than the ${formatAuto(tb, "s")} burst: samples land in a burst on average once every ${formatAuto(T / (tb * flog), "s")}, or never, depending on phase.`;
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
            caption={`The slow logger's record: one sample every ${formatAuto(1 / logRate!, "s")}. ${burstCaption(wakePeriod!, burstWidth!, logRate!, alias)}`}
          />
        </>
      ) : (
        problem || invalid
      )}
    </CalculatorCard>
  );
}
