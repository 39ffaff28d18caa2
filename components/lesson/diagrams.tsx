// Circuit diagrams, one per grader template, as accessible SVG (role="img" with <title> and <desc>).
// Drawn from plain primitives so they print crisply; reused by the lab handouts through
// <CircuitDiagram template="…" />. Server-safe: no hooks, no client code.
// Longer than 300 lines on purpose: the file is one table of drawings (`specs`, one per template, data
// rather than logic) beside the primitives they are drawn with; split up, every drawing would need the
// same dozen primitives exported and the table would be scattered over ten files.
import type { ReactNode } from "react";
import type { TemplateKey } from "@/lib/grader";

export type DiagramTemplate = TemplateKey;

const INK = "currentColor";
const COPPER = "#a4532c";
const TRACE = "#1f5f8b";

function Wire({ d, thin = false, color = INK }: { d: string; thin?: boolean; color?: string }) {
  return <path d={d} fill="none" stroke={color} strokeWidth={thin ? 1.2 : 2} strokeLinejoin="round" strokeLinecap="round" />;
}

function Dot({ x, y }: { x: number; y: number }) {
  return <circle cx={x} cy={y} r={3} fill={INK} />;
}

function Label({ x, y, children, anchor = "middle", size = 12, color = INK, italic = false }: { x: number; y: number; children: ReactNode; anchor?: "start" | "middle" | "end"; size?: number; color?: string; italic?: boolean }) {
  return (
    <text x={x} y={y} textAnchor={anchor} fontSize={size} fill={color} fontFamily="inherit" fontStyle={italic ? "italic" : undefined}>
      {children}
    </text>
  );
}

/** Resistor zig-zag between (x1,y1) and (x2,y2), horizontal or vertical. */
function Resistor({ x1, y1, x2, y2, color = INK }: { x1: number; y1: number; x2: number; y2: number; color?: string }) {
  const vertical = x1 === x2;
  const len = vertical ? y2 - y1 : x2 - x1;
  const lead = len * 0.2;
  const body = len - 2 * lead;
  const n = 6;
  const amp = 7;
  const pts: string[] = [];
  for (let i = 0; i <= n; i++) {
    const t = lead + (body * i) / n;
    const off = i === 0 || i === n ? 0 : i % 2 ? amp : -amp;
    pts.push(vertical ? `${x1 + off},${y1 + t}` : `${x1 + t},${y1 + off}`);
  }
  const d = vertical
    ? `M${x1},${y1} L${x1},${y1 + lead} L${pts.join(" L")} L${x2},${y2}`
    : `M${x1},${y1} L${x1 + lead},${y1} L${pts.join(" L")} L${x2},${y2}`;
  return <Wire d={d} color={color} />;
}

/** A voltage source drawn vertically, + at the top; centre (x,y). */
function Source({ x, y, r = 16 }: { x: number; y: number; r?: number }) {
  return (
    <g>
      <circle cx={x} cy={y} r={r} fill="white" stroke={INK} strokeWidth={2} />
      <Label x={x} y={y - 3} size={13}>+</Label>
      <Label x={x} y={y + 11} size={13}>−</Label>
    </g>
  );
}

/** A cell (long and short plates), + on top; terminals at y-10 and y+10. */
function Cell({ x, y }: { x: number; y: number }) {
  return (
    <g>
      <Wire d={`M${x - 14},${y - 4} L${x + 14},${y - 4}`} />
      <Wire d={`M${x - 8},${y + 4} L${x + 8},${y + 4}`} />
      <Wire d={`M${x},${y - 14} L${x},${y - 4} M${x},${y + 4} L${x},${y + 14}`} />
      <Label x={x + 20} y={y - 6} size={11}>+</Label>
    </g>
  );
}

function Meter({ x, y, letter, r = 15 }: { x: number; y: number; letter: string; r?: number }) {
  return (
    <g>
      <circle cx={x} cy={y} r={r} fill="white" stroke={INK} strokeWidth={2} />
      <Label x={x} y={y + 5} size={14}>{letter}</Label>
    </g>
  );
}

/** Capacitor, vertical, plates around (x,y). */
function Capacitor({ x, y }: { x: number; y: number }) {
  return (
    <g>
      <Wire d={`M${x - 12},${y - 3} L${x + 12},${y - 3} M${x - 12},${y + 3} L${x + 12},${y + 3}`} />
    </g>
  );
}

function Ground({ x, y }: { x: number; y: number }) {
  return <Wire d={`M${x},${y} L${x},${y + 6} M${x - 10},${y + 6} L${x + 10},${y + 6} M${x - 6},${y + 10} L${x + 6},${y + 10} M${x - 2},${y + 14} L${x + 2},${y + 14}`} />;
}

/** Amplifier triangle pointing right; inputs at left (y±10), output at the tip. */
function Amp({ x, y, w = 44, label }: { x: number; y: number; w?: number; label?: string }) {
  return (
    <g>
      <path d={`M${x},${y - 24} L${x + w},${y} L${x},${y + 24} Z`} fill="white" stroke={INK} strokeWidth={2} strokeLinejoin="round" />
      <Label x={x + 7} y={y - 6} size={10} anchor="start">+</Label>
      <Label x={x + 7} y={y + 14} size={10} anchor="start">−</Label>
      {label && <Label x={x + w / 2 - 2} y={y - 28} size={11}>{label}</Label>}
    </g>
  );
}

function Box({ x, y, w, h, lines }: { x: number; y: number; w: number; h: number; lines: string[] }) {
  return (
    <g>
      <rect x={x} y={y} width={w} height={h} rx={4} fill="white" stroke={INK} strokeWidth={2} />
      {lines.map((l, i) => (
        <Label key={i} x={x + w / 2} y={y + h / 2 + (i - (lines.length - 1) / 2) * 14 + 4} size={11}>
          {l}
        </Label>
      ))}
    </g>
  );
}

function Arrow({ x1, y1, x2, y2, color = TRACE }: { x1: number; y1: number; x2: number; y2: number; color?: string }) {
  const a = Math.atan2(y2 - y1, x2 - x1);
  const h = 7;
  const p1 = `${x2 - h * Math.cos(a - 0.4)},${y2 - h * Math.sin(a - 0.4)}`;
  const p2 = `${x2 - h * Math.cos(a + 0.4)},${y2 - h * Math.sin(a + 0.4)}`;
  return (
    <g>
      <Wire d={`M${x1},${y1} L${x2},${y2}`} thin color={color} />
      <path d={`M${x2},${y2} L${p1} L${p2} Z`} fill={color} />
    </g>
  );
}

type Spec = { title: string; desc: string; body: ReactNode; height?: number };

const specs: Record<DiagramTemplate, Spec> = {
  "shunt-burden": {
    title: "Ammeter in series with a load: burden voltage",
    desc: "A supply Vs drives a load resistor RL. The ammeter, modelled as its input resistance R_in (the shunt), sits in series in the top wire. The current I flows clockwise; the burden voltage V_B appears across the ammeter and is lost from the load.",
    body: (
      <g>
        <Source x={40} y={100} />
        <Label x={14} y={104} anchor="end">V</Label>
        <Label x={16} y={104} anchor="start" size={9}>s</Label>
        <Wire d="M40,84 L40,40 L110,40" />
        <rect x={100} y={18} width={110} height={44} rx={6} fill="none" stroke={TRACE} strokeDasharray="5 4" strokeWidth={1.2} />
        <Label x={155} y={76} color={TRACE} size={11}>ammeter (R_in)</Label>
        <Resistor x1={110} y1={40} x2={200} y2={40} color={COPPER} />
        <Label x={155} y={30} size={11}>R_sh</Label>
        <Wire d="M200,40 L290,40 L290,70" />
        <Resistor x1={290} y1={70} x2={290} y2={140} />
        <Label x={304} y={110} anchor="start">R_L (load)</Label>
        <Wire d="M290,140 L290,170 L40,170 L40,116" />
        <Arrow x1={60} y1={30} x2={95} y2={30} />
        <Label x={72} y={24} color={TRACE}>I</Label>
        <Label x={155} y={100} size={11}>V_B = I·R_in</Label>
        <Arrow x1={118} y1={90} x2={192} y2={90} color={COPPER} />
      </g>
    ),
  },
  "shunt-selection": {
    title: "A shunt with a four-wire (Kelvin) connection",
    desc: "The full current I_max flows through heavy force leads into and out of the shunt R_sh. Two thin sense leads connect to the shunt's own terminals and carry the small voltage I·R_sh to the amplifier or voltmeter, so the drop in the force leads is not measured. The burden I_max·R_sh must stay below the allowed limit and the shunt dissipates P = I_max²·R_sh.",
    body: (
      <g>
        <Wire d="M20,140 L110,140" />
        <Arrow x1={30} y1={128} x2={70} y2={128} />
        <Label x={50} y={120} color={TRACE}>I_max</Label>
        <Label x={62} y={160} size={11}>force lead</Label>
        <Dot x={110} y={140} />
        <Resistor x1={110} y1={140} x2={230} y2={140} color={COPPER} />
        <Dot x={230} y={140} />
        <Label x={170} y={170}>R_sh  (P = I²R)</Label>
        <Wire d="M230,140 L330,140" />
        <Label x={290} y={160} size={11}>force lead</Label>
        <Wire d="M118,140 L118,70 L150,70" thin />
        <Wire d="M222,140 L222,70 L190,70" thin />
        <Meter x={170} y={70} letter="V" r={20} />
        <Label x={170} y={38} size={11}>sense leads carry ~no current</Label>
      </g>
    ),
  },
  "range-resolution": {
    title: "The teaching meter: range shunts, amplifier and 14-bit converter",
    desc: "The current passes through one of four range shunts chosen by a switch: 10 kilohms for the 5 µA range, 100 ohms for the 500 µA range, 1 ohm for the 50 mA range, 50 milliohms for the 1 A range. Each drops 50 mV at its full scale; an amplifier with gain 50 turns that into 2.5 V. A 14-bit converter with a 2.5 V reference digitises the output into codes 0 to 16383.",
    body: (
      <g>
        <Wire d="M20,40 L60,40" />
        <Arrow x1={24} y1={30} x2={54} y2={30} />
        <Label x={38} y={24} color={TRACE}>I</Label>
        <Dot x={60} y={40} />
        <Wire d="M60,40 L60,155" />
        {[
          { y: 50, label: "5 µA: 10 kΩ" },
          { y: 85, label: "500 µA: 100 Ω" },
          { y: 120, label: "50 mA: 1 Ω" },
          { y: 155, label: "1 A: 50 mΩ" },
        ].map((r, i) => (
          <g key={r.y}>
            <Wire d={`M60,${r.y} L75,${r.y}`} />
            <circle cx={78} cy={r.y} r={3} fill="white" stroke={INK} strokeWidth={1.5} />
            {i === 1 ? <Wire d={`M81,${r.y} L98,${r.y}`} /> : <Wire d={`M81,${r.y} L96,${r.y - 8}`} />}
            <Resistor x1={100} y1={r.y} x2={170} y2={r.y} color={COPPER} />
            <Label x={135} y={r.y - 10} size={10}>{r.label}</Label>
            <Wire d={`M170,${r.y} L185,${r.y}`} />
          </g>
        ))}
        <Wire d="M185,50 L185,155" />
        <Dot x={185} y={100} />
        <Label x={40} y={192} size={10} anchor="start">(switch shown on the 500 µA range)</Label>
        <Wire d="M185,155 L185,175 L20,175" />
        <Label x={14} y={179} anchor="end" size={10}>to DUT</Label>
        <Wire d="M185,100 L205,100 L205,90 L215,90" thin />
        <Amp x={215} y={100} label="×50" />
        <Wire d="M259,100 L280,100" />
        <Box x={280} y={76} w={70} h={48} lines={["14-bit", "ADC 2.5 V"]} />
      </g>
    ),
  },
  "duty-cycle": {
    title: "A battery-powered node measured through a shunt",
    desc: "A cell of capacity C_bat powers a microcontroller node through a current shunt. The node sleeps at a small current I_s and wakes periodically for a time t_a at a large current I_a; the inset sketches this current against time, a narrow tall pulse once every period T above a low floor.",
    body: (
      <g>
        <Cell x={40} y={100} />
        <Label x={40} y={140} size={11}>C_bat</Label>
        <Wire d="M40,86 L40,40 L100,40" />
        <Resistor x1={100} y1={40} x2={180} y2={40} color={COPPER} />
        <Label x={140} y={28} size={11}>shunt</Label>
        <Wire d="M180,40 L230,40 L230,70" />
        <Box x={200} y={70} w={60} h={60} lines={["MCU", "node"]} />
        <Wire d="M230,130 L230,165 L40,165 L40,114" />
        <rect x={275} y={60} width={80} height={80} fill="white" stroke={TRACE} strokeWidth={1} />
        <Wire d="M280,128 L292,128 L292,72 L298,72 L298,128 L330,128 L330,72 L336,72 L336,128 L350,128" thin color={TRACE} />
        <Label x={315} y={153} size={10}>i(t): I_a for t_a,</Label>
        <Label x={315} y={165} size={10}>I_s otherwise</Label>
        <Label x={314} y={54} size={10}>period T</Label>
      </g>
    ),
  },
  "bidirectional-offset": {
    title: "Bidirectional measurement with an offset output",
    desc: "A shunt carries a current that can flow either way, for example into and out of a rechargeable cell. A difference amplifier measures the shunt voltage and adds a reference voltage V_mid, set by a divider to half the 2.5 V full scale, so zero current gives 1.25 V, positive currents read above it and negative currents below it. A converter digitises the output.",
    body: (
      <g>
        <Wire d="M20,60 L90,60" />
        <Arrow x1={30} y1={48} x2={70} y2={48} />
        <Arrow x1={70} y1={74} x2={30} y2={74} color={COPPER} />
        <Label x={50} y={40} color={TRACE} size={11}>+I</Label>
        <Label x={50} y={90} color={COPPER} size={11}>−I</Label>
        <Resistor x1={90} y1={60} x2={170} y2={60} color={COPPER} />
        <Wire d="M170,60 L200,60" />
        <Wire d="M96,60 L96,100 L200,100 L200,110 L215,110" thin />
        <Wire d="M164,60 L164,90 L215,90" thin />
        <Amp x={215} y={100} label="diff. amp" />
        <Wire d="M259,100 L280,100" />
        <Box x={280} y={76} w={70} h={48} lines={["ADC", "0–2.5 V"]} />
        <Label x={237} y={150} size={11}>REF = V_mid</Label>
        <Wire d="M237,118 L237,136" thin />
        <Resistor x1={150} y1={140} x2={150} y2={175} />
        <Wire d="M150,140 L150,132 M150,175 L150,182" thin />
        <Label x={128} y={150} size={10} anchor="end">divider</Label>
        <Label x={128} y={162} size={10} anchor="end">(1.25 V)</Label>
        <Wire d="M150,158 L200,158 L200,136 L237,136" thin />
      </g>
    ),
  },
  "filter-noise": {
    title: "Shunt noise, an amplifier, then an RC low-pass filter before the converter",
    desc: "The shunt resistor R_sh is shown with its thermal noise voltage v_n in series. Its voltage goes first into an amplifier (drawn as a unity-gain buffer; a gain stage works the same way), whose low output impedance drives an RC low-pass filter, a series resistor R_f and a capacitor C_f to ground, before the converter. Because the amplifier stands between them, the shunt does not add to R_f, so the time constant is τ = R_f·C_f; the filter sets the cut-off frequency and the noise bandwidth.",
    body: (
      <g>
        <Resistor x1={30} y1={60} x2={30} y2={140} color={COPPER} />
        <Label x={44} y={104} anchor="start" size={11}>R_sh</Label>
        <circle cx={70} cy={40} r={13} fill="white" stroke={INK} strokeWidth={2} />
        <Label x={70} y={45} size={13}>~</Label>
        <Label x={60} y={20} size={11}>v_n = √(4kTRB)</Label>
        <Wire d="M30,60 L30,40 L57,40" />
        <Wire d="M83,40 L100,40" />
        <Amp x={100} y={50} label="amplifier" />
        <Wire d="M144,50 L165,50" />
        <Dot x={152} y={50} />
        <Wire d="M152,50 L152,84 L92,84 L92,60 L100,60" thin />
        <Resistor x1={165} y1={50} x2={235} y2={50} />
        <Label x={200} y={38} size={11}>R_f</Label>
        <Wire d="M235,50 L255,50 L255,92" />
        <Dot x={255} y={50} />
        <Capacitor x={255} y={95} />
        <Wire d="M255,98 L255,160" />
        <Label x={271} y={100} anchor="start" size={11}>C_f</Label>
        <Wire d="M30,140 L30,160 L255,160" />
        <Ground x={140} y={160} />
        <Wire d="M255,50 L290,50" />
        <Box x={290} y={30} w={60} h={40} lines={["ADC"]} />
        <Label x={180} y={196} size={11}>τ = R_f·C_f,  f_c = 1/(2πτ),  B_n = (π/2)·f_c</Label>
      </g>
    ),
  },
  uncertainty: {
    title: "Current from a reading across a shunt: every input of the uncertainty budget",
    desc: "A current I flows through a shunt R with a tolerance of plus or minus t percent and a temperature coefficient alpha; its temperature may differ from calibration by up to delta T. A voltmeter across the shunt reads V with a specification of plus or minus (p percent of reading plus n counts). The same shunt voltage can instead pass through an amplifier of gain G with a gain error of plus or minus g percent into an N-bit converter whose reference V_ref has a tolerance of plus or minus r percent; the converter's step, referred to the shunt, is V_ref divided by 2 to the N times G. Each bound becomes a standard uncertainty, is weighted by its sensitivity coefficient and the contributions add in quadrature.",
    height: 210,
    body: (
      <g>
        <Wire d="M20,150 L60,150" />
        <Arrow x1={24} y1={138} x2={54} y2={138} />
        <Label x={38} y={130} color={TRACE}>I</Label>
        <Resistor x1={60} y1={150} x2={170} y2={150} color={COPPER} />
        <Label x={115} y={178} size={11}>R ± t,  α·ΔT</Label>
        <Wire d="M170,150 L200,150" />
        <Wire d="M68,150 L68,70 L95,70" thin />
        <Wire d="M162,150 L162,70 L135,70" thin />
        <Meter x={115} y={70} letter="V" r={20} />
        <Label x={115} y={38} size={10}>±(p % of reading + n counts)</Label>
        <Wire d="M68,120 L215,120 L215,105 L232,105" thin />
        <Wire d="M162,132 L222,132 L222,125 L232,125" thin />
        <Amp x={232} y={115} w={40} label="G ± g" />
        <Wire d="M272,115 L290,115" />
        <Box x={290} y={92} w={68} h={46} lines={["N-bit ADC", "V_ref ± r"]} />
        <Label x={324} y={156} size={10}>step q = V_ref/(2ᴺ·G)</Label>
        <Label x={185} y={202} size={11} italic>I = V/R,  u_c² = Σ (c_i · u(x_i))²,  U = k·u_c</Label>
      </g>
    ),
  },
  "leakage-guard": {
    title: "A feedback ammeter at nanoamps: leakage, bias current and a guard",
    desc: "The device under test drives a small current I into the inverting input of an amplifier with a feedback resistor R_f, whose output is minus I times R_f. A nearby conductor at voltage V_s would push a leakage current V_s over R_ins through the insulation into the input. A guard trace, connected to the amplifier's non-inverting input, surrounds the input wire, so the insulation from the conductor ends on the guard and only the small voltage V_g between guard and input (the amplifier's offset) remains across the insulation next to the input. The amplifier's input bias current I_b flows into the same node whether or not there is a guard.",
    height: 210,
    body: (
      <g>
        <Wire d="M30,30 L230,30" color={COPPER} />
        <Label x={30} y={22} anchor="start" size={11}>conductor at V_s</Label>
        <Resistor x1={110} y1={30} x2={110} y2={92} />
        <Label x={100} y={66} anchor="end" size={10}>R_ins</Label>
        <path d="M40,95 L190,95" fill="none" stroke={TRACE} strokeWidth={3} strokeDasharray="8 4" />
        <Label x={40} y={88} anchor="start" size={10} color={TRACE}>guard</Label>
        <Wire d="M190,95 L208,95 L208,110 L232,110" thin color={TRACE} />
        <Ground x={208} y={110} />
        <Resistor x1={160} y1={95} x2={160} y2={130} />
        <Label x={150} y={116} anchor="end" size={10}>V_g across</Label>
        <Wire d="M20,130 L232,130" />
        <Arrow x1={26} y1={143} x2={62} y2={143} />
        <Label x={44} y={160} color={TRACE}>I (DUT)</Label>
        <Dot x={215} y={130} />
        <Amp x={232} y={120} w={46} />
        <Arrow x1={190} y1={162} x2={211} y2={136} color={COPPER} />
        <Label x={186} y={172} anchor="end" size={10} color={COPPER}>I_b</Label>
        <Wire d="M215,130 L215,192 L300,192 L300,120" thin />
        <Resistor x1={230} y1={192} x2={290} y2={192} />
        <Label x={260} y={178} size={10}>R_f</Label>
        <Wire d="M278,120 L340,120" />
        <Label x={340} y={112} anchor="end" size={10}>V_out = −I·R_f</Label>
      </g>
    ),
  },
  "offset-thermal": {
    title: "A milliohm shunt read through two junctions and an amplifier with an offset",
    desc: "A reversible current plus or minus I flows through a low-value shunt R. Two sense leads run from the shunt's terminals to an amplifier; each lead passes a junction of dissimilar metals (for example copper to solder), one at temperature T1 and one at T2, which together add a thermoelectric voltage V_th equal to S times the temperature difference. The amplifier adds its input offset V_os. The reading is plus or minus I times R plus V_os plus V_th; reversing the current and taking half the difference of the two readings leaves I times R.",
    body: (
      <g>
        <Wire d="M20,160 L110,160" />
        <Arrow x1={28} y1={148} x2={66} y2={148} />
        <Arrow x1={66} y1={174} x2={28} y2={174} color={COPPER} />
        <Label x={46} y={140} color={TRACE} size={11}>+I</Label>
        <Label x={46} y={192} color={COPPER} size={11}>−I (reversed)</Label>
        <Resistor x1={110} y1={160} x2={230} y2={160} color={COPPER} />
        <Label x={170} y={186} size={11}>R (mΩ)</Label>
        <Wire d="M230,160 L340,160" />
        <Wire d="M118,160 L118,60 L262,60" thin />
        <Wire d="M222,160 L222,80 L262,80" thin />
        <circle cx={118} cy={110} r={6} fill="white" stroke={COPPER} strokeWidth={2} />
        <circle cx={222} cy={120} r={6} fill="white" stroke={COPPER} strokeWidth={2} />
        <Label x={108} y={114} anchor="end" size={10}>junction at T₁</Label>
        <Label x={232} y={124} anchor="start" size={10}>junction at T₂</Label>
        <circle cx={190} cy={60} r={11} fill="white" stroke={INK} strokeWidth={2} />
        <Label x={190} y={64} size={10}>os</Label>
        <Label x={190} y={42} size={10}>V_os</Label>
        <Amp x={262} y={70} w={44} label="×G" />
        <Wire d="M306,70 L340,70" />
        <Label x={170} y={136} size={10} italic>V_th = S·(T₁ − T₂)</Label>
        <Label x={300} y={110} size={10}>V± = ±I·R + V_os + V_th</Label>
      </g>
    ),
  },
  "sampling-burst": {
    title: "A wake burst and the samples that land in it",
    desc: "A timing sketch. The load current sits at a small sleep level and rises to a burst of width t_b once every wake period T. Tick marks along the time axis show the fast logger's samples, one every 1 over f_s; only those inside a burst see the burst, and the burst's edges fall between samples. Dots below show a slow logger sampling at f_log, close to the wake rate, which sees the bursts drift slowly through its samples: the wakes appear at the alias frequency, the distance from 1 over T to the nearest multiple of f_log.",
    body: (
      <g>
        <Wire d="M20,140 L350,140" thin />
        <Label x={350} y={154} anchor="end" size={10}>time</Label>
        <Wire d="M20,135 L60,135 L60,50 L96,50 L96,135 L230,135 L230,50 L266,50 L266,135 L350,135" color={COPPER} />
        <Label x={78} y={42} size={10}>t_b</Label>
        <Arrow x1={62} y1={30} x2={228} y2={30} />
        <Label x={145} y={24} size={10} color={TRACE}>wake period T</Label>
        {Array.from({ length: 28 }, (_, k) => 24 + k * 12).map((x) => (
          <Wire key={x} d={`M${x},140 L${x},148`} thin color={TRACE} />
        ))}
        <Label x={30} y={162} anchor="start" size={10} color={TRACE}>fast samples every 1/f_s</Label>
        {[52, 214, 376].filter((x) => x < 350).map((x, k) => (
          <circle key={x} cx={x + k * 6} cy={180} r={3.5} fill={INK} />
        ))}
        <Label x={120} y={196} size={10}>slow logger at f_log ≈ 1/T: the wakes drift (alias)</Label>
      </g>
    ),
    height: 205,
  },
};

export const diagramTemplates = Object.keys(specs) as DiagramTemplate[];

export function CircuitDiagram({ template, idPrefix = "diagram", className }: { template: DiagramTemplate; idPrefix?: string; className?: string }) {
  const s = specs[template];
  if (!s) throw new Error(`no diagram for template "${template}"`);
  const titleId = `${idPrefix}-${template}-title`;
  const descId = `${idPrefix}-${template}-desc`;
  return (
    <figure className={`my-5 break-inside-avoid ${className ?? ""}`}>
      <svg
        role="img"
        aria-labelledby={`${titleId} ${descId}`}
        viewBox={`0 0 370 ${s.height ?? 200}`}
        className="h-auto w-full max-w-xl rounded-card border border-ink/10 bg-white text-ink"
        data-template={template}
      >
        <title id={titleId}>{s.title}</title>
        <desc id={descId}>{s.desc}</desc>
        {s.body}
      </svg>
      <figcaption className="mt-1 text-sm text-ink-soft">{s.title}</figcaption>
    </figure>
  );
}
