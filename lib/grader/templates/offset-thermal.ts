// Offsets and thermoelectric voltages in a low-value shunt: the amplifier's input offset V_os and a junction
// pair's thermoelectric voltage V_th = S·ΔT add to I·R in both current directions, so they read as an
// apparent current (V_os + V_th)/R. Reversing the current and halving the difference removes them.
// The Seebeck coefficient S is given in µV/K (a plain number), the trade's customary unit.
import type { MistakeCandidate, Params, Template } from "../types";
import { allPositive, num, tq } from "./util";
import { texNumber } from "../format";

function values(p: Params) {
  const r = num(p, "shuntResistance");
  const i = num(p, "current");
  const vos = num(p, "offsetVoltage");
  const seebeck = num(p, "seebeckMicrovoltsPerKelvin");
  const dT = num(p, "junctionTemperatureDifference");
  // labs stored before the input range existed carry none: no range check for them
  const inputRange = typeof p.inputRange === "number" ? p.inputRange : Infinity;
  const thermalEmf = seebeck * 1e-6 * dT;
  const offsets = vos + thermalEmf;
  const forwardVoltage = i * r + offsets;
  const reverseVoltage = -i * r + offsets;
  return {
    r, i, vos, seebeck, dT, inputRange, thermalEmf, offsets, forwardVoltage, reverseVoltage,
    apparentCurrent: offsets / r,
    offsetErrorPercent: (100 * offsets) / (i * r),
    reversedCurrent: (forwardVoltage - reverseVoltage) / (2 * r),
    wrongSign: thermalEmf - vos,
  };
}

export const offsetThermal: Template = {
  key: "offset-thermal",
  title: "Offset and thermoelectric voltages across a low-value shunt",
  summary:
    "At microvolts the amplifier's offset and the thermoelectric voltage of every junction read as current; reversing the current and halving the difference of the two readings removes them.",
  parameters: [
    { key: "shuntResistance", label: "Shunt resistance", symbol: "R", unit: "ohm", displayUnit: "mΩ", kind: "resistor", default: 1e-3, min: 1e-5, max: 10, suggestedRange: [0.5e-3, 10e-3] },
    { key: "current", label: "Current through the shunt", symbol: "I", unit: "A", displayUnit: "mA", kind: "number", default: 0.1, min: 1e-6, max: 100, suggestedRange: [20e-3, 500e-3] },
    { key: "offsetVoltage", label: "Amplifier input offset voltage (signed)", symbol: "V_\\mathrm{os}", unit: "V", displayUnit: "µV", kind: "number", default: 10e-6, min: -10e-3, max: 10e-3, suggestedRange: [5e-6, 50e-6] },
    { key: "seebeckMicrovoltsPerKelvin", label: "Thermoelectric coefficient of the junction pair", symbol: "S", unit: "", displayUnit: "µV/K", kind: "number", default: 5, min: 0, max: 1000, description: "Copper to copper about 0.2 µV/K, copper to tin-lead solder a few µV/K, copper to copper oxide up to about 1000 µV/K." },
    { key: "junctionTemperatureDifference", label: "Temperature difference between the junctions", symbol: "\\Delta T", unit: "K", displayUnit: "K", kind: "number", default: 1, min: 0, max: 100, suggestedRange: [0.5, 5] },
    { key: "inputRange", label: "Amplifier input range (±, referred to the input)", symbol: "V_\\mathrm{in,max}", unit: "V", displayUnit: "mV", kind: "number", default: 0.1, min: 1e-6, max: 100, description: "The largest voltage either way the amplifier reads without clipping, referred to its input. Both readings of a reversal must stay within it." },
  ],
  quantities: [
    { key: "thermalEmf", label: "Thermoelectric voltage", symbol: "V_\\mathrm{th}", unit: "V", displayUnit: "µV", kind: "number", description: "The junction pair's voltage, S times the temperature difference." },
    { key: "apparentCurrent", label: "Apparent current from the offsets", symbol: "I_\\mathrm{app}", unit: "A", displayUnit: "mA", kind: "number", description: "The current the offset and the thermoelectric voltage read as, with no current flowing." },
    { key: "offsetErrorPercent", label: "Error at the given current", symbol: "e", unit: "%", displayUnit: "%", kind: "number", description: "The apparent current as a percentage of the current through the shunt." },
    { key: "forwardVoltage", label: "Reading with the current forward", symbol: "V_+", unit: "V", displayUnit: "µV", kind: "number", description: "The voltage read across the shunt (referred to the input) with the current flowing forward." },
    { key: "reverseVoltage", label: "Reading with the current reversed", symbol: "V_-", unit: "V", displayUnit: "µV", kind: "number", description: "The voltage read with the current reversed (signed)." },
    { key: "reversedCurrent", label: "Current from the reversal", symbol: "I_\\mathrm{rev}", unit: "A", displayUnit: "mA", kind: "number", description: "Half the difference of the two readings, divided by the shunt." },
  ],
  compute(p) {
    const v = values(p);
    return {
      thermalEmf: v.thermalEmf,
      apparentCurrent: v.apparentCurrent,
      offsetErrorPercent: v.offsetErrorPercent,
      forwardVoltage: v.forwardVoltage,
      reverseVoltage: v.reverseVoltage,
      reversedCurrent: v.reversedCurrent,
    };
  },
  check(p) {
    const v = values(p);
    if (!allPositive(v.r, v.i)) return "the shunt and the current must be positive";
    if (!(Number.isFinite(v.vos) && v.seebeck >= 0 && v.dT >= 0)) return "the offset must be a number, the coefficient and the temperature difference not negative";
    if (!(Math.abs(v.offsets) > 0)) return "the offsets cancel exactly: nothing to correct";
    // a reversal works for any offset that keeps both readings within the amplifier's range, even an offset
    // larger than the signal, which is exactly when it is needed (PHYSICS.md §15)
    if (!(Math.max(Math.abs(v.forwardVoltage), Math.abs(v.reverseVoltage)) <= v.inputRange)) return "both readings must stay within the amplifier's input range";
    return null;
  },
  solution(p, q) {
    const v = values(p);
    const R = tq(v.r, "ohm");
    const th = [`V_\\mathrm{th} = S\\,\\Delta T = ${texNumber(v.seebeck)}\\,\\mu\\mathrm{V/K} \\times ${tq(v.dT, "K")} = ${tq(v.thermalEmf, "V")}`];
    const sum = `V_\\mathrm{os} + V_\\mathrm{th} = ${tq(v.vos, "V")} + ${tq(v.thermalEmf, "V")} = ${tq(v.offsets, "V")}`;
    const app = [...th, sum, `I_\\mathrm{app} = \\frac{V_\\mathrm{os} + V_\\mathrm{th}}{R} = \\frac{${tq(v.offsets, "V")}}{${R}} = ${tq(v.apparentCurrent, "A")}`];
    const fwd = `V_+ = I R + V_\\mathrm{os} + V_\\mathrm{th} = ${tq(v.i, "A")} \\times ${R} + ${tq(v.offsets, "V")} = ${tq(v.forwardVoltage, "V")}`;
    const rev = `V_- = -I R + V_\\mathrm{os} + V_\\mathrm{th} = -${tq(v.i * v.r, "V")} + ${tq(v.offsets, "V")} = ${tq(v.reverseVoltage, "V")}`;
    if (q === "thermalEmf") return th;
    if (q === "apparentCurrent") return app;
    if (q === "offsetErrorPercent") return [...app, `e = \\frac{I_\\mathrm{app}}{I} = \\frac{${tq(v.apparentCurrent, "A")}}{${tq(v.i, "A")}} = ${tq(v.offsetErrorPercent, "%")}`];
    if (q === "forwardVoltage") return [...th, sum, fwd];
    if (q === "reverseVoltage") return [...th, sum, rev];
    if (q === "reversedCurrent")
      return [...th, sum, fwd, rev, `I_\\mathrm{rev} = \\frac{V_+ - V_-}{2R} = \\frac{${tq(v.forwardVoltage, "V")} - (${tq(v.reverseVoltage, "V")})}{2 \\times ${R}} = ${tq(v.reversedCurrent, "A")}`];
    return [];
  },
  mistakes(p, q) {
    const v = values(p);
    const out: MistakeCandidate[] = [];
    const sign = "You subtracted the amplifier's offset where it adds: V_os and V_th add to the shunt voltage with their own signs.";
    const keep = "The offsets do not reverse with the current: both readings carry + V_os + V_th.";
    if (q === "apparentCurrent") out.push({ key: "offset-wrong-sign", value: v.wrongSign / v.r, detail: sign });
    if (q === "offsetErrorPercent") out.push({ key: "offset-wrong-sign", value: (100 * v.wrongSign) / (v.i * v.r), detail: sign });
    if (q === "forwardVoltage") {
      out.push({ key: "offset-wrong-sign", value: v.i * v.r + v.wrongSign, detail: sign });
      out.push({ key: "offset-wrong-sign", value: v.i * v.r - v.offsets, detail: keep });
    }
    if (q === "reverseVoltage") out.push({ key: "offset-wrong-sign", value: -v.i * v.r - v.offsets, detail: keep });
    if (q === "reversedCurrent") out.push({ key: "unhalved-difference", value: (v.forwardVoltage - v.reverseVoltage) / v.r, detail: "You divided the whole difference by R; the difference holds the signal twice." });
    return out;
  },
  instrumentReadings(p, q) {
    // the reversal's current comes from the two readings V_+ and V_- (R is given)
    if (q !== "reversedCurrent") return undefined;
    const v = values(p);
    return { values: { V_plus: v.forwardVoltage, V_minus: v.reverseVoltage }, formula: (r) => (r.V_plus - r.V_minus) / (2 * v.r) };
  },
  benchValue(nominal, actual, q) {
    // the two readings come from the actual shunt; the student divides their difference by the given R, so
    // the shunt's tolerance carries straight into the current (PHYSICS.md §17 17h)
    if (q !== "reversedCurrent") return undefined;
    const a = values(actual);
    return (a.forwardVoltage - a.reverseVoltage) / (2 * num(nominal, "shuntResistance"));
  },
  bandFloor(p, q, rel) {
    const v = values(p);
    // signed values that can sit near zero: a tenth of the tolerance applied to the signal I·R
    if (q === "forwardVoltage" || q === "reverseVoltage") return 0.1 * rel * v.i * v.r;
    if (q === "apparentCurrent") return 0.1 * rel * (Math.abs(v.vos) + v.thermalEmf) / v.r;
    if (q === "offsetErrorPercent") return (0.1 * rel * 100 * (Math.abs(v.vos) + v.thermalEmf)) / (v.i * v.r);
    return 0;
  },
};
