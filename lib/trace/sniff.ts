// Guessing the separator and the decimal mark from the first lines of a file.
import type { TraceFormat } from "./types";

/**
 * Tab if the lines hold tabs; semicolon if they hold semicolons (then a comma inside a number is a decimal
 * comma); comma otherwise. Papaparse's own guess is not used because "0,5;1,2" has more commas than
 * semicolons.
 */
export function sniffSeparator(head: string): Pick<TraceFormat, "delimiter" | "decimalComma"> {
  const lines = head
    .split(/\r\n|\n|\r/)
    .slice(0, 50)
    .filter((l) => l.trim().length > 0);
  const share = (ch: string) => lines.filter((l) => l.includes(ch)).length / Math.max(1, lines.length);
  if (lines.length > 0 && share("\t") >= 0.5) return { delimiter: "\t", decimalComma: lines.some((l) => /\d,\d/.test(l)) };
  if (lines.length > 0 && share(";") >= 0.5) return { delimiter: ";", decimalComma: lines.some((l) => /\d,\d/.test(l)) };
  return { delimiter: ",", decimalComma: false };
}

/** A cell as a finite number, or null. Empty cells, "NaN", "Infinity" and hex are refused. */
export function parseNumberCell(cell: string | undefined, decimalComma: boolean): number | null {
  if (cell === undefined || cell.length === 0) return null;
  // fast path: a plain decimal number ("0.0012", "-3e-6") that Number reads as it is
  const c0 = cell.charCodeAt(0);
  if (!decimalComma && ((c0 >= 48 && c0 <= 57) || c0 === 45 || c0 === 46)) {
    const c1 = cell.length > 1 ? cell.charCodeAt(1) : 48;
    if (c1 !== 120 && c1 !== 88 && c1 !== 98 && c1 !== 111) {
      const v = Number(cell);
      return Number.isFinite(v) ? v : null;
    }
  }
  let s = cell.trim();
  if (s.length === 0) return null;
  if (decimalComma) s = s.replace(",", ".");
  const c = s.charCodeAt(0);
  // first character must start a decimal number: digit, sign or point
  if (!((c >= 48 && c <= 57) || c === 45 || c === 43 || c === 46)) return null;
  if (s.length > 1 && (s[1] === "x" || s[1] === "X" || s[1] === "b" || s[1] === "o")) return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : null;
}
