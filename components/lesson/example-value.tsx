// <V ex="burden-node" q="indicatedCurrent" unit="mA" /> (ExampleValue, named V in the lessons: mdx.tsx) prints a number of a lesson example, computed
// through lib/grader at render time (server). `p="supplyVoltage"` prints an input instead.
import { exampleNumber } from "@/lib/lessons/compute";
import { formatText } from "@/lib/lessons/format";

export function ExampleValue({ ex, q, p, unit = "", sig, trim }: { ex: string; q?: string; p?: string; unit?: string; sig?: number; trim?: boolean }) {
  const ref = q ? `q.${q}` : `p.${p}`;
  const value = exampleNumber(ex, ref);
  const text =
    typeof value === "number"
      ? formatText(Math.abs(value) < 1e-30 ? 0 : value, unit, { sig, trim: trim ?? Boolean(p) })
      : value === "uA"
        ? "µA"
        : value;
  return (
    <span className="whitespace-nowrap font-medium tabular-nums" data-example={ex} data-ref={ref}>
      {text}
    </span>
  );
}
