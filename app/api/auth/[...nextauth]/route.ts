import NextAuth from "next-auth";
import { NextResponse } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { clientAddress, countFailure, forgive, type LimitName, refuseIfUsedUp, TooManyRequests } from "@/lib/security/throttle";

const handler = NextAuth(authOptions);

/** A sign-in answer for a throttled caller: 429 with Retry-After, in the shape next-auth's client reads. */
function throttled(req: Request, e: TooManyRequests): Response {
  const url = new URL("/signin", req.url);
  url.searchParams.set("error", "TooManyRequests");
  return NextResponse.json(
    { url: url.toString(), ...e.toJSON() },
    { status: 429, headers: { "retry-after": String(e.retryAfterSeconds) } },
  );
}

// Failed sign-ins count per e-mail (whether or not an account has it) and per address; once either
// counter is used up every try waits, even with the right password, so a guesser is slowed the same way
// for every address. A successful sign-in clears its e-mail's failures: a class signing in and out all
// day is never locked out by its own successes.
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
    await refuseIfUsedUp(counters);
  } catch (e) {
    if (e instanceof TooManyRequests) return throttled(req, e);
    throw e;
  }
  const res = await handler(req, ctx);
  const signedIn = (res.headers.get("set-cookie") ?? "").includes("session-token=");
  if (signedIn) await forgive("signInAccount", counters[0][1]);
  else await countFailure(counters);
  return res;
}

export { handler as GET, POST };
