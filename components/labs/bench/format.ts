// How the simulated bench's display writes a current: in the unit of its range, with as many decimals as one
// step of the range resolves (a display shows its counts, not more).
import type { InstrumentRange } from "@/lib/instruments/profile";
import { stepOf } from "@/lib/simulation/model";

const PREFIXES: [number, string][] = [
  [1, "A"],
  [1e-3, "mA"],
  [1e-6, "µA"],
  [1e-9, "nA"],
  [1e-12, "pA"],
];

/** The unit a range shows its readings in: the largest prefix whose unit is at most the full scale. */
export function unitOf(fullScale: number): [number, string] {
  return PREFIXES.find(([scale]) => fullScale >= scale) ?? PREFIXES[PREFIXES.length - 1];
}

/** The display's text for a reading on a range: "363.64 µA", or "OL" for an overload. */
export function displayText(value: number | null, range: InstrumentRange): { digits: string; unit: string } {
  const [scale, unit] = unitOf(range.fullScale);
  if (value === null) return { digits: "OL", unit };
  const decimals = Math.min(6, Math.max(0, Math.ceil(-Math.log10(stepOf(range) / scale) - 1e-9)));
  return { digits: (value / scale).toFixed(decimals), unit };
}

/** A value with an SI prefix and 4 significant figures, for the diagram ("3.300 V", "1.000 kΩ"). */
export function si(value: number, unit: string): string {
  const steps: [number, string][] = [
    [1e9, "G"],
    [1e6, "M"],
    [1e3, "k"],
    [1, ""],
    [1e-3, "m"],
    [1e-6, "µ"],
    [1e-9, "n"],
    [1e-12, "p"],
  ];
  const a = Math.abs(value);
  const [scale, prefix] = steps.find(([s]) => a >= s) ?? steps[steps.length - 1];
  return `${Number((value / scale).toPrecision(4))} ${prefix}${unit}`;
}
