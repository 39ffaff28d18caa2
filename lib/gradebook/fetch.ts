// The gradebook's client-side fetch. lib/api-client.ts (issue 9) replaces this one function when it lands.
import type { Gradebook } from "@/db/queries/gradebook";

export async function fetchGradebook(courseId: string): Promise<Gradebook> {
  const res = await fetch(`/api/courses/${courseId}/gradebook`, { headers: { accept: "application/json" }, cache: "no-store" });
  const body = (await res.json().catch(() => null)) as (Gradebook & { error?: { message: string } }) | null;
  if (!res.ok || !body) throw new Error(body?.error?.message ?? `The gradebook could not be loaded (status ${res.status}).`);
  return body;
}
