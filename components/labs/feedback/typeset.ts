// Worked-solution lines typeset once on the server, so no KaTeX code reaches the browser.
import katex from "katex";

/** Every line's HTML, keyed by its LaTeX. */
export function typeset(lines: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const line of lines) {
    if (out[line] !== undefined) continue;
    out[line] = katex.renderToString(line, { displayMode: true, throwOnError: false, output: "html", strict: false });
  }
  return out;
}
