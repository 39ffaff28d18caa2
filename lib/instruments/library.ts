// The built-in instrument profiles: Shuntwise's own designs, each a generic, typical member of its class
// and none modelled on a product. A course starts with the teaching meter and may copy any of them.
import type { InstrumentProfile, InstrumentRange, LibraryInstrument } from "./profile";

// ---------------------------------------------------------------------------------------------------
// The course teaching meter: a shunt per range, one amplifier of gain 50, a 14-bit converter on a 2.5 V
// reference whose full scale is the analogue output's full scale, a 1.25 V mid-scale offset for currents
// both ways, auto-ranging with hysteresis and a 159 Hz low-pass on the output (10 kΩ, 100 nF).

export const TEACHING_METER_KEY = "teaching-meter";
export const TEACHING_REFERENCE_VOLTS = 2.5;
export const TEACHING_BITS = 14;
export const TEACHING_GAIN = 50;
export const TEACHING_OFFSET_VOLTS = 1.25;
/** a first-order low-pass of 10 kΩ and 100 nF: 1 / (2π × 10 kΩ × 100 nF) = 159.2 Hz */
export const TEACHING_FILTER_HZ = 159.2;

const converter = { bits: TEACHING_BITS, referenceVolts: TEACHING_REFERENCE_VOLTS } as const;

function teachingRange(key: string, label: string, fullScale: number, shuntOhms: number, percentOfReading: number, counts: number): InstrumentRange {
  return {
    key,
    label,
    fullScale,
    shuntOhms,
    sensitivity: shuntOhms * TEACHING_GAIN,
    resolution: { ...converter },
    accuracy: { percentOfReading, counts },
    filterCutoffHz: TEACHING_FILTER_HZ,
    settlingSeconds: 0.005,
  };
}

export const teachingMeter: LibraryInstrument = {
  libraryKey: TEACHING_METER_KEY,
  name: "Teaching meter",
  kind: "sampling-meter",
  description:
    "The course's own sampling meter: a shunt per range, an amplifier of gain 50 and a 14-bit converter on a 2.5 V reference, with an analogue output of 2.5 V at full scale on every range.",
  ranges: [
    // sensitivity = shunt × 50; full-scale output = sensitivity × full scale = 2.5 V on every range
    teachingRange("r5u", "5 µA", 5e-6, 10e3, 0.5, 4),
    teachingRange("r500u", "500 µA", 500e-6, 100, 0.25, 2),
    teachingRange("r50m", "50 mA", 50e-3, 1, 0.25, 2),
    teachingRange("r1", "1 A", 1, 0.05, 0.5, 2),
  ],
  autoRange: { upAtFractionOfFullScale: 0.9, downAtFractionOfFullScale: 0.008, settlingSeconds: 0.005 },
  offset: { volts: TEACHING_OFFSET_VOLTS },
};

// ---------------------------------------------------------------------------------------------------
// A handheld multimeter of 6000 counts: a stated burden per range; its 10 A range shows 1000 counts.

function handheld(key: string, label: string, fullScale: number, burden: number, percentOfReading: number, counts: number, steps = 6000): InstrumentRange {
  return { key, label, fullScale, burdenAtFullScale: burden, resolution: { counts: steps }, accuracy: { percentOfReading, counts }, settlingSeconds: 0.5 };
}

export const handheldMultimeter: LibraryInstrument = {
  libraryKey: "handheld-multimeter",
  name: "Handheld multimeter",
  kind: "multimeter",
  description: "A 6000-count handheld multimeter with a stated burden voltage at full scale on each current range.",
  ranges: [
    handheld("r600u", "600 µA", 600e-6, 0.09, 1.0, 3),
    handheld("r6m", "6 mA", 6e-3, 0.09, 1.0, 3),
    handheld("r60m", "60 mA", 60e-3, 0.15, 1.2, 3),
    handheld("r600m", "600 mA", 600e-3, 0.6, 1.2, 3),
    handheld("r10", "10 A", 10, 0.5, 2.0, 5, 1000),
  ],
  autoRange: { upAtFractionOfFullScale: 0.99, downAtFractionOfFullScale: 0.05, settlingSeconds: 0.5 },
};

// ---------------------------------------------------------------------------------------------------
// A bench multimeter of 200 000 counts with known shunts.

function bench(key: string, label: string, fullScale: number, shuntOhms: number, percentOfReading: number, percentOfRange: number): InstrumentRange {
  return { key, label, fullScale, shuntOhms, resolution: { counts: 200_000 }, accuracy: { percentOfReading, percentOfRange }, settlingSeconds: 0.2 };
}

export const benchMultimeter: LibraryInstrument = {
  libraryKey: "bench-multimeter",
  name: "Bench multimeter",
  kind: "multimeter",
  description: "A 200 000-count bench multimeter whose current ranges use known shunts.",
  ranges: [
    bench("r200u", "200 µA", 200e-6, 500, 0.05, 0.005),
    bench("r2m", "2 mA", 2e-3, 50, 0.05, 0.005),
    bench("r20m", "20 mA", 20e-3, 5, 0.05, 0.005),
    bench("r200m", "200 mA", 200e-3, 0.5, 0.05, 0.005),
    bench("r2", "2 A", 2, 0.1, 0.1, 0.01),
  ],
  autoRange: { upAtFractionOfFullScale: 0.99, downAtFractionOfFullScale: 0.09, settlingSeconds: 0.2 },
};

// ---------------------------------------------------------------------------------------------------
// A feedback ammeter: a virtual-ground input, a feedback resistor per range giving 2 V at full scale, a
// 20 000-count display and a residual burden of 200 µV.

function feedback(key: string, label: string, fullScale: number, percentOfReading: number, counts: number, settlingSeconds: number, filterCutoffHz?: number): InstrumentRange {
  return {
    key,
    label,
    fullScale,
    feedbackOhms: 2 / fullScale,
    burdenAtFullScale: 200e-6,
    resolution: { counts: 20_000 },
    accuracy: { percentOfReading, counts },
    settlingSeconds,
    ...(filterCutoffHz !== undefined ? { filterCutoffHz } : {}),
  };
}

export const feedbackAmmeter: LibraryInstrument = {
  libraryKey: "feedback-ammeter",
  name: "Feedback ammeter",
  kind: "feedback-ammeter",
  description: "A feedback (transimpedance) ammeter: the input is held at virtual ground and a feedback resistor per range turns the current into 2 V at full scale.",
  ranges: [
    feedback("r2n", "2 nA", 2e-9, 0.5, 10, 1, 10),
    feedback("r20n", "20 nA", 20e-9, 0.3, 5, 0.3, 30),
    feedback("r200n", "200 nA", 200e-9, 0.2, 5, 0.1),
    feedback("r2u", "2 µA", 2e-6, 0.2, 5, 0.05),
    feedback("r20u", "20 µA", 20e-6, 0.2, 5, 0.05),
    feedback("r200u", "200 µA", 200e-6, 0.1, 5, 0.05),
    feedback("r2m", "2 mA", 2e-3, 0.1, 5, 0.05),
  ],
  autoRange: { upAtFractionOfFullScale: 0.99, downAtFractionOfFullScale: 0.09, settlingSeconds: 0.3 },
};

export const LIBRARY: readonly LibraryInstrument[] = [teachingMeter, handheldMultimeter, benchMultimeter, feedbackAmmeter];

export function libraryInstrument(key: string): LibraryInstrument | undefined {
  return LIBRARY.find((i) => i.libraryKey === key);
}

/** A deep copy without the library key: what a course stores when it copies a built-in profile. */
export function copyOfLibrary(key: string): InstrumentProfile | undefined {
  const i = libraryInstrument(key);
  if (!i) return undefined;
  const profile: InstrumentProfile & { libraryKey?: string } = structuredClone(i);
  delete profile.libraryKey;
  return profile;
}
