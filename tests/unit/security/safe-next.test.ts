// The post-sign-in redirect stays on the site. Attack strings: the report (`/\evil.example`) and
// the usual open-redirect forms (common practice, no source).
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
});
