import NextAuth from "next-auth";
import { NextResponse } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { clientAddress, throttle, TooManyRequests } from "@/lib/security/throttle";

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

// Sign-in tries count per e-mail (whether or not an account has it) and per address before the password
// is checked, so a guesser is slowed the same way for every address.
async function POST(req: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") === "callback/credentials") {
    const form = await req.clone().formData().catch(() => null);
    const email = form?.get("email");
    try {
      await throttle([
        ["signInAccount", typeof email === "string" ? email.trim().slice(0, 254) : null],
        ["signInAddress", clientAddress(req.headers)],
      ]);
    } catch (e) {
      if (e instanceof TooManyRequests) return throttled(req, e);
      throw e;
    }
  }
  return handler(req, ctx);
}

export { handler as GET, POST };
