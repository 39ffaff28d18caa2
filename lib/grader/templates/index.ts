import type { Template, TemplateKey } from "../types";
import { shuntBurden } from "./shunt-burden";
import { shuntSelection } from "./shunt-selection";
import { rangeResolution } from "./range-resolution";
import { dutyCycle } from "./duty-cycle";
import { bidirectionalOffset } from "./bidirectional-offset";
import { filterNoise } from "./filter-noise";
import { uncertainty } from "./uncertainty";
import { leakageGuard } from "./leakage-guard";
import { offsetThermal } from "./offset-thermal";
import { samplingBurst } from "./sampling-burst";

export const templates: Record<TemplateKey, Template> = {
  "shunt-burden": shuntBurden,
  "shunt-selection": shuntSelection,
  "range-resolution": rangeResolution,
  "duty-cycle": dutyCycle,
  "bidirectional-offset": bidirectionalOffset,
  "filter-noise": filterNoise,
  uncertainty,
  "leakage-guard": leakageGuard,
  "offset-thermal": offsetThermal,
  "sampling-burst": samplingBurst,
};

export const TEMPLATE_KEYS = Object.keys(templates) as TemplateKey[];

export function isTemplateKey(k: unknown): k is TemplateKey {
  return typeof k === "string" && Object.prototype.hasOwnProperty.call(templates, k);
}

/** The template's default parameters. */
export function defaultParams(key: TemplateKey): Record<string, number | string> {
  const out: Record<string, number | string> = {};
  for (const p of templates[key].parameters) out[p.key] = p.default;
  return out;
}
