// The handout's small Markdown renderer (instructions written in the builder): the blocks and inline
// marks it supports, and that typed HTML stays text.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Markdown, parseMarkdown } from "@/components/labs/handout";

const html = (src: string) => renderToStaticMarkup(<Markdown source={src} />);

describe("handout Markdown", () => {
  it("parses paragraphs, headings, lists and code blocks", () => {
    const blocks = parseMarkdown("# Setup\nFirst line\nsecond line\n\n- one\n- two\n  continued\n\n1. a\n2) b\n\n```\nI = V / R\n```\nlast");
    expect(blocks).toEqual([
      { kind: "h", level: 1, text: "Setup" },
      { kind: "p", lines: ["First line", "second line"] },
      { kind: "ul", items: ["one", "two continued"] },
      { kind: "ol", items: ["a", "b"] },
      { kind: "code", text: "I = V / R" },
      { kind: "p", lines: ["last"] },
    ]);
  });

  it("renders bold, italic and code inline", () => {
    expect(html("Keep **the supply off** while *wiring*, then read `I_meas`.")).toBe(
      '<p class="my-2">Keep <strong>the supply off</strong> while <em>wiring</em>, then read <code class="rounded bg-paper-sunk px-1 font-mono text-[0.9em]">I_meas</code>.</p>',
    );
    expect(html("a snake_case_name stays")).toContain("snake_case_name");
  });

  it("headings start below the handout's own", () => {
    expect(html("## Readings")).toMatch(/^<h4/);
  });

  it("never turns typed HTML into markup", () => {
    const out = html('<script>alert(1)</script> and <img src=x onerror="y">');
    expect(out).not.toContain("<script>");
    expect(out).not.toContain("<img");
    expect(out).toContain("&lt;script&gt;");
  });
});
