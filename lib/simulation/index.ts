// The simulated bench (pure: no next, react, database or network imports; runs in the browser and on the server).
export type { BenchCircuit, ReadingRun, SimInstrument, SimRange, SimReading } from "./types";
export {
  BENCH_TEMPERATURE, DISPLAY_RATE_HZ, OPEN_LOOP_GAIN, UNFILTERED_CUTOFF_HZ,
  accuracyBound, cutoffOf, inputResistance, loadedCurrent, noiseBandwidthOf, senseResistance, sensitivityOf, steadyCurrent,
  stepOf, thermalNoiseCurrent, timeConstantOf,
} from "./model";
export { autoRangeStep, benchSeed, filteredCurrent, fixedErrors, quantise, readingRun, simulateReadings, switchTimeConstant } from "./simulate";
export { NODE_SUPPLY_VOLTS, SIMULATED_TEMPLATES, circuitFor, hasSimulatedBench } from "./circuits";
