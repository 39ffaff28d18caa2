// The browser's one client for the app's JSON API. Every route answers success with JSON and failure
// with `{ error: { code, message, fields? } }` (lib/api.ts); `api()` returns the first and throws the
// second as an `ApiError`, so components never parse responses themselves. Use it as the `queryFn` or
// `mutationFn` of @tanstack/react-query (the provider is components/providers/query-provider.tsx):
//
//   const attempt = useQuery({ queryKey: ["attempt", id], queryFn: ({ signal }) => api<{ attempt: A }>(`/api/attempts/${id}`, { signal }) });
//   const save = useMutation({ mutationFn: (body: Plan) => api(`/api/courses/${id}/lessons`, { method: "PUT", body }) });
//
// No React and no server-only imports: the unit tests run it against a stubbed `fetch`.
import type { ErrorCode, FieldErrors } from "@/lib/errors";

export type { FieldErrors };

/** What a route handler sends on failure, inside `{ error: … }`. */
export interface ApiErrorBody {
  code: ErrorCode;
  message: string;
  fields?: FieldErrors;
}

/** What the server said about a failure, each part only if it said it. */
export interface ApiErrorDetail {
  code?: string;
  message?: string;
  fields?: FieldErrors;
}

/**
 * A failed request. `status` is the HTTP status, or 0 when no answer arrived (offline, server down,
 * aborted). `code` is the server's code, "network" for no answer, or "bad_response" for an answer that
 * was not the API's JSON (a proxy's error page). `serverMessage` is the server's own words, when it sent
 * some; `message` always holds something a person can read.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ErrorCode | "network" | "bad_response";
  readonly fields?: FieldErrors;
  readonly serverMessage?: string;

  constructor(status: number, code: ApiError["code"], message: string, opts: { fields?: FieldErrors; serverMessage?: string } = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = opts.fields;
    this.serverMessage = opts.serverMessage;
  }

  /** The parts the server itself sent (empty when it sent none), for messages that fall back by status. */
  get detail(): ApiErrorDetail {
    return this.serverMessage === undefined && !this.fields ? {} : { code: this.code, message: this.serverMessage, fields: this.fields };
  }
}

export const isApiError = (e: unknown): e is ApiError => e instanceof ApiError;

/** Reads `{ error: { code, message, fields } }` out of any parsed body; null when it is not that shape. */
export function errorBody(body: unknown): ApiErrorBody | null {
  if (!body || typeof body !== "object" || !("error" in body)) return null;
  const e = (body as { error: unknown }).error;
  if (!e || typeof e !== "object") return null;
  const { code, message, fields } = e as Partial<ApiErrorBody>;
  return {
    code: (typeof code === "string" ? code : "bad_request") as ErrorCode,
    message: typeof message === "string" ? message : "",
    ...(fields && typeof fields === "object" ? { fields } : {}),
  };
}

/** The error for a finished request that failed (also used by the upload, which goes through XMLHttpRequest). */
export function toApiError(status: number, body: unknown): ApiError {
  if (status <= 0) return new ApiError(0, "network", "The server could not be reached.");
  const e = errorBody(body);
  if (!e) return new ApiError(status, "bad_response", `The request failed (HTTP ${status}).`);
  return new ApiError(status, e.code, e.message || `The request failed (HTTP ${status}).`, {
    fields: e.fields,
    serverMessage: e.message || undefined,
  });
}

export interface ApiOptions {
  method?: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  /** sent as JSON */
  body?: unknown;
  signal?: AbortSignal;
}

/** One JSON request to the app's API: resolves with the parsed body of a 2xx, throws an `ApiError` otherwise. */
export async function api<T = unknown>(url: string, { method = "GET", body, signal }: ApiOptions = {}): Promise<T> {
  const headers: Record<string, string> = { accept: "application/json" };
  if (body !== undefined) headers["content-type"] = "application/json";
  let res: Response;
  try {
    res = await fetch(url, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), cache: "no-store", signal });
  } catch (e) {
    if (signal?.aborted) throw e; // react-query cancelled it; let it see its own abort
    throw toApiError(0, null);
  }
  const text = await res.text().catch(() => "");
  let parsed: unknown = null;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = undefined;
    }
  }
  if (!res.ok) throw toApiError(res.status, parsed);
  if (parsed === undefined) throw new ApiError(res.status, "bad_response", `The answer was not JSON (HTTP ${res.status}).`);
  return parsed as T;
}

/** A server value as it arrives through JSON: dates become ISO strings, undefined members drop out. */
export type Jsonified<T> = T extends Date
  ? string
  : T extends readonly unknown[]
    ? { [K in keyof T]: Jsonified<T[K]> }
    : T extends object
      ? { [K in keyof T]: Jsonified<T[K]> }
      : T;

/** The value exactly as the API would send it, for a server page that hands a client view what the API returns. */
export function asJson<T>(value: T): Jsonified<T> {
  return JSON.parse(JSON.stringify(value)) as Jsonified<T>;
}
