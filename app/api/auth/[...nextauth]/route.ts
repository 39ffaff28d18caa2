import NextAuth from "next-auth";
import { NextResponse } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { clientAddress, forgive, giveBack, type LimitName, takeTry, TooManyRequests } from "@/lib/security/throttle";

const nextAuth = NextAuth(authOptions);

/** next-auth's answers (the session, the CSRF token, sign-in) depend on the caller: never cached. */
async function handler(req: Request, ctx: { params: Promise<{ nextauth: string[] }> }): Promise<Response> {
  const res: Response = await nextAuth(req, ctx);
  try {
    res.headers.set("cache-control", "no-store");
    return res;
  } catch {
    const headers = new Headers(res.headers);
    headers.set("cache-control", "no-store");
    return new Response(res.body, { status: res.status, statusText: res.statusText, headers });
  }
}

/** A sign-in answer for a throttled caller: 429 with Retry-After, in the shape next-auth's client reads. */
function throttled(req: Request, e: TooManyRequests): Response {
  const url = new URL("/signin", req.url);
  url.searchParams.set("error", "TooManyRequests");
  return NextResponse.json(
    { url: url.toString(), ...e.toJSON() },
    { status: 429, headers: { "retry-after": String(e.retryAfterSeconds) } },
  );
}

// Every sign-in try takes a point from its e-mail's counter (whether or not an account has it) and from
// its address's before the password is checked, atomically, so tries sent in parallel are counted as
// they arrive (30 at once: at most 10 are checked). Once either counter is used up every try waits, even
// with the right password, so a guesser is slowed the same way for every address. A successful sign-in
// gives its address's point back and clears its e-mail's failures: a class signing in and out all day is
// never locked out by its own successes.
async function POST(req: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") !== "callback/credentials") return handler(req, ctx);
  const form = await req.clone().formData().catch(() => null);
  const email = form?.get("email");
  const counters: [LimitName, string | null][] = [
    ["signInAccount", typeof email === "string" ? email.trim().slice(0, 254) : null],
    ["signInAddress", clientAddress(req.headers)],
  ];
  try {
    await takeTry(counters);
  } catch (e) {
    if (e instanceof TooManyRequests) return throttled(req, e);
    throw e;
  }
  const res = await handler(req, ctx);
  const signedIn = (res.headers.get("set-cookie") ?? "").includes("session-token=");
  if (signedIn) await Promise.all([forgive("signInAccount", counters[0][1]), giveBack([counters[1]])]);
  return res;
}

export { handler as GET, POST };
