// JSON calls from the course-administration forms. One function, so that switching to the shared API
// client is a one-line change.
export async function sendJson<T>(method: string, url: string, body?: unknown): Promise<{ ok: true; data: T } | { ok: false; message: string; fields?: Record<string, string[]> }> {
  const res = await fetch(url, {
    method,
    headers: body === undefined ? undefined : { "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const data = (await res.json().catch(() => null)) as (T & { error?: { message?: string; fields?: Record<string, string[]> } }) | null;
  if (res.ok) return { ok: true, data: data as T };
  return { ok: false, message: data?.error?.message ?? `The server answered ${res.status}.`, fields: data?.error?.fields };
}
