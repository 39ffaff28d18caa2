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
import { BurdenExplorer, DutyCycleCalculator, RangePicker, RcStepResponse, ShuntPicker } from "./calculators";
import { BurstSamplingCalculator, LeakageGuardCalculator, ThermalReversalCalculator } from "./calculators-depth";

function H2(props: ComponentPropsWithoutRef<"h2">) {
  return <h2 id={headingId(childrenText(props.children))} className="mt-10 mb-3 scroll-mt-6 text-2xl break-after-avoid" {...props} />;
}

export const lessonComponents: MDXComponents = {
  h2: H2,
  Caution,
  CheckYourself,
  CircuitDiagram,
  Eq,
  V,
  BurdenExplorer,
  ShuntPicker,
  RangePicker,
  DutyCycleCalculator,
  RcStepResponse,
  LeakageGuardCalculator,
  ThermalReversalCalculator,
  BurstSamplingCalculator,
  BudgetTable,
};
