// The session cookie's decryption: what next-auth's sign-in writes reads back the same, and a cookie
// sealed with another secret, or altered, reads as no session.
import { encode } from "next-auth/jwt";
import { describe, expect, it } from "vitest";
import { decodeSessionToken } from "@/lib/auth/session-token";

const secret = "a-test-secret-of-reasonable-length-0123456789";

describe("session cookie decryption", () => {
  it("reads back what next-auth's encode wrote, for each of two secrets", async () => {
    for (const s of [secret, `${secret}-other`]) {
      const token = await encode({ token: { sub: "7b0a3e34-3c43-4b8e-9d0e-2f1b6c0a9e11", at: 1764700000123 }, secret: s });
      const payload = await decodeSessionToken({ token, secret: s });
      expect(payload?.sub).toBe("7b0a3e34-3c43-4b8e-9d0e-2f1b6c0a9e11");
      expect(payload?.at).toBe(1764700000123);
      expect(typeof payload?.exp).toBe("number");
    }
  });

  it("refuses a cookie sealed with another secret or altered", async () => {
    const token = await encode({ token: { sub: "someone" }, secret });
    await expect(decodeSessionToken({ token, secret: `${secret}-other` })).rejects.toThrow();
    const parts = token.split(".");
    parts[3] = parts[3].slice(0, -2) + (parts[3].endsWith("AA") ? "BB" : "AA");
    await expect(decodeSessionToken({ token: parts.join("."), secret })).rejects.toThrow();
  });

  it("has no session without a cookie", async () => {
    expect(await decodeSessionToken({ token: undefined, secret })).toBeNull();
  });
});
