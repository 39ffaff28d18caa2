// The lab builder's form state: every value with a unit is kept as the text the instructor typed
// ("4.7 kΩ", "1.8 V"), and read with the grader's parseQuantity when the form is checked.
import type { BenchMode, ShowExpected } from "@/db/types";
import type { TemplateKey } from "@/lib/grader";
import type { Jsonified } from "@/lib/http/client";
import type { LabData } from "@/lib/validation/labs";

export type DrawMode = "fixed" | "range" | "list";

export interface DrawForm {
  mode: DrawMode;
  /** fixed: the value with its unit, or the chosen option of a category */
  value: string;
  min: string;
  max: string;
  /** optional step of a range */
  step: string;
  /** list: values with units separated by semicolons or new lines; for a category, the chosen options joined by ";" */
  values: string;
  /** resistors only: "" or a series name */
  series: string;
  /** resistors only: percent, "" when not given */
  tolerancePercent: string;
}

export interface QuestionForm {
  id?: string;
  quantity: string;
  kind: "prediction" | "bench";
  points: string;
  /** "" uses the lab's default tolerance */
  tolerancePercent: string;
}

export interface BuilderForm {
  title: string;
  templateKey: TemplateKey;
  parameters: Record<string, DrawForm>;
  questions: QuestionForm[];
  /** policy.relativeTolerance × 100 */
  defaultTolerancePercent: string;
  /** policy.closeCredit × 100 */
  closeCreditPercent: string;
  /** policy.instrumentAccuracyPercent, "" when not given */
  instrumentAccuracyPercent: string;
  attemptsAllowed: string;
  counting: "best" | "last";
  /** datetime-local text ("2026-12-10T09:00") in the browser's time zone, or "" */
  opensAt: string;
  dueAt: string;
  /** late attempts accepted until then; "" for the default close */
  closesAt: string;
  latePenaltyPercentPerDay: string;
  lateFloorPercent: string;
  showExpected: ShowExpected;
  /** where students take their readings */
  bench: BenchMode;
  instructions: string;
  safetyNotes: string;
}

/** The parts of a lab the builder does not show but must keep (componentTolerances, closeMultiple). */
export interface KeptPolicy {
  closeMultiple?: number;
  componentTolerances?: Record<string, number>;
}

/** A stored lab as the builder receives it: the lab schema's output as JSON (labAsInput's shape, dates as ISO strings). */
export type StoredLabInput = Omit<Jsonified<LabData>, "closesAt" | "bench"> & { closesAt?: string | null; bench?: LabData["bench"] };

