/** Version of the grading rules, stored with every grade. Bump it when a band, verdict or mistake rule changes. */
export const graderVersion = "1.1.0";

/** Boltzmann constant, J/K (exact, SI 2019). */
export const BOLTZMANN = 1.380649e-23;
/** Elementary charge, C (exact, SI 2019). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;
