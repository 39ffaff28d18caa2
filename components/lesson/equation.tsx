// <Eq ex="burden-node" tex="I = \frac{[[p.supplyVoltage|V]]}{…} = [[q.indicatedCurrent|mA]]" />
// A worked line with the example's numbers filled in from lib/grader, typeset by KaTeX on the server.
// Server component only: KaTeX must never reach the browser.
import katex from "katex";
import { exampleNumber } from "@/lib/lessons/compute";
import { formatTex } from "@/lib/lessons/format";

export function fillTex(ex: string, tex: string): string {
  return tex.replace(/\[\[([pq]\.[A-Za-z0-9]+)(?:\|([^|\]]*))?(?:\|(\d+|t))?\]\]/g, (_, ref: string, unit = "", sig?: string) => {
    const value = exampleNumber(ex, ref);
    if (typeof value !== "number") return `\\text{${value === "uA" ? "µA" : value}}`;
    const trim = sig === "t" || (sig === undefined && ref.startsWith("p."));
    return formatTex(Math.abs(value) < 1e-30 ? 0 : value, unit, { sig: sig && sig !== "t" ? Number(sig) : undefined, trim });
  });
}

export function Eq({ ex, tex, inline = false }: { ex: string; tex: string; inline?: boolean }) {
  const html = katex.renderToString(fillTex(ex, tex), { displayMode: !inline, throwOnError: true, output: "html", strict: false });
  if (inline) return <span dangerouslySetInnerHTML={{ __html: html }} />;
  return <div className="my-3 overflow-x-auto" dangerouslySetInnerHTML={{ __html: html }} />;
}
