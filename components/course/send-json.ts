// Course-administration forms call the API through the shared JSON client and show its message and
// field errors in place.
import { api, isApiError, type ApiOptions, type FieldErrors } from "@/lib/http/client";

export async function sendJson<T>(method: NonNullable<ApiOptions["method"]>, url: string, body?: unknown): Promise<{ ok: true; data: T } | { ok: false; message: string; fields?: FieldErrors }> {
  try {
    return { ok: true, data: await api<T>(url, { method, body }) };
  } catch (e) {
    if (isApiError(e)) return { ok: false, message: e.message, fields: e.fields };
    throw e;
  }
}
