// next-auth configuration: e-mail and password, JWT sessions that carry only the user id.
import type { NextAuthOptions } from "next-auth";
import type { JWT } from "next-auth/jwt";
import CredentialsProvider from "next-auth/providers/credentials";
import { db } from "@/db";
import { findCredentials, findSessionUser, type PublicUser } from "@/db/queries/users";
import { uuidSchema } from "@/lib/validation/common";
import { isHttps } from "@/lib/security/headers";
import { signInSchema } from "@/lib/validation/auth";
import { checkPassword } from "./password";
import { decodeSessionToken } from "./session-token";

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 14 * 24 * 3600 },
  jwt: { decode: decodeSessionToken },
  // `Secure` cookies (and the __Secure- prefix) whenever the public address is https.
  useSecureCookies: isHttps(process.env.NEXTAUTH_URL),
  pages: { signIn: "/signin", error: "/signin" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(raw) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        const found = await findCredentials(db, parsed.data.email);
        const ok = await checkPassword(found?.passwordHash, parsed.data.password);
        if (!found || !ok) return null;
        return { id: found.id };
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
      // `at`: when this sign-in happened. next-auth renews `iat` whenever it re-issues the cookie, so the
      // sign-in time travels separately; sessions signed in before a password reset are refused below.
      // milliseconds, so that a sign-in just after a revocation (in the same second) still counts
      const at = user ? Date.now() : ((token.at as number | undefined) ?? (token.iat as number | undefined));
      if (user) token.sub = user.id;
      // Nothing else goes into the token: names, roles and the admin flag are read fresh on each request.
      return { sub: token.sub, at, iat: token.iat, exp: token.exp, jti: token.jti };
    },
    async session({ session, token }) {
      // next-auth's own /api/auth/session; the app's pages and routes read the cookie through currentUser
      // (lib/auth/access.ts), with the same rule
      const user = await sessionUser(token);
      return (user ? { expires: session.expires, user: { id: user.id } } : { expires: session.expires }) as typeof session;
    },
  },
};

/** When the token's holder signed in, in milliseconds (tokens from before `at` was in milliseconds carry seconds). */
function signedInAt(token: JWT): number {
  const raw = (token.at as number | undefined) ?? (token.iat as number | undefined) ?? 0;
  return raw < 1e11 ? raw * 1000 : raw;
}

/**
 * The user a session token names, read with one query, or null: no token, no such user, or a session
 * signed in before the user's `sessions_valid_after` (signed out everywhere, a new password). A database
 * out of reach throws (a route answers 503), it never reads as "signed out".
 */
export async function sessionUser(token: JWT | null): Promise<PublicUser | null> {
  const id = token?.sub;
  if (!token || !id || !uuidSchema.safeParse(id).success) return null;
  const found = await findSessionUser(db, id);
  if (!found) return null;
  const { sessionsValidAfter, ...user } = found;
  if (sessionsValidAfter && signedInAt(token) < sessionsValidAfter.getTime()) return null;
  return user;
}
