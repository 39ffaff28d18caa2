// Shared types of the grading library. Every number is in SI (A, V, ohm, F, s, Hz, K, C, W) or in
// percent where the unit is "%"; categorical values are strings.

export type TemplateKey =
  | "shunt-burden"
  | "shunt-selection"
  | "range-resolution"
  | "duty-cycle"
  | "bidirectional-offset"
  | "filter-noise"
  | "uncertainty"
  | "leakage-guard"
  | "offset-thermal"
  | "sampling-burst";

export type SeriesName = "E6" | "E12" | "E24" | "E48" | "E96" | "E192";

export type ParamValue = number | string;
export type Params = Record<string, ParamValue>;
export type QuantityValue = number | string;

export type ParameterKind = "number" | "resistor" | "integer" | "category";

export interface ParameterSpec {
  key: string;
  label: string;
  /** LaTeX symbol, e.g. "R_\\mathrm{sh}" */
  symbol: string;
  /** SI unit string that parseQuantity understands ("A", "V", "ohm", "V/A", "F", "s", "Hz", "K", "C", "W", "%", "") */
  unit: string;
  /** what the UI shows, e.g. "mA", "kΩ", "mAh", "h" */
  displayUnit: string;
  kind: ParameterKind;
  default: ParamValue;
  /** sensible bounds for a lab builder's form (SI) */
  min?: number;
  max?: number;
  choices?: string[];
  /** a range that makes a good default lab (used by defaultVariantSpec) */
  suggestedRange?: [number, number];
  description?: string;
}

export interface QuantitySpec {
  key: string;
  label: string;
  symbol: string;
  unit: string;
  displayUnit: string;
  kind: "number" | "category";
  choices?: string[];
  /** one line for students */
  description: string;
  /** a stepped result (a code, a standard value): not propagated through component tolerances */
  discrete?: boolean;
  /**
   * counted on the bench (samples in a burst): a bench answer may be either whole number around the
   * expected value, the floor or the ceiling, as the edges fall
   */
  counted?: boolean;
}

/** A wrong value produced by a recognised wrong method. */
export interface MistakeCandidate {
  key: MistakeKey;
  value: QuantityValue;
  /** one sentence describing exactly what was done wrong for this quantity */
  detail?: string;
  /** a title for this case when the key's general title would misdescribe what the student did */
  title?: string;
}

export type MistakeKey =
  | "prefix-slip"
  | "ignored-burden"
  | "sign-flip"
  | "nearest-not-floor"
  | "wrong-range"
  | "forgot-offset"
  | "unweighted-average"
  | "capacity-units"
  | "omitted-2pi"
  | "cutoff-as-bandwidth"
  | "linear-sum"
  | "no-root-three"
  | "step-not-halved"
  | "forgot-bias"
  | "wrong-guard-node"
  | "offset-wrong-sign"
  | "unhalved-difference"
  | "period-for-burst"
  | "ignored-aliasing"
  | "no-root-n";

export interface Template {
  key: TemplateKey;
  title: string;
  summary: string;
  parameters: ParameterSpec[];
  quantities: QuantitySpec[];
  compute(params: Params): Record<string, QuantityValue>;
  /** null when the circuit can be computed, otherwise a reason in plain words */
  check(params: Params): string | null;
  /** LaTeX worked solution for one quantity, with the given numbers */
  solution(params: Params, quantity: string): string[];
  /** template-specific wrong methods for one quantity (prefix-slip is added by the grader) */
  mistakes(params: Params, quantity: string): MistakeCandidate[];
  /** smallest half-width of an acceptance band (SI) for a value that can be near zero */
  bandFloor?(params: Params, quantity: string, relativeTolerance: number): number;
  /** an extra remark about a particular answer (e.g. a saturated ADC code), or undefined */
  answerNote?(params: Params, quantity: string, answer: number): string | undefined;
  /** a fixed half-width that replaces the relative tolerance (one ADC code), or undefined */
  exactBand?(params: Params, quantity: string): number | undefined;
  /**
   * For a bench quantity worked out from instrument readings (a difference, a ratio): the values read on
   * the bench and the formula from them, so the instrument accuracy is applied to each reading and
   * propagated. Without it, the quantity itself is the reading.
   */
  instrumentReadings?(params: Params, quantity: string): InstrumentReadings | undefined;
  /**
   * The value a student works out on the bench when the parts of the circuit are `actual` but the sum is
   * done with the lab's given (nominal) values, e.g. a reversal (V₊ − V₋)/2R read across the actual shunt
   * and divided by the nominal R. Used to propagate component tolerances; without it the quantity is
   * taken to follow the actual parts (compute(actual)).
   */
  benchValue?(nominal: Params, actual: Params, quantity: string): number | undefined;
}

export interface InstrumentReadings {
  /** the values read, by name (as the solution names them, e.g. "I_meas") */
  values: Record<string, number>;
  /** the quantity from the readings */
  formula(readings: Record<string, number>): number;
}
