import type { z } from "zod";
import { AppError, type FieldErrors } from "@/lib/errors";

/** All issues of a failed parse, grouped by field path ("readings.trueCurrent"), for forms and JSON errors. */
export function fieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_form";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function invalid(error: z.ZodError): AppError {
  const fields = fieldErrors(error);
  const names = Object.keys(fields).filter((k) => k !== "_form");
  const message = names.length
    ? `Check ${names.length === 1 ? "the field" : "the fields"} ${names.map((n) => `"${n}"`).join(", ")}: ${fields[names[0]][0]}`
    : (fields._form?.[0] ?? "The request is not valid.");
  return new AppError("bad_request", message, fields);
}

/**
 * Control characters no text field takes: C0 but tab, line feed and carriage return, DEL and C1 (NUL
 * cannot even be stored in PostgreSQL text, so it must never reach a query).
 */
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;

/** Every field of a parsed JSON value (or form) whose text holds a control character, by path ("questions.0.quantity"). */
export function controlCharacterFields(data: unknown): FieldErrors {
  const out: FieldErrors = {};
  const walk = (v: unknown, at: (string | number)[], depth: number) => {
    if (typeof v === "string") {
      if (CONTROL.test(v)) out[at.length ? at.join(".") : "_form"] = ["Remove the control character (such as NUL) from this text."];
    } else if (v && typeof v === "object" && depth < 20) {
      for (const [k, x] of Object.entries(v)) walk(x, [...at, k], depth + 1);
    }
  };
  walk(data, [], 0);
  return out;
}

/** Throws a 400 AppError naming every field whose text holds a control character. */
export function refuseControlCharacters(data: unknown): void {
  const fields = controlCharacterFields(data);
  const names = Object.keys(fields);
  if (names.length) throw new AppError("bad_request", `Check the field "${names[0]}": it holds a control character (such as NUL), which no text here may contain.`, fields);
}

/** Parses or throws a 400 AppError that names each bad field (a control character in any text is one). */
export function parseOr400<T extends z.ZodType>(schema: T, data: unknown): z.infer<T> {
  refuseControlCharacters(data);
  const r = schema.safeParse(data);
  if (!r.success) throw invalid(r.error);
  return r.data;
}
