// The one error type that crosses layers. Data-access code and guards throw it; route handlers turn it
// into `{ error: { code, message, fields? } }` with the matching status; pages turn it into a redirect,
// a not-found page or a refusal. Anything else is logged and shown only as a generic message.
export type ErrorCode =
  | "bad_request"
  | "unauthorized"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "unsupported_media_type"
  | "too_many_requests"
  | "internal";

const STATUS: Record<ErrorCode, number> = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  too_many_requests: 429,
  internal: 500,
};

export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  constructor(
    public code: ErrorCode,
    message: string,
    public fields?: FieldErrors,
  ) {
    super(message);
    this.name = "AppError";
  }
  get status(): number {
    return STATUS[this.code];
  }
  toJSON() {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}) } };
  }
}

export const unauthorized = (message = "Sign in to continue.") => new AppError("unauthorized", message);
export const forbidden = (message = "Your role in this course does not allow this.") => new AppError("forbidden", message);
export const notFound = (what = "That page") => new AppError("not_found", `${what} was not found.`);
