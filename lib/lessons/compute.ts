// Computes a lesson example through lib/grader (or, for the few teaching helpers the grader lacks,
// through lib/lessons/teaching.ts). Everything the lesson text states numerically passes through here.
import { nearestStandard, templates } from "@/lib/grader";
import { getExample, type Example } from "./examples";
import { teaching } from "./teaching";

export type ExampleValues = { params: Record<string, number | string>; quantities: Record<string, number | string> };

export function computeExample(example: Example): ExampleValues {
  switch (example.kind) {
    case "template": {
      const t = (templates as Record<string, { compute(p: Record<string, number | string>): Record<string, number | string> }>)[example.template];
      if (!t) throw new Error(`lib/grader has no template "${example.template}"`);
      return { params: example.params, quantities: t.compute({ ...example.params }) };
    }
    case "standard": {
      const { value, series, mode } = example.params;
      return { params: example.params, quantities: { value: nearestStandard(value, series, mode) } };
    }
    case "teaching":
      return { params: example.params, quantities: teaching[example.fn]({ ...example.params }) };
  }
}

const cache = new Map<string, ExampleValues>();

export function exampleValues(id: string): ExampleValues {
  let v = cache.get(id);
  if (!v) {
    v = computeExample(getExample(id));
    cache.set(id, v);
  }
  return v;
}

/** One number of an example: `q.name` (a computed quantity) or `p.name` (an input parameter). */
export function exampleNumber(id: string, ref: string): number | string {
  const [kind, name] = ref.split(".");
  const v = exampleValues(id);
  const source = kind === "q" ? v.quantities : kind === "p" ? v.params : undefined;
  if (!source || !(name in source)) throw new Error(`example "${id}" has no ${ref}`);
  return source[name];
}
