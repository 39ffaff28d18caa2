"use client";
// The lessons' calculators, loaded when the reader comes near one. A calculator needs lib/grader (the
// units library that reads "4k7" or "9.1 uA", the templates, zod), which is most of a lesson's
// JavaScript; a lesson page's first load carries only this small file. Until the code arrives the page
// shows the calculator's frame and title (server-rendered, so nothing jumps); it loads when the frame
// comes within a screen of the viewport, when it takes the focus or the pointer, and before printing.
import { createElement, lazy, Suspense, useEffect, useRef, useState, type ComponentType, type LazyExoticComponent } from "react";

const basic = () => import("./calculators");
const leakageOffsetBurst = () => import("./calculators-leakage-offset-burst");

type Entry = { title: string; testId: string; load: () => Promise<ComponentType> };

// title and testId as the calculator's own CalculatorCard has them, so the frame does not change
const calculators = {
  BurdenExplorer: { title: "burden explorer", testId: "burden-explorer", load: () => basic().then((m) => m.BurdenExplorer) },
  ShuntPicker: { title: "shunt picker", testId: "shunt-picker", load: () => basic().then((m) => m.ShuntPicker) },
  RangePicker: { title: "range and ADC code", testId: "range-picker", load: () => basic().then((m) => m.RangePicker) },
  DutyCycleCalculator: { title: "duty-cycled load and battery life", testId: "duty-cycle-calculator", load: () => basic().then((m) => m.DutyCycleCalculator) },
  RcStepResponse: { title: "RC low-pass: step and pulse response", testId: "rc-step", load: () => basic().then((m) => m.RcStepResponse) },
  LeakageGuardCalculator: { title: "leakage, bias current and a guard", testId: "leakage-calculator", load: () => leakageOffsetBurst().then((m) => m.LeakageGuardCalculator) },
  ThermalReversalCalculator: {
    title: "offsets, thermoelectric voltage and current reversal",
    testId: "thermal-calculator",
    load: () => leakageOffsetBurst().then((m) => m.ThermalReversalCalculator),
  },
  BurstSamplingCalculator: { title: "samples in a burst, and what a slow logger sees", testId: "burst-calculator", load: () => leakageOffsetBurst().then((m) => m.BurstSamplingCalculator) },
} satisfies Record<string, Entry>;

export type CalculatorName = keyof typeof calculators;

// one lazy component per calculator, made once (React.lazy caches the loaded code in it)
const lazyComponents = Object.fromEntries(
  Object.entries(calculators).map(([name, entry]) => [name, lazy(() => (entry as Entry).load().then((C) => ({ default: C })))]),
) as Record<CalculatorName, LazyExoticComponent<ComponentType>>;

export function LazyCalculator({ name }: { name: CalculatorName }) {
  const entry = calculators[name];
  const frame = useRef<HTMLElement>(null);
  const [wanted, setWanted] = useState(false);

  useEffect(() => {
    if (wanted) return;
    const want = () => setWanted(true);
    window.addEventListener("beforeprint", want);
    const el = frame.current;
    let io: IntersectionObserver | null = null;
    if (typeof IntersectionObserver === "undefined") want();
    else if (el) {
      io = new IntersectionObserver((entries) => entries.some((e) => e.isIntersecting) && want(), { rootMargin: "100% 0px" });
      io.observe(el);
    }
    return () => {
      window.removeEventListener("beforeprint", want);
      io?.disconnect();
    };
  }, [wanted]);

  const placeholder = (
    <section
      ref={frame}
      className="card my-6 min-h-64 break-inside-avoid"
      aria-busy="true"
      data-testid={entry.testId}
      data-calculator-pending=""
      onFocus={() => setWanted(true)}
      onPointerEnter={() => setWanted(true)}
    >
      <h3 className="mt-0 mb-3 text-lg">Try it: {entry.title}</h3>
      <p className="text-sm text-ink-soft">The calculator is loading.</p>
    </section>
  );
  if (!wanted) return placeholder;
  return <Suspense fallback={placeholder}>{createElement(lazyComponents[name])}</Suspense>;
}
