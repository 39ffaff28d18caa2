// What the feedback view receives: the attempt exactly as GET /api/attempts/{id} returns it (the page
// builds it on the server with the same presentAttempt and hands it over), its siblings from
// GET /api/labs/{labId}/attempts, and its files from GET /api/uploads/{id}.
import type { Jsonified } from "@/lib/http/client";
import type { PresentedAttempt } from "@/lib/labs/attempts";

export type AttemptView = Jsonified<PresentedAttempt>;
export type HistoryItem = { id: string; number: number; score: number; maxScore: number; submittedAt: string; studentId?: string; results: { verdict: string }[] };
export type UploadView = { id: string; kind: "image" | "trace"; contentType: string; size: number; originalName?: string; url?: string; analysis: unknown; zoomable?: boolean };

/** The sentence for a failed load, by the status the API answered with (0: no answer). */
export function loadMessage(status: number, what: string): string {
  if (status === 0) return `Could not reach the server to load ${what}. Check your connection and reload the page.`;
  if (status === 401) return "Your session has ended. Sign in again to see this feedback.";
  if (status === 404) return `${what[0].toUpperCase()}${what.slice(1)} was not found, or it is not yours to see.`;
  return `Could not load ${what} (HTTP ${status}).`;
}

export function loadError(e: unknown, what: string): string {
  const status = e && typeof e === "object" && "status" in e && typeof e.status === "number" ? e.status : 0;
  return loadMessage(status, what);
}
