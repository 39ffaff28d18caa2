// Decrypting the session cookie on every request. next-auth's own decode derives the cookie's key from
// the secret (HKDF) on each call, a measurable share of a request's CPU under load; this decode derives
// it once per secret and is otherwise next-auth's: the same key, algorithm (dir + A256GCM through jose)
// and clock tolerance. Tokens with a salt (not session cookies) go to next-auth's decode unchanged.
import { createSecretKey, hkdfSync, type KeyObject } from "node:crypto";
import { jwtDecrypt } from "jose";
import { decode as nextAuthDecode, type JWT, type JWTDecodeParams } from "next-auth/jwt";

const keys = new Map<string, KeyObject>();

function sessionKey(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(hkdfSync("sha256", secret, "", "NextAuth.js Generated Encryption Key", 32)));
    keys.set(secret, key);
  }
  return key;
}

export async function decodeSessionToken(params: JWTDecodeParams): Promise<JWT | null> {
  const { token, secret, salt = "" } = params;
  if (!token) return null;
  if (salt || typeof secret !== "string") return nextAuthDecode(params);
  const { payload } = await jwtDecrypt(token, sessionKey(secret), { clockTolerance: 15 });
  return payload as JWT;
}
