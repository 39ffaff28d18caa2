// The circuit a student puts on the simulated bench, from their drawn values of a lab's template (pure).
// Templates whose readings are currents through a load map to a circuit; the others have no simulated bench.
import type { BenchCircuit } from "./types";

type Params = Record<string, number | string>;

/** Supply of a sleeping-and-waking node when its template gives currents only: a 3.3 V rail (a modelling choice). */
export const NODE_SUPPLY_VOLTS = 3.3;

/** Templates the simulated bench can put on the bench. */
export const SIMULATED_TEMPLATES = ["shunt-burden", "duty-cycle", "sampling-burst", "range-resolution"] as const;

export function hasSimulatedBench(templateKey: string): boolean {
  return (SIMULATED_TEMPLATES as readonly string[]).includes(templateKey);
}

const num = (p: Params, key: string) => {
  const v = p[key];
  return typeof v === "number" && Number.isFinite(v) ? v : NaN;
};

/** A load drawing `sleep` amperes that wakes to `active` for `width` every `period` from a 3.3 V rail. */
function node(sleep: number, active: number, width: number, period: number): BenchCircuit {
  const vs = NODE_SUPPLY_VOLTS;
  // the first wake a quarter period into the bench's clock, so a run started at 0 opens asleep
  return { supplyVoltage: vs, loadResistance: vs / sleep, burst: { loadResistance: vs / active, width, period, delay: period / 4 } };
}

/**
 * The bench circuit for a template's parameters: the load that draws the template's current from its supply
 * when no meter is in the loop. Undefined for a template without one, or values that make no circuit.
 */
export function circuitFor(templateKey: string, p: Params): BenchCircuit | undefined {
  let c: BenchCircuit | undefined;
  switch (templateKey) {
    case "shunt-burden":
      c = { supplyVoltage: num(p, "supplyVoltage"), loadResistance: num(p, "loadResistance") };
      break;
    case "range-resolution": {
      const i = Math.abs(num(p, "current"));
      c = { supplyVoltage: NODE_SUPPLY_VOLTS, loadResistance: NODE_SUPPLY_VOLTS / i };
      break;
    }
    case "duty-cycle":
      c = node(num(p, "sleepCurrent"), num(p, "activeCurrent"), num(p, "activeTime"), num(p, "period"));
      break;
    case "sampling-burst":
      c = node(num(p, "sleepCurrent"), num(p, "activeCurrent"), num(p, "burstWidth"), num(p, "wakePeriod"));
      break;
  }
  if (!c) return undefined;
  const finite = [c.supplyVoltage, c.loadResistance, c.burst?.loadResistance ?? 1, c.burst?.width ?? 1, c.burst?.period ?? 1];
  return finite.every((v) => Number.isFinite(v) && v > 0) ? c : undefined;
}
