// How a typed reading is read, exactly as the grader will read it, and the form's checks built on it:
// the attempt's zod schema (the one the route handler parses with) plus a check per field that its text
// reads. They need the grader's units library and zod (most of the lab page's JavaScript), so the
// submission form loads this module when one of its fields is first focused or the form is submitted
// (use-quantity-reader.ts), not with the page.
import { zodResolver } from "@hookform/resolvers/zod";
import type { Resolver } from "react-hook-form";
import type { z } from "zod";
import { formatQuantity } from "@/lib/grader/format";
import { parseQuantity } from "@/lib/grader/units";
import { attemptInputSchema } from "@/lib/validation/attempts";
import type { Echo, FormMeasured, FormQuestion } from "./form-helpers";

const UNIT_SYMBOL: Record<string, string> = { ohm: "Ω" };

/** Display units that are not an SI prefix of the unit itself (h, d, mAh, °C): worth a second reading. */
function isOwnDisplayUnit(displayUnit: string, unit: string): boolean {
  if (!displayUnit || !unit) return false;
  const symbol = UNIT_SYMBOL[unit] ?? unit;
  return !displayUnit.endsWith(symbol);
}

/**
 * How a typed value is read, exactly as the grader will read it: "9.1 uA" → "9.10 µA". A value in a
 * display unit of its own (battery life in hours) is shown in it: "10.0 h", "220 mAh (= 792 C)".
 */
export function echoReading(text: string, unit: string, displayUnit = ""): Echo {
  if (text.trim() === "") return { status: "empty" };
  const r = parseQuantity(text, unit);
  if (!r.ok) return r.reason === "empty" ? { status: "empty" } : { status: "error", message: r.message };
  const si = formatQuantity(r.value, unit);
  let readAs = si;
  if (isOwnDisplayUnit(displayUnit, unit)) {
    // Hours for a battery life, mAh for a capacity: the unit the handout uses, with SI beside it when short.
    readAs = formatQuantity(r.value, unit, { displayUnit });
    if (!/e/.test(si) && si !== readAs) readAs = `${readAs} (= ${si})`;
  }
  return { status: "ok", value: r.value, readAs };
}

/** One client-side check per field: a number question with text that does not read is refused before sending. */
export function readingProblems(questions: FormQuestion[], readings: Record<string, string | undefined | null>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const q of questions) {
    const text = readings[q.id] ?? "";
    if (q.answerKind === "category") {
      if (text && q.choices && !q.choices.includes(text)) out[q.id] = `Choose one of: ${q.choices.join(", ")}.`;
      continue;
    }
    const echo = echoReading(text, q.unit, q.displayUnit);
    if (echo.status === "error") out[q.id] = echo.message;
  }
  return out;
}

export function measuredProblems(components: FormMeasured[], measured: Record<string, string | undefined | null>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const c of components) {
    const echo = echoReading(measured[c.key] ?? "", c.unit, c.displayUnit);
    if (echo.status === "error") out[c.key] = echo.message;
    else if (echo.status === "ok" && !(echo.value > 0)) out[c.key] = "A measured value must be greater than zero.";
  }
  return out;
}

/** The form's values: every field as typed (the schema trims nothing; toPayload does before sending). */
export type SubmissionValues = { idempotencyKey: string; readings: Record<string, string>; measured: Record<string, string>; uploadIds: string[] };

/**
 * The submission form's resolver: the attempt's schema, shared with POST /api/labs/{labId}/attempts, and
 * on top of it the same reading of each answer the grader does, so that text with the wrong kind of unit
 * is named under its field before anything is sent.
 */
export function submissionResolver(questions: FormQuestion[], components: FormMeasured[]): Resolver<SubmissionValues, unknown, z.output<typeof attemptInputSchema>> {
  const schema = attemptInputSchema.superRefine((v, ctx) => {
    const readings = Object.fromEntries(Object.entries(v.readings).map(([k, t]) => [k, t ?? ""]));
    for (const [qid, msg] of Object.entries(readingProblems(questions, readings))) ctx.addIssue({ code: "custom", path: ["readings", qid], message: msg });
    const measured = Object.fromEntries(Object.entries(v.measured ?? {}).map(([k, t]) => [k, t ?? ""]));
    for (const [key, msg] of Object.entries(measuredProblems(components, measured))) ctx.addIssue({ code: "custom", path: ["measured", key], message: msg });
  });
  return zodResolver(schema) as never;
}
