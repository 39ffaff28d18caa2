// The student's circuit on the simulated bench: the supply, the load and the meter in series, with the values
// drawn for them and the input resistance of the selected range (its burden).
import type { BenchCircuit } from "@/lib/simulation";
import { si } from "./format";

export function BenchCircuitDiagram({ circuit, meterOhms, rangeLabel }: { circuit: BenchCircuit; meterOhms: number; rangeLabel: string }) {
  const b = circuit.burst;
  const text = `A ${si(circuit.supplyVoltage, "V")} supply drives a ${si(circuit.loadResistance, "Ω")} load${
    b ? ` (${si(b.loadResistance, "Ω")} while it wakes, for ${si(b.width, "s")} every ${si(b.period, "s")})` : ""
  } through the meter, which puts ${si(meterOhms, "Ω")} in series on its ${rangeLabel} range.`;
  return (
    <figure className="m-0">
      <svg viewBox="0 0 320 150" className="h-auto w-full max-w-md" role="img" aria-label={text}>
        <g fill="none" stroke="currentColor" strokeWidth="2">
          {/* loop */}
          <path d="M40 40 H140 M190 40 H280 V110 H222 M178 110 H40 V95 M40 55 V40" />
          {/* supply */}
          <circle cx="40" cy="75" r="20" />
          {/* load resistor */}
          <path d="M140 40 l5 -8 l10 16 l10 -16 l10 16 l10 -16 l5 8" />
          {/* meter */}
          <circle cx="200" cy="110" r="22" className="text-copper" stroke="currentColor" />
        </g>
        <g fill="currentColor" fontSize="11" fontFamily="inherit">
          <text x="34" y="72">+</text>
          <text x="35" y="88">−</text>
          <text x="6" y="134">{si(circuit.supplyVoltage, "V")}</text>
          <text x="140" y="24">{si(circuit.loadResistance, "Ω")}{b ? ` / ${si(b.loadResistance, "Ω")}` : ""}</text>
          <text x="193" y="115" fontWeight="bold">A</text>
          <text x="160" y="146">{si(meterOhms, "Ω")} in series</text>
        </g>
      </svg>
      <figcaption className="text-xs text-ink-soft">{text}</figcaption>
    </figure>
  );
}
