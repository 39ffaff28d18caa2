// next-auth configuration: e-mail and password, JWT sessions that carry only the user id.
import type { NextAuthOptions } from "next-auth";
import type { JWT } from "next-auth/jwt";
import CredentialsProvider from "next-auth/providers/credentials";
import { db } from "@/db";
import { createSession, findSessionUser } from "@/db/queries/sessions";
import { findCredentials, type PublicUser } from "@/db/queries/users";
import { uuidSchema } from "@/lib/validation/common";
import { isHttps } from "@/lib/security/headers";
import { signInSchema } from "@/lib/validation/auth";
import { checkPassword } from "./password";
import { decodeSessionToken } from "./session-token";
import { cleanUserAgent, sessionLimits } from "./sessions";

/** The sign-in error a disabled account gets (after its password was right); the sign-in page words it. */
export const ACCOUNT_DISABLED = "AccountDisabled";

export const authOptions: NextAuthOptions = {
  // the cookie holds the session's id; the row (lib/auth/sessions.ts) sets the real lifetimes
  session: { strategy: "jwt", maxAge: sessionLimits().absoluteSeconds },
  jwt: { decode: decodeSessionToken },
  // `Secure` cookies (and the __Secure- prefix) whenever the public address is https.
  useSecureCookies: isHttps(process.env.NEXTAUTH_URL),
  pages: { signIn: "/signin", error: "/signin" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(raw, req) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        const found = await findCredentials(db, parsed.data.email);
        const ok = await checkPassword(found?.passwordHash, parsed.data.password);
        if (!found || !ok) return null;
        // said only to someone who knows the password: the account exists and the site admin disabled it
        if (found.disabledAt) throw new Error(ACCOUNT_DISABLED);
        const sid = await createSession(db, found.id, cleanUserAgent(req?.headers?.["user-agent"]), sessionLimits());
        return { id: found.id, sid };
      },
    }),
  ],
  callbacks: {
    // Only ever somewhere on this site: a callbackUrl that is not a URL (next-auth's own check would throw,
    // a 500) or that names another origin goes home.
    async redirect({ url, baseUrl }) {
      try {
        const target = new URL(url, baseUrl);
        return target.origin === new URL(baseUrl).origin ? target.toString() : baseUrl;
      } catch {
        return baseUrl;
      }
    },
    async jwt({ token, user }) {
      // `sid`: the server-side session this cookie stands for (a row of `sessions`, made at sign-in).
      if (user) {
        token.sub = user.id;
        token.sid = (user as { sid?: string }).sid;
      }
      // Nothing else goes into the token: names, roles and the admin flag are read fresh on each request.
      return { sub: token.sub, sid: token.sid, iat: token.iat, exp: token.exp, jti: token.jti };
    },
    async session({ session, token }) {
      // next-auth's own /api/auth/session; the app's pages and routes read the cookie through currentUser
      // (lib/auth/access.ts), with the same rule
      const user = await sessionUser(token);
      return (user ? { expires: session.expires, user: { id: user.id } } : { expires: session.expires }) as typeof session;
    },
  },
};

/** The session a token stands for: its user's id and the session row's id, or null when it names none. */
export function sessionOf(token: JWT | null): { userId: string; sessionId: string } | null {
  const userId = token?.sub;
  const sessionId = token?.sid;
  if (typeof userId !== "string" || typeof sessionId !== "string") return null;
  if (!uuidSchema.safeParse(userId).success || !uuidSchema.safeParse(sessionId).success) return null;
  return { userId, sessionId };
}

/**
 * The user a session token names, read with one statement, or null: no token, a session signed out,
 * past its idle or absolute limit, or a disabled user. A database out of reach throws (a route answers
 * 503), it never reads as "signed out".
 */
export async function sessionUser(token: JWT | null): Promise<PublicUser | null> {
  const s = sessionOf(token);
  if (!s) return null;
  return (await findSessionUser(db, s.sessionId, s.userId, sessionLimits())) ?? null;
}
