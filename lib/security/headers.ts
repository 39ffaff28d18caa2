// The security headers every response carries (set by proxy.ts). Pure, so a unit test can read them.
//
// Scripts: a fresh nonce per request with 'strict-dynamic'. Next.js writes inline <script> tags (the
// bootstrap and the React Server Components payload, `self.__next_f.push(...)`) into every page; it puts
// the nonce on them when the request carries this policy, and 'strict-dynamic' lets the scripts it trusts
// load the page's chunks. No 'unsafe-inline' and no 'unsafe-eval' for scripts (development mode alone
// adds 'unsafe-eval', which React's dev tooling needs). Styles keep 'unsafe-inline': KaTeX and React write
// style attributes, which nonces cannot cover, and a style cannot run code.

export interface HeaderOptions {
  nonce: string;
  /** The app's public address (NEXTAUTH_URL); https turns on HSTS and upgrade-insecure-requests. */
  publicUrl?: string;
  /** The object storage's origin: uploaded images are read from it and uploads sent to it through signed URLs. */
  storageUrl?: string;
  dev?: boolean;
}

function origin(url: string | undefined): string | null {
  if (!url) return null;
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

export function isHttps(publicUrl: string | undefined): boolean {
  return origin(publicUrl)?.startsWith("https://") ?? false;
}

export function contentSecurityPolicy(o: HeaderOptions): string {
  const storage = origin(o.storageUrl);
  const directives: [string, ...string[]][] = [
    ["default-src", "'self'"],
    ["script-src", "'self'", `'nonce-${o.nonce}'`, "'strict-dynamic'", ...(o.dev ? ["'unsafe-eval'"] : [])],
    ["style-src", "'self'", "'unsafe-inline'"],
    ["img-src", "'self'", "data:", "blob:", ...(storage ? [storage] : [])],
    ["font-src", "'self'", "data:"],
    // the lab page sends uploads in parts straight to the object storage (signed URLs)
    ["connect-src", "'self'", ...(storage ? [storage] : []), ...(o.dev ? ["ws:"] : [])],
    ["object-src", "'none'"],
    ["base-uri", "'self'"],
    ["form-action", "'self'"],
    ["frame-ancestors", "'none'"],
  ];
  if (isHttps(o.publicUrl)) directives.push(["upgrade-insecure-requests"]);
  return directives.map((d) => d.join(" ")).join("; ");
}

export function securityHeaders(o: HeaderOptions): Record<string, string> {
  return {
    "Content-Security-Policy": contentSecurityPolicy(o),
    "X-Content-Type-Options": "nosniff",
    "Referrer-Policy": "same-origin",
    "X-Frame-Options": "DENY",
    "Cross-Origin-Opener-Policy": "same-origin",
    "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=()",
    ...(isHttps(o.publicUrl) ? { "Strict-Transport-Security": "max-age=31536000; includeSubDomains" } : {}),
  };
}

/** 16 random bytes, base64: a nonce for one response. Web Crypto, so it runs in the proxy too. */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}
