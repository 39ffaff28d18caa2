// Session lifetimes and the session rows' use cases. A session ends after SHUNTWISE_SESSION_IDLE_HOURS
// without a request (12) and SHUNTWISE_SESSION_MAX_DAYS after sign-in at most (14): OWASP ASVS 4.0.3
// V3.3.2, level 2 (re-authentication at least every 30 days, 12 hours idle or 30 minutes inactivity).
import type { SessionLimits } from "@/db/queries/sessions";

const positive = (raw: string | undefined, fallback: number) => {
  const n = Number(raw);
  return Number.isFinite(n) && n > 0 ? n : fallback;
};

export function sessionLimits(): SessionLimits {
  return {
    idleSeconds: Math.round(positive(process.env.SHUNTWISE_SESSION_IDLE_HOURS, 12) * 3600),
    absoluteSeconds: Math.round(positive(process.env.SHUNTWISE_SESSION_MAX_DAYS, 14) * 24 * 3600),
  };
}

/** The browser's User-Agent as stored beside a session: printable characters, at most 300. */
export function cleanUserAgent(raw: unknown): string | null {
  const text = (Array.isArray(raw) ? raw[0] : raw) as unknown;
  if (typeof text !== "string") return null;
  const clean = text.replace(/[\u0000-\u001f\u007f-\u009f]/g, "").trim().slice(0, 300);
  return clean || null;
}
