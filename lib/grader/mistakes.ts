// The recognised wrong methods and what to tell the student about each.
import type { MistakeKey } from "./types";

export const MISTAKE_KEYS: MistakeKey[] = [
  "prefix-slip",
  "ignored-burden",
  "sign-flip",
  "nearest-not-floor",
  "wrong-range",
  "forgot-offset",
  "unweighted-average",
  "capacity-units",
  "omitted-2pi",
  "cutoff-as-bandwidth",
  "linear-sum",
  "no-root-three",
  "step-not-halved",
  "forgot-bias",
  "wrong-guard-node",
  "offset-wrong-sign",
  "unhalved-difference",
  "period-for-burst",
  "ignored-aliasing",
  "no-root-n",
];

export interface MistakeInfo {
  title: string;
  /** what the wrong method does */
  explain: string;
  /** how to fix it */
  fix: string;
}

export const MISTAKES: Record<MistakeKey, MistakeInfo> = {
  "prefix-slip": {
    title: "Prefix slip",
    explain: "Your number is off by exactly a factor of 1000 or a million: a prefix (n, µ, m, k, M) was lost or doubled.",
    fix: "Write every value in base units (A, V, Ω) before you multiply, then choose the prefix at the end.",
  },
  "ignored-burden": {
    title: "Burden voltage ignored",
    explain: "You left the shunt out of the circuit (or put it in where it does not belong).",
    fix: "With the meter in series the current is V_s/(R_L + R_sh); without it, V_s/R_L.",
  },
  "sign-flip": {
    title: "Sign flipped",
    explain: "The size is right but the sign is wrong.",
    fix: "Decide the direction first: a meter that reads low has a negative error, and an output below the offset is a negative current.",
  },
  "nearest-not-floor": {
    title: "Nearest value instead of the largest one below the limit",
    explain: "The standard value you chose is above the largest allowed shunt, so the burden limit is exceeded.",
    fix: "When a limit is hard, round down: take the largest standard value at or below V_b,max / I_max.",
  },
  "wrong-range": {
    title: "Wrong range",
    explain: "You used the neighbouring range's sensitivity.",
    fix: "Use the most sensitive range whose output stays below the top code's voltage; the next more sensitive range saturates.",
  },
  "forgot-offset": {
    title: "Offset not subtracted",
    explain: "In bidirectional mode zero current sits at the offset voltage.",
    fix: "Subtract the offset from the output before dividing by the sensitivity: I = (V_out − V_off)/S.",
  },
  "unweighted-average": {
    title: "Unweighted average",
    explain: "You averaged the active and sleep currents as if each flowed half the time.",
    fix: "Weight each current by the time it flows: (I_a·t_a + I_s·(T − t_a))/T.",
  },
  "capacity-units": {
    title: "Capacity units not converted",
    explain: "The battery life is off by 3.6 or 3600: milliamp-hours were not turned into coulombs (or hours into seconds).",
    fix: "1 mAh = 3.6 C and 1 h = 3600 s; keep the charge in coulombs and the current in amperes.",
  },
  "omitted-2pi": {
    title: "2π left out",
    explain: "You used 1/(RC), which is an angular frequency in rad/s, not the cut-off in Hz.",
    fix: "The cut-off frequency is f_c = 1/(2πRC).",
  },
  "cutoff-as-bandwidth": {
    title: "Cut-off used as the noise bandwidth",
    explain: "A first-order filter passes white noise as if it were a brick-wall filter (π/2)·f_c wide, not f_c.",
    fix: "Use B_n = (π/2)·f_c = 1/(4RC) when you integrate noise.",
  },
  "linear-sum": {
    title: "Uncertainties added linearly",
    explain: "Independent contributions do not add up in the worst case every time.",
    fix: "Convert each bound to a standard uncertainty (a/√3), then add them in quadrature (square root of the sum of squares).",
  },
  "no-root-three": {
    title: "√3 left out",
    explain: "A ± specification is a bound, not a standard uncertainty.",
    fix: "For a bound ±a with no other information, assume a rectangular distribution: u = a/√3.",
  },
  "step-not-halved": {
    title: "Quantisation step not halved",
    explain: "A converter's rounding error lies within ±½ step, so the whole step q is the width of the rectangle, not its half-width.",
    fix: "For a step q the standard uncertainty is (q/2)/√3 = q/√12.",
  },
  "no-root-n": {
    title: "Standard deviation of one reading used for the mean",
    explain: "The spread s of repeated readings describes one reading; the mean of n readings scatters √n times less.",
    fix: "A Type A evaluation of a mean uses s/√n (GUM 4.2.3).",
  },
  "forgot-bias": {
    title: "Input bias current left out",
    explain: "The amplifier's input bias current flows in the same node as the leakage and adds to the error, guard or no guard.",
    fix: "Add the bias current to the leakage before you divide by the measured current; a guard removes leakage, never bias.",
  },
  "wrong-guard-node": {
    title: "Guard at the wrong node",
    explain: "A guard only helps when it sits at (almost) the potential of the input it protects; tied to the source side or to a fixed rail it leaves the full voltage across the insulation.",
    fix: "Drive the guard from the input's own potential (the amplifier's non-inverting input, or a unity-gain buffer of the input; never the inverting input, the summing node itself), so only the guard's residual offset remains across the insulation: I = V_g/R_ins.",
  },
  "offset-wrong-sign": {
    title: "Offset added with the wrong sign",
    explain: "The amplifier's offset and the thermoelectric voltage add to the shunt voltage in both polarities; they do not reverse with the current.",
    fix: "Write each reading as ±I·R + V_os + V_th: the current's term changes sign when you reverse it, the offsets do not.",
  },
  "unhalved-difference": {
    title: "Difference not halved",
    explain: "The difference of the forward and reversed readings holds the signal twice.",
    fix: "Take half the difference: I = (V₊ − V₋)/(2R); half the sum is the offset.",
  },
  "period-for-burst": {
    title: "Period used instead of the burst width",
    explain: "The samples that describe a burst are the ones that fall inside the burst, not inside the whole wake period.",
    fix: "Use the burst width t_b: samples per burst = t_b·f_s and the lowest rate for N samples is N/t_b.",
  },
  "ignored-aliasing": {
    title: "Aliasing ignored",
    explain: "A sampler slower than twice the wake rate cannot show the true wake rate; the wakes appear at the distance to the nearest multiple of the sample rate.",
    fix: "The apparent frequency is |f_w − n·f_s| with n the integer nearest to f_w/f_s.",
  },
};
