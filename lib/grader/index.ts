// Public surface of the grading library. Pure: no framework, database, file-system or network imports.
export type {
  TemplateKey,
  SeriesName,
  ParamValue,
  Params,
  QuantityValue,
  ParameterKind,
  ParameterSpec,
  QuantitySpec,
  MistakeKey,
  MistakeCandidate,
  Template,
} from "./types";
export { templates, TEMPLATE_KEYS, isTemplateKey, defaultParams } from "./templates";
export { parseQuantity, UNIT_DIMENSION, type ParseResult, type Dimension } from "./units";
export { formatQuantity, texQuantity, texNumber, quantityParts, type FormatOptions } from "./format";
export { nearestStandard, seriesValues, isSeriesName, SERIES_NAMES } from "./eseries";
export {
  drawVariant,
  defaultVariantSpec,
  componentTolerancesFromSpec,
  isComputable,
  variantSpecSchema,
  parameterDrawSchema,
  type VariantSpec,
  type ParameterDraw,
} from "./variant";
export {
  gradeAttempt,
  readingProblem,
  questionSchema,
  gradePolicySchema,
  type Question,
  type GradePolicy,
  type GradeInput,
  type GradeResult,
  type QuestionResult,
  type Verdict,
  type Reading,
} from "./grade";
export { MISTAKES, MISTAKE_KEYS, type MistakeInfo } from "./mistakes";
export { graderVersion, BOLTZMANN, ELEMENTARY_CHARGE } from "./constants";
export { seededRandom, hashString } from "./rng";
export { rangeTable, RANGES, type RangeRow } from "./templates/range-resolution";
export {
  uncertaintyBudget,
  rectangularStandardUncertainty,
  quantisationStandardUncertainty,
  chainInputs,
  CONTRIBUTION_KEYS,
  type UncertaintyBudget,
  type BudgetRow,
  type ContributionKey,
} from "./templates/uncertainty";
export { bandWarnings, type BandWarning } from "./warnings";
