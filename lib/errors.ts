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
  | "internal"
  | "service_unavailable";

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
  service_unavailable: 503,
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

/** 503 with Retry-After: the database is restarting or unreachable; the same request can be sent again. */
export class ServiceUnavailable extends AppError {
  constructor(public retryAfterSeconds = 5) {
    super("service_unavailable", `The server cannot reach its database just now. Try again in ${retryAfterSeconds} seconds; sending the same request again is safe.`);
  }
}

// PostgreSQL codes that mean "the server is going away or not there yet", not "your query is wrong":
// 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now, class 08 connection
// exceptions, 53300 too_many_connections (PostgreSQL manual, Appendix A, error codes).
const PG_UNAVAILABLE = new Set(["57P01", "57P02", "57P03", "08000", "08001", "08003", "08004", "08006", "53300"]);
const NET_UNAVAILABLE = new Set(["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "ENOTFOUND", "EAI_AGAIN", "EHOSTUNREACH"]);
const MESSAGE_UNAVAILABLE = /Connection terminated|terminating connection|timeout exceeded when trying to connect|the database system is (starting up|shutting down|in recovery)|Client has encountered a connection error/i;

/** True when `e` (or an error it wraps) says the database cannot be reached right now. */
export function isDatabaseUnavailable(e: unknown, depth = 0): boolean {
  if (!e || typeof e !== "object" || depth > 4) return false;
  const code = (e as { code?: unknown }).code;
  if (typeof code === "string" && (PG_UNAVAILABLE.has(code) || NET_UNAVAILABLE.has(code))) return true;
  // pg-boss reports a worker's failure as a copy of the error's fields, not an Error
  const message = (e as { message?: unknown }).message;
  if (typeof message === "string" && MESSAGE_UNAVAILABLE.test(message)) return true;
  if (e instanceof AggregateError && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true;
  return isDatabaseUnavailable((e as { cause?: unknown }).cause, depth + 1);
}
