// next-auth configuration: e-mail and password, JWT sessions that carry only the user id.
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { db } from "@/db";
import { findCredentials, sessionsValidAfter } from "@/db/queries/users";
import { isDatabaseUnavailable } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { isHttps } from "@/lib/security/headers";
import { signInSchema } from "@/lib/validation/auth";
import { checkPassword } from "./password";

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 14 * 24 * 3600 },
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
      const raw = (token.at as number | undefined) ?? (token.iat as number | undefined) ?? 0;
      const at = raw < 1e11 ? raw * 1000 : raw; // tokens from before `at` was in milliseconds carry seconds
      let validAfter: Date | null;
      try {
        validAfter = token.sub && uuidSchema.safeParse(token.sub).success ? await sessionsValidAfter(db, token.sub) : null;
      } catch (e) {
        // next-auth turns an error here into "signed out" (401); with the database out of reach the
        // session stays unchecked instead, and the server's currentUser checks it (and answers 503)
        if (!isDatabaseUnavailable(e)) throw e;
        return { expires: session.expires, user: { id: token.sub }, uncheckedSince: at } as typeof session;
      }
      if (validAfter && at < validAfter.getTime()) return { expires: session.expires } as typeof session;
      return { expires: session.expires, user: { id: token.sub } } as typeof session;
    },
  },
};
