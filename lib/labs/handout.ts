// A student's handout: the lab's instructions and cautions, their own circuit values and the questions.
import "server-only";
import { formatQuantity, templates, type Params } from "@/lib/grader";
import type { Lab } from "./grading";
import { variantFor } from "./attempts";
import { labPublic } from "./view";

export function describeParams(lab: Lab, params: Params) {
  const t = templates[lab.templateKey];
  return t.parameters.map((p) => {
    const value = params[p.key];
    const draw = lab.spec.parameters[p.key];
    return {
      key: p.key,
      label: p.label,
      symbol: p.symbol,
      unit: p.unit,
      displayUnit: p.displayUnit,
      kind: p.kind,
      value,
      shown: typeof value === "number" ? formatQuantity(value, p.unit, { displayUnit: p.displayUnit }) : String(value),
      tolerancePercent: draw?.tolerancePercent,
      series: draw?.series,
    };
  });
}

export function describeQuestions(lab: Lab) {
  const t = templates[lab.templateKey];
  return lab.questions.map((q) => {
    const spec = t.quantities.find((s) => s.key === q.quantity)!;
    return {
      id: q.id,
      quantity: q.quantity,
      label: spec.label,
      description: spec.description,
      symbol: spec.symbol,
      unit: spec.unit,
      displayUnit: spec.displayUnit,
      kind: q.kind,
      answerKind: spec.kind,
      choices: spec.choices,
      points: q.points,
    };
  });
}

export async function handoutFor(lab: Lab, userId: string) {
  const params = await variantFor(lab, userId);
  return handoutFromParams(lab, params);
}

export function handoutFromParams(lab: Lab, params: Params) {
  return {
    lab: labPublic(lab),
    template: { key: lab.templateKey, title: templates[lab.templateKey].title },
    params,
    parameters: describeParams(lab, params),
    questions: describeQuestions(lab),
  };
}
