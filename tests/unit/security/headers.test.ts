// The header set for an https deployment and for development (the HTTP test covers the running server).
import { describe, expect, test } from "vitest";
import { contentSecurityPolicy, isHttps, securityHeaders } from "@/lib/security/headers";

describe("securityHeaders", () => {
  test("https public address: HSTS and upgrade-insecure-requests", () => {
    const h = securityHeaders({ nonce: "abc", publicUrl: "https://shuntwise.example", storageUrl: "https://files.example/bucket" });
    expect(h["Strict-Transport-Security"]).toMatch(/^max-age=\d{7,}/);
    expect(h["Content-Security-Policy"]).toContain("upgrade-insecure-requests");
    expect(h["Content-Security-Policy"]).toContain("img-src 'self' data: blob: https://files.example;");
    // uploads go to the storage in parts from the page (issue 26)
    expect(h["Content-Security-Policy"]).toContain("connect-src 'self' https://files.example;");
  });

  test("http public address: no HSTS", () => {
    expect(securityHeaders({ nonce: "abc", publicUrl: "http://127.0.0.1:3000" })).not.toHaveProperty("Strict-Transport-Security");
    expect(isHttps(undefined)).toBe(false);
    expect(isHttps("not a url")).toBe(false);
  });

  test("unsafe-eval only in development", () => {
    expect(contentSecurityPolicy({ nonce: "n" })).not.toContain("unsafe-eval");
    expect(contentSecurityPolicy({ nonce: "n", dev: true })).toContain("'unsafe-eval'");
  });
});
