// Where to go after signing in: only ever a path on this site. `?next=` comes from the address bar, so
// `//evil.example`, `/\evil.example` (browsers read a backslash as a slash), `https://…`, control
// characters and anything that resolves to another origin fall back to the home page.
const BASE = "http://shuntwise.invalid";

export function safeNext(next: string | null | undefined, fallback = "/"): string {
  if (typeof next !== "string" || !next.startsWith("/") || next.length > 2000) return fallback;
  if (/[\\\u0000-\u001f\u007f]/.test(next)) return fallback;
  if (next.startsWith("//")) return fallback;
  let url: URL;
  try {
    url = new URL(next, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE) return fallback;
  // `/.//evil.example` resolves to the path `//evil.example`: the result itself must pass, so that cleaning
  // it again changes nothing (the page cleans once and the form uses the result as it is)
  const clean = url.pathname + url.search + url.hash;
  if (clean.startsWith("//") || /[\\\u0000-\u001f\u007f]/.test(clean)) return fallback;
  return clean;
}
