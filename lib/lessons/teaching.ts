// A few teaching calculations that lib/grader has no template for (auto-range thresholds, the peak of a
// filtered pulse, shot noise, the wrong "unweighted" mean shown as a misconception). Kept tiny and
// tested against lib/grader/PHYSICS.md; if the grader grows these, the lessons should call it instead.

/** Elementary charge, exact (SI 2019). */
const q = 1.602176634e-19;

export const teaching = {
  /** Up/down thresholds between two ranges (PHYSICS.md §3): both referred to the more sensitive range. */
  autorange(p: Record<string, number>) {
    const { upFraction, downFraction, fullScaleVoltage, sensitivityLow, sensitivityHigh, adcBits } = p;
    const upCurrent = (upFraction * fullScaleVoltage) / sensitivityLow;
    const downCurrent = (downFraction * fullScaleVoltage) / sensitivityLow;
    const downVoltageOnHigh = downCurrent * sensitivityHigh;
    const lsb = fullScaleVoltage / 2 ** adcBits;
    return { upCurrent, downCurrent, downVoltageOnHigh, downLsbOnHigh: downVoltageOnHigh / lsb };
  },
  /** A rectangular pulse through a first-order low-pass (PHYSICS.md §6): the peak is under-read, the charge is kept. */
  pulsePeak(p: Record<string, number>) {
    const { pulseCurrent, pulseWidth, timeConstant } = p;
    const fraction = 1 - Math.exp(-pulseWidth / timeConstant);
    return { peak: pulseCurrent * fraction, peakPercent: 100 * fraction, charge: pulseCurrent * pulseWidth };
  },
  /** Shot noise √(2qIB) (PHYSICS.md §7). */
  shotNoise(p: Record<string, number>) {
    return { noiseCurrent: Math.sqrt(2 * q * p.current * p.bandwidth) };
  },
  /**
   * How often a slow logger's samples land in a burst (PHYSICS.md §16 16e, 16f). Each sample moves through the
   * wake cycle by the step f_a·T/f_log. A burst at least that wide is hit on each pass, every 1/f_a; a
   * narrower one is stepped over, and is hit on average once every T/(t_b·f_log) (or never, by phase).
   */
  burstHits(p: Record<string, number>) {
    const { wakePeriod: T, logRate: flog, burstWidth: tb } = p;
    const fw = 1 / T;
    const alias = Math.abs(fw - Math.round(fw / flog) * flog);
    const step = (alias * T) / flog;
    return {
      alias,
      aliasPeriod: 1 / alias,
      stepPerSample: step,
      samplesPerPass: tb / step,
      meanTimeBetweenHits: tb >= step ? 1 / alias : T / (tb * flog),
    };
  },
  /** The misconception of PHYSICS.md §12.5: averaging two levels without weighting by time. */
  unweightedMean(p: Record<string, number>) {
    return { mean: (p.a + p.b) / 2 };
  },
} satisfies Record<string, (p: Record<string, number>) => Record<string, number>>;

export type TeachingFn = keyof typeof teaching;
