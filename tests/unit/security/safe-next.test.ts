// The post-sign-in redirect stays on the site. Attack strings: the report (`/\evil.example`) and
// the usual open-redirect forms (common practice, no source).
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { safeNext } from "@/lib/auth/safe-next";

describe("safeNext", () => {
  test.each([
    "/\\evil.example",
    "/\\/evil.example",
    "//evil.example",
    "///evil.example",
    "https://evil.example/",
    "javascript:alert(1)",
    "/\t/evil.example",
    "/\n/evil.example",
    "\\\\evil.example",
    "evil.example",
    "/.//evil.example",
    "/a/..//evil.example",
    "/%2e//evil.example",
    "",
  ])("refuses %j", (next) => {
    expect(safeNext(next)).toBe("/");
  });

  test("keeps a path on the site with its query and fragment", () => {
    expect(safeNext("/courses/abc/labs?tab=open#due")).toBe("/courses/abc/labs?tab=open#due");
    expect(safeNext("/labs/1/../2")).toBe("/labs/2");
  });

  test("missing or not a string", () => {
    expect(safeNext(undefined)).toBe("/");
    expect(safeNext(null, "/courses")).toBe("/courses");
  });

  test("one clean-up is final: cleaning the result again changes nothing, and it never leaves the site", () => {
    const piece = fc.constantFrom("/", "//", "\\", ".", "..", "%2e", "%2f", "%5c", "evil.example", "?", "#", "@", ":", "a", "\t", "%09");
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 8 }).map((p) => "/" + p.join("")), (next) => {
        const once = safeNext(next);
        expect(safeNext(once)).toBe(once);
        expect(once.startsWith("/")).toBe(true);
        expect(once.startsWith("//")).toBe(false);
        expect(new URL(once, "http://site.invalid").origin).toBe("http://site.invalid");
      }),
      { numRuns: 2000 },
    );
  });
});
