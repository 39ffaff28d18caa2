// Instruments for the simulated bench's checks: each is a profile of the shared shape with round numbers
// chosen for the check (not the course's meters, which lib/instruments/library.ts holds).
import type { SimInstrument } from "@/lib/simulation";

/** A handheld-style multimeter: 2000 counts, burden 200 mV at full scale on each range. */
export const countsMeter: SimInstrument = {
  name: "check multimeter",
  kind: "multimeter",
  ranges: [
    { key: "r2u", label: "2 µA", fullScale: 2e-6, burdenAtFullScale: 0.2, resolution: { counts: 2000 }, accuracy: { percentOfReading: 0.5, counts: 2 } },
    { key: "r2m", label: "2 mA", fullScale: 2e-3, burdenAtFullScale: 0.2, resolution: { counts: 2000 }, accuracy: { percentOfReading: 0.5, counts: 2 } },
  ],
};

/**
 * A sampling meter whose one step is about the thermal noise it reads: a 1 kΩ shunt, a 16-bit converter on a
 * 2.5 V reference and 76 294 V/A, so one step is 2.5 V / 65 536 / 76 294 V/A = 0.5000 nA; the filter 10 Hz.
 */
export const fineSamplingMeter: SimInstrument = {
  name: "check sampling meter",
  kind: "sampling-meter",
  ranges: [
    {
      key: "r30u", label: "30 µA", fullScale: 2.5 / 76294, shuntOhms: 1000, sensitivity: 76294,
      resolution: { bits: 16, referenceVolts: 2.5 }, accuracy: { percentOfReading: 0.2, counts: 1 }, filterCutoffHz: 10,
    },
  ],
};

/** A 24-bit sampling meter with no offset error, for settling: steps far below what the check resolves. */
export const settlingMeter: SimInstrument = {
  name: "check settling meter",
  kind: "sampling-meter",
  ranges: [
    { key: "r10m", label: "10 mA", fullScale: 10e-3, shuntOhms: 1000, sensitivity: 250, resolution: { bits: 24, referenceVolts: 2.5 }, accuracy: { percentOfReading: 0.1 }, filterCutoffHz: 10 },
  ],
};

/**
 * Three ranges 1000 apart with a converter, 12 bits on 3.3 V and 3.3 V at full scale: the generic meter of
 * PHYSICS.md §3 (its check values are common practice there), auto-ranging up at 0.90 of full scale and down
 * at 0.80 of the next more sensitive range's full scale, which is 0.0008 of the present range's full scale
 * (ranges 1000 apart; the profile states both fractions of the present range), a feedback design so the
 * burden does not move the current.
 */
export const autoMeter: SimInstrument = {
  name: "check auto-ranging meter",
  kind: "feedback-ammeter",
  ranges: [
    { key: "n", label: "3.3 µA", fullScale: 3.3e-6, feedbackOhms: 1e6, sensitivity: 1e6, resolution: { bits: 12, referenceVolts: 3.3 }, accuracy: { percentOfReading: 0.5 }, filterCutoffHz: 10 },
    { key: "u", label: "3.3 mA", fullScale: 3.3e-3, feedbackOhms: 1e3, sensitivity: 1e3, resolution: { bits: 12, referenceVolts: 3.3 }, accuracy: { percentOfReading: 0.5 }, filterCutoffHz: 10 },
    { key: "m", label: "3.3 A", fullScale: 3.3, feedbackOhms: 1, sensitivity: 1, resolution: { bits: 12, referenceVolts: 3.3 }, accuracy: { percentOfReading: 0.5 }, filterCutoffHz: 10 },
  ],
  autoRange: { upAtFractionOfFullScale: 0.9, downAtFractionOfFullScale: 0.0008, settlingSeconds: 0.2 },
};

/** A fast logger for bursts: 10 mA full scale, 4000 counts, no filter (the amplifier's own bandwidth). */
export const loggerMeter: SimInstrument = {
  name: "check logger",
  kind: "multimeter",
  ranges: [{ key: "r40m", label: "40 mA", fullScale: 40e-3, shuntOhms: 1, resolution: { counts: 4000 }, accuracy: { percentOfReading: 1, counts: 3 } }],
};

/** A feedback ammeter with a 1 GΩ feedback resistor and 20 000 counts on 2 nA: one step is 0.1 pA. */
export const feedbackMeter: SimInstrument = {
  name: "check feedback ammeter",
  kind: "feedback-ammeter",
  ranges: [{ key: "r2n", label: "2 nA", fullScale: 2e-9, feedbackOhms: 1e9, resolution: { counts: 20000 }, accuracy: { percentOfReading: 1, counts: 5 }, filterCutoffHz: 1 }],
};
