// Values as text in the builder: how a stored number is shown in a field, and how a typed field is read
// (exactly as the grader reads a student's answer). Pure.
import { formatQuantity, parseQuantity, type ParameterSpec } from "@/lib/grader";


/** A value as text that reads back exactly ("4.7 kΩ", "1.8 V", "792 mAh", "0.8"). */
export function valueText(value: number | string, p: Pick<ParameterSpec, "unit" | "displayUnit" | "kind">): string {
  if (typeof value === "string") return value;
  if (p.kind === "integer" || p.unit === "") return String(value);
  // Non-prefix display units (mAh, h, °C) are kept; SI-prefixed ones are chosen to suit the value.
  const keepDisplay = ["mAh", "Ah", "h", "d", "min", "°C"].includes(p.displayUnit);
  return formatQuantity(value, p.unit, { digits: 12, trim: true, displayUnit: keepDisplay ? p.displayUnit : undefined });
}

/** How a value is shown back to the instructor: "4.7 kΩ". */
export function readAsText(value: number, p: Pick<ParameterSpec, "unit" | "displayUnit" | "kind">): string {
  if (p.kind === "integer" || p.unit === "") return String(Number(value.toPrecision(12)));
  const keepDisplay = ["mAh", "Ah", "h", "d", "min", "°C"].includes(p.displayUnit);
  return formatQuantity(value, p.unit, { digits: 6, trim: true, displayUnit: keepDisplay ? p.displayUnit : undefined });
}

export type ReadResult = { ok: true; value: number } | { ok: false; message: string };

/** Reads one typed value for a parameter, as the grader reads units; integers must be whole. */
export function readValue(text: string, p: Pick<ParameterSpec, "unit" | "kind" | "label">): ReadResult {
  const r = parseQuantity(text, p.unit);
  if (!r.ok) return { ok: false, message: r.reason === "empty" ? "Enter a value." : r.message };
  if (p.kind === "integer" && !Number.isInteger(r.value)) return { ok: false, message: "Enter a whole number." };
  return { ok: true, value: r.value };
}

/** Splits a list typed as "1 kΩ; 2.2 kΩ" or one value per line. Commas are left alone: "9,1 mA" is a decimal comma. */
export function splitList(text: string): string[] {
  return text
    .split(/[;\n]/)
    .map((s) => s.trim())
    .filter((s) => s !== "");
}

/** A percent typed as "1", "1 %" or "0,5". NaN when it is not a number. */
export function readPercent(text: string): number {
  const t = text.trim().replace(/\s*%$/, "").replace(",", ".");
  if (t === "") return NaN;
  return Number(t);
}

export function readNumber(text: string): number {
  const t = text.trim().replace(",", ".");
  return t === "" ? NaN : Number(t);
}
