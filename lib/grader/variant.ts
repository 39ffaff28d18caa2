// Each student's circuit: drawn from the lab's parameter spec with a seed such as `${labId}:${studentId}`.
import { z } from "zod";
import type { ParamValue, ParameterSpec, Params, SeriesName, Template, TemplateKey } from "./types";
import { SERIES_NAMES, nearestStandard } from "./eseries";
import { seededRandom } from "./rng";
import { TEMPLATE_KEYS, templates } from "./templates";

const seriesSchema = z.enum(SERIES_NAMES as [SeriesName, ...SeriesName[]]);
const valueSchema = z.union([z.number(), z.string()]);
const resistorFields = {
  /** resistor parameters: the series drawn values are snapped to (default E24) */
  series: seriesSchema.optional(),
  /** resistor parameters: the parts' tolerance, used for bench bands */
  tolerancePercent: z.number().min(0).max(50).optional(),
};

export const parameterDrawSchema = z.discriminatedUnion("mode", [
  z.object({ mode: z.literal("fixed"), value: valueSchema, ...resistorFields }),
  z
    .object({ mode: z.literal("range"), min: z.number(), max: z.number(), step: z.number().positive().optional(), ...resistorFields })
    .refine((d) => d.min <= d.max, { message: "min must not exceed max" }),
  z.object({ mode: z.literal("list"), values: z.array(valueSchema).min(1), ...resistorFields }),
]);

export const variantSpecSchema = z.object({
  template: z.enum(TEMPLATE_KEYS as [TemplateKey, ...TemplateKey[]]),
  parameters: z.record(z.string(), parameterDrawSchema),
});

export type ParameterDraw = z.infer<typeof parameterDrawSchema>;
export type VariantSpec = z.infer<typeof variantSpecSchema>;

/** A lab spec that draws the template's suggested ranges (resistors from E24, ±1 %), other parameters fixed at their defaults. */
export function defaultVariantSpec(templateKey: TemplateKey): VariantSpec {
  const parameters: Record<string, ParameterDraw> = {};
  for (const p of templates[templateKey].parameters) {
    if (p.suggestedRange) {
      const [min, max] = p.suggestedRange;
      parameters[p.key] = p.kind === "resistor" ? { mode: "range", min, max, series: "E24", tolerancePercent: 1 } : { mode: "range", min, max };
    } else {
      parameters[p.key] = p.kind === "resistor" ? { mode: "fixed", value: p.default, tolerancePercent: 1 } : { mode: "fixed", value: p.default };
    }
  }
  return { template: templateKey, parameters };
}

/** Component tolerances (percent) named in a spec, for GradePolicy.componentTolerances. */
export function componentTolerancesFromSpec(spec: VariantSpec): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [k, d] of Object.entries(spec.parameters)) if (d.tolerancePercent !== undefined) out[k] = d.tolerancePercent;
  return out;
}

const DISPLAY_FACTOR: Record<string, number> = { mAh: 3.6, Ah: 3600, h: 3600, d: 86400, min: 60 };

function round3(x: number): number {
  return Number(x.toPrecision(3));
}

function uniform(rng: () => number, min: number, max: number, logScale: boolean): number {
  const u = rng();
  return logScale ? min * (max / min) ** u : min + (max - min) * u;
}

function drawOne(p: ParameterSpec, d: ParameterDraw | undefined, rng: () => number): ParamValue {
  if (!d) return p.default;
  if (d.mode === "fixed") return d.value;
  if (d.mode === "list") return d.values[Math.min(d.values.length - 1, Math.floor(rng() * d.values.length))];
  if (p.kind === "category") return p.default;
  const { min, max } = d;
  if (d.step !== undefined || p.kind === "integer") {
    const step = d.step ?? 1;
    const first = p.kind === "integer" ? Math.ceil(min / step) * step : min;
    const n = Math.floor((max - first) / step + 1e-9);
    const k = Math.min(n, Math.floor(rng() * (n + 1)));
    const v = Number((first + k * step).toPrecision(12));
    return p.kind === "integer" ? Math.round(v) : v;
  }
  const logScale = min > 0 && max / min >= 10;
  const x = uniform(rng, min, max, logScale);
  if (p.kind === "resistor") {
    const series: SeriesName = d.series ?? "E24";
    let r = nearestStandard(x, series, "nearest");
    if (r > max * (1 + 1e-9)) r = nearestStandard(max, series, "floor");
    if (r < min * (1 - 1e-9)) r = nearestStandard(min, series, "ceil");
    return r >= min * (1 - 1e-9) && r <= max * (1 + 1e-9) ? r : NaN;
  }
  // round to 3 significant figures in the unit the student sees (mAh, h) when it is not an SI prefix
  const factor = DISPLAY_FACTOR[p.displayUnit] ?? 1;
  const r = round3(x / factor) * factor;
  return r >= min && r <= max ? r : x;
}

/** True when the template can compute these parameters: its own check passes and every number is finite. */
export function isComputable(t: Template, params: Params): boolean {
  if (t.check(params) !== null) return false;
  const values = t.compute(params);
  return t.quantities.every((q) => (q.kind === "number" ? Number.isFinite(values[q.key] as number) : values[q.key] !== ""));
}

const MAX_TRIES = 200;

/**
 * The parameters of one student's circuit. Deterministic in (spec, seed). Range draws are log-uniform when
 * the range spans a factor of 10 or more (uniform otherwise) and rounded to 3 significant figures; resistors
 * are snapped to their series (nearest in ratio) and kept within [min, max]. A draw the template cannot
 * compute is redrawn from the same stream. Throws when 200 draws all fail (the spec cannot work).
 */
export function drawVariant(spec: VariantSpec, seed: string): Params {
  const t = templates[spec.template];
  if (!t) throw new Error(`Unknown template "${String(spec.template)}"`);
  const rng = seededRandom(`${spec.template}|${seed}`);
  let last = "";
  for (let i = 0; i < MAX_TRIES; i++) {
    const params: Params = {};
    for (const p of t.parameters) params[p.key] = drawOne(p, spec.parameters[p.key], rng);
    if (isComputable(t, params)) return params;
    last = t.check(params) ?? "a quantity could not be computed";
  }
  throw new Error(`This lab's parameter ranges never give a circuit that can be computed (${last}).`);
}
