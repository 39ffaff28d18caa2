// The widgets a lesson's MDX may use, passed to the compiled lesson as its `components` prop (so the
// lessons need no import lines and the same map serves the page and the rendering tests).
import type { ComponentPropsWithoutRef } from "react";
import type { MDXComponents } from "mdx/types";
import { childrenText, headingId } from "@/lib/lessons/toc";
import { Caution } from "./Caution";
import { CheckYourself } from "./CheckYourself";
import { CircuitDiagram } from "./diagrams";
import { Eq } from "./Eq";
import { V } from "./Value";
import { BudgetTable } from "./BudgetTable";
import { LazyCalculator, type CalculatorName } from "./lazy-calculators";
import { LessonBench } from "@/components/labs/bench/lesson-bench";

function H2(props: ComponentPropsWithoutRef<"h2">) {
  return <h2 id={headingId(childrenText(props.children))} className="mt-10 mb-3 scroll-mt-6 text-2xl break-after-avoid" {...props} />;
}

// A Markdown table (remark-gfm): scrolls on its own at 390 px instead of widening the page.
function Table(props: ComponentPropsWithoutRef<"table">) {
  return (
    <div className="my-4 overflow-x-auto">
      <table className="min-w-full border-collapse text-sm [&_td]:border-t [&_td]:border-ink/15 [&_td]:px-2 [&_td]:py-1 [&_th]:px-2 [&_th]:py-1 [&_th]:text-left" {...props} />
    </div>
  );
}

// The calculators load in the browser when the reader reaches one (lazy-calculators.tsx), so the units
// library and the templates they need stay out of a lesson's first load.
const calculator = (name: CalculatorName) => {
  const Calculator = () => <LazyCalculator name={name} />;
  Calculator.displayName = name;
  return Calculator;
};

export const lessonComponents: MDXComponents = {
  h2: H2,
  table: Table,
  Caution,
  CheckYourself,
  CircuitDiagram,
  Eq,
  V,
  BurdenExplorer: calculator("BurdenExplorer"),
  ShuntPicker: calculator("ShuntPicker"),
  RangePicker: calculator("RangePicker"),
  DutyCycleCalculator: calculator("DutyCycleCalculator"),
  RcStepResponse: calculator("RcStepResponse"),
  LeakageGuardCalculator: calculator("LeakageGuardCalculator"),
  ThermalReversalCalculator: calculator("ThermalReversalCalculator"),
  BurstSamplingCalculator: calculator("BurstSamplingCalculator"),
  BudgetTable,
  LessonBench,
};
