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

/** Parses or throws a 400 AppError that names each bad field. */
export function parseOr400<T extends z.ZodType>(schema: T, data: unknown): z.infer<T> {
  const r = schema.safeParse(data);
  if (!r.success) throw invalid(r.error);
  return r.data;
}
