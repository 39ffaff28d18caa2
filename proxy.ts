// Runs before every page (not the API, whose fixed headers are in next.config.mjs, nor the build's
// static files): sets the security headers (lib/security/headers.ts) with a fresh script nonce, which
// Next.js reads from the request's policy and puts on its own inline scripts, and sends anonymous
// visitors of the signed-in pages to the sign-in page early. Authorization itself happens on the server in every page, action and route handler
// (lib/auth/access.ts); this is not a security boundary.
import { getToken } from "next-auth/jwt";
import { type NextRequest, NextResponse } from "next/server";
import { newNonce, securityHeaders } from "@/lib/security/headers";

const SIGNED_IN_ONLY = /^\/(?:$|courses(?:\/|$)|lessons(?:\/|$)|account(?:\/|$))/;

export default async function proxy(req: NextRequest) {
  if (SIGNED_IN_ONLY.test(req.nextUrl.pathname) && !(await getToken({ req }))) {
    const to = new URL("/signin", req.nextUrl.origin);
    to.searchParams.set("next", req.nextUrl.pathname + req.nextUrl.search);
    return NextResponse.redirect(to);
  }
  const nonce = newNonce();
  const headers = securityHeaders({
    nonce,
    publicUrl: process.env.NEXTAUTH_URL,
    storageUrl: process.env.S3_PUBLIC_ENDPOINT ?? process.env.S3_ENDPOINT,
    dev: process.env.NODE_ENV === "development",
  });
  const requestHeaders = new Headers(req.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("content-security-policy", headers["Content-Security-Policy"]);
  const res = NextResponse.next({ request: { headers: requestHeaders } });
  for (const [k, v] of Object.entries(headers)) res.headers.set(k, v);
  return res;
}

export const config = {
  matcher: [{ source: "/((?!api/|_next/static|_next/image|favicon.ico).*)" }],
};
