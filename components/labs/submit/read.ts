// Pure helpers of the submission form: the request body, idempotency keys and the messages for server
// and upload errors. No React, so the unit tests run them directly. How a typed reading is read needs
// the units library and lives in read-quantities.ts, which the form loads when a field is first used.
import type { ApiErrorDetail } from "@/lib/http/client";

/** What the form needs to know about one question (a subset of the handout's `questions`). */
export interface FormQuestion {
  id: string;
  label: string;
  unit: string;
  displayUnit: string;
  answerKind: "number" | "category";
  choices?: string[];
  points: number;
}

/** A component whose measured value the student may enter (a subset of the handout's `parameters`). */
export interface FormMeasured {
  key: string;
  label: string;
  unit: string;
  displayUnit: string;
  shown: string;
}

export type Echo = { status: "empty" } | { status: "ok"; value: number; readAs: string } | { status: "error"; message: string };

/** The words a screen reader and a sighted reader get under a field. */
export function echoText(echo: Echo): string {
  if (echo.status === "ok") return `Read as ${echo.readAs}`;
  if (echo.status === "error") return echo.message;
  return "";
}

/** Trimmed text, and null for a blank field (the API's "no answer"). */
export function toPayload(values: Record<string, string | undefined | null>): Record<string, string | null> {
  const out: Record<string, string | null> = {};
  for (const [k, v] of Object.entries(values)) {
    const t = (v ?? "").trim();
    out[k] = t === "" ? null : t;
  }
  return out;
}

/** Only the measured values the student filled in. */
export function measuredPayload(values: Record<string, string | undefined | null>): Record<string, string | null> {
  return Object.fromEntries(Object.entries(toPayload(values)).filter(([, v]) => v !== null));
}

/** A random key for one form: crypto.randomUUID where there is one, else 128 random bits in hex. */
export function newIdempotencyKey(c: Pick<Crypto, "getRandomValues"> & { randomUUID?: () => string } = globalThis.crypto): string {
  if (typeof c.randomUUID === "function") return c.randomUUID();
  const bytes = c.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, "0")).join("");
}

export interface MappedErrors {
  /** react-hook-form paths ("readings.q2", "measured.loadResistance") and their first message */
  fields: { path: string; message: string }[];
  /** errors about the attached files */
  files: string[];
  /** anything that belongs to no field */
  form: string[];
}

/** Spreads a 400's `fields` onto the form's fields; unknown question ids and other keys go to the form message. */
export function mapServerFields(fields: Record<string, string[]> | undefined, known: { readings: string[]; measured: string[] }): MappedErrors {
  const out: MappedErrors = { fields: [], files: [], form: [] };
  for (const [key, messages] of Object.entries(fields ?? {})) {
    const message = messages[0] ?? "Check this value.";
    const [head, ...rest] = key.split(".");
    const sub = rest.join(".");
    if (head === "readings" && known.readings.includes(sub)) out.fields.push({ path: key, message });
    else if (head === "measured" && known.measured.includes(sub)) out.fields.push({ path: key, message });
    else if (head === "uploadIds" || head === "file") out.files.push(message);
    else out.form.push(message);
  }
  return out;
}

/** The message for a failed submission, by status. */
export function submitErrorMessage(status: number, error: ApiErrorDetail): string {
  if (status === 0) return "Your answers did not reach the server. Check your connection and submit again: nothing you typed is lost, and a retry cannot make a second attempt.";
  if (status === 401) return "Your session has ended. Sign in again in another tab, then submit: your answers stay in this form.";
  if (status === 409) return error.message ?? "This lab does not accept an attempt now.";
  if (status === 400) return error.message ?? "Some answers need another look; see the messages under the fields.";
  if (status >= 500) return "The server could not grade this attempt just now. Submit again in a moment: a retry cannot make a second attempt.";
  return error.message ?? `The submission failed (HTTP ${status}).`;
}

/** The message shown under a file field when its upload fails. */
export function uploadErrorMessage(status: number, error: ApiErrorDetail): string {
  if (status === 0) return "The file did not reach the server. Check your connection and choose the file again.";
  if (status === 413) return error.message ?? "That file is too large to upload.";
  if (status === 415) return error.message ?? "That kind of file is not accepted. Attach a PNG or JPEG scope capture, or a CSV trace.";
  if (status === 401) return "Your session has ended. Sign in again, then attach the file.";
  return error.message ?? `The upload failed (HTTP ${status}).`;
}
