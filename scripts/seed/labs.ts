// Demo labs of the invented course, in every state (graded, open, upcoming, draft), with attempts from
// many students. The attempts are made up for the demo; between them they show every recognised mistake,
// close and wrong answers, wrong units, a late attempt and logged-trace uploads.
import crypto from "node:crypto";
import type { Kysely } from "kysely";
import { drawVariant, formatQuantity, MISTAKE_KEYS, seededRandom, templates, type MistakeKey, type Params, type TemplateKey, type VariantSpec } from "../../lib/grader";
import { attemptRecord, gradeForLab, toLab, withIds, type StoredTrace } from "../../lib/labs/grading";
import { analyzeTrace, squareWaveCsv } from "../../lib/trace";
import { findLab, insertLab } from "../../db/queries/labs";
import { insertAttempt } from "../../db/queries/attempts";
import { insertGradeEvent } from "../../db/queries/grade-events";
import { insertUpload } from "../../db/queries/uploads";
import type { Database, ShowExpected } from "../../db/types";

const DAY = 24 * 3600 * 1000;
const SAFETY = {
  bench: "Set the bench supply's current limit just above the circuit's expected maximum before you connect anything, and power down before you rewire.",
  shunt: "Check the shunt's dissipation (I²R) against its rating before you switch on; a hot shunt drifts and can burn fingers.",
  cell: "Treat the lithium cell with care: never short, puncture or solder to it, and stop using any cell that is swollen, hot or smells.",
  esd: "The nanoamp input has almost nothing to drain static: wear the wrist strap on the grounded mat, hold the board by its edges, and keep the input capped when nothing is connected.",
  solder: "The soldering iron runs at 300 to 400 °C: park it in its stand, keep the fume extraction on, wear eye protection and let joints cool before you touch them.",
};

interface DemoLab {
  title: string;
  template: TemplateKey;
  state: "graded" | "open" | "upcoming" | "draft";
  spec: VariantSpec["parameters"];
  questions: { quantity: string; kind: "prediction" | "bench"; points: number }[];
  showExpected: ShowExpected;
  instructions: string;
  safety: string;
  traces?: boolean;
  /** where the readings are taken (default the real bench); the demo has one lab of each kind */
  bench?: "real" | "simulated" | "either";
  /** review requests seeded on the lab's attempts (see scripts/seed/reviews.ts seedLabReviews) */
  reviews?: DemoReviews;
}

/**
 * Students' review requests on one demo lab: some still open, some answered (with a changed score when
 * `regrade` is given: on a question the grader read as a prefix slip if there is one, else on one it gave
 * less than its points; `{q}` in the texts becomes that question's number).
 */
export interface DemoReviews {
  open: string[];
  answered: { message: string; answer: string; regrade?: string }[];
}

// The parameter settings and questions of the demo labs, in the grader's spec shapes (lib/grader/variant.ts).
const fixed = (value: number, tolerancePercent?: number) => ({ mode: "fixed" as const, value, ...(tolerancePercent === undefined ? {} : { tolerancePercent }) });
const list = (values: (number | string)[], tolerancePercent?: number) => ({ mode: "list" as const, values, ...(tolerancePercent === undefined ? {} : { tolerancePercent }) });
const range = (min: number, max: number, series: "E12" | "E24", tolerancePercent: number) => ({ mode: "range" as const, min, max, series, tolerancePercent });
const predict = (quantity: string, points: number) => ({ quantity, kind: "prediction" as const, points });
const bench = (quantity: string, points: number) => ({ quantity, kind: "bench" as const, points });

const LABS: DemoLab[] = [
  {
    title: "Lab 1 · Burden voltage on the sensor node's supply",
    template: "shunt-burden",
    state: "graded",
    spec: { supplyVoltage: list([1.8, 3.3, 5]), loadResistance: range(100, 1000, "E24", 1), shuntResistance: range(4.7, 47, "E12", 1) },
    questions: [predict("trueCurrent", 2), bench("indicatedCurrent", 3), bench("burdenVoltage", 3), predict("loadingErrorPercent", 2)],
    showExpected: "after_due",
    instructions: "Build the load from your supply through your load resistor. Predict the current without the meter, then insert the shunt and measure.\n\n- Record the current the meter shows.\n- Measure the voltage across the shunt with the second meter.\n- Work out the loading error in percent (negative when the meter reads low).",
    safety: `${SAFETY.bench} ${SAFETY.shunt}`,
  },
  {
    title: "Lab 2 · Choosing a shunt for a hard burden limit",
    template: "shunt-selection",
    state: "graded",
    spec: { maxCurrent: list([0.5, 1, 2, 3.3]), maxBurden: list([0.05, 0.1, 0.2]), series: list(["E12", "E24", "E96"]) },
    questions: [predict("idealShunt", 2), predict("standardShunt", 3), predict("burdenAtFullScale", 2), predict("shuntPower", 3)],
    showExpected: "after_due",
    instructions: "Choose the shunt for the motor driver's current monitor. The burden limit is hard: the driver browns out above it.",
    safety: SAFETY.shunt,
  },
  {
    title: "Lab 3 · Ranges and converter codes",
    template: "range-resolution",
    state: "graded",
    spec: { current: list([4.7e-7, 1.2e-6, 2.2e-5, 4.7e-4, 2e-3, 0.15]) },
    questions: [predict("bestRange", 2), bench("outputVoltage", 3), bench("adcCode", 3), predict("currentResolution", 2)],
    showExpected: "after_attempt",
    instructions: "Set the front end to the range you choose, read its output with the bench meter, and read the converter's code from the logger.",
    safety: SAFETY.bench,
  },
  {
    title: "Lab 4 · A sleeping sensor node: average current and battery life",
    template: "duty-cycle",
    state: "open",
    bench: "either",
    spec: {
      sleepCurrent: list([2e-6, 3e-6, 5e-6]),
      activeCurrent: list([0.012, 0.02, 0.025]),
      activeTime: list([0.005, 0.01, 0.02]),
      period: list([0.5, 1, 2]),
      batteryCapacity: list([792, 1800]),
      usableFraction: fixed(0.8),
    },
    questions: [bench("averageCurrent", 4), predict("chargePerWake", 3), predict("batteryLife", 3)],
    showExpected: "after_attempt",
    instructions: "Log the node's current for at least three wake periods and upload the trace as CSV (time, current). Report the time-weighted average.",
    safety: `${SAFETY.cell} ${SAFETY.bench}`,
    traces: true,
  },
  {
    title: "Lab 5 · Currents both ways: charging and discharging",
    template: "bidirectional-offset",
    state: "open",
    spec: {
      // the teaching meter's offset and full scale, on its 1 A, 50 mA and 500 µA ranges
      offsetVoltage: fixed(1.25),
      sensitivity: list([2.5, 50, 5000]),
      outputVoltage: list([0.35, 0.9, 1.2, 1.6, 2.1, 2.4]),
      fullScaleVoltage: fixed(2.5),
    },
    questions: [bench("signedCurrent", 4), predict("maxPositiveCurrent", 3), predict("maxNegativeCurrent", 3)],
    showExpected: "after_due",
    instructions: "Read the bidirectional front end's output while the cell charges or discharges and work out the signed current.",
    safety: SAFETY.cell,
  },
  {
    title: "Lab 6 · Filtering the output and the shunt's noise floor",
    template: "filter-noise",
    state: "open",
    spec: {
      filterResistance: range(1000, 47000, "E12", 1),
      filterCapacitance: list([1e-8, 1e-7, 1e-6]),
      shuntResistance: list([10, 1000, 10000]),
      temperature: fixed(300),
    },
    questions: [predict("cutoffFrequency", 3), bench("settlingTime1pct", 3), predict("thermalNoiseVoltage", 4)],
    showExpected: "after_attempt",
    instructions: "Fit the RC filter after the amplifier, measure the step response's settling time with the scope, and estimate the shunt's thermal noise in the filter's noise bandwidth.",
    safety: SAFETY.bench,
  },
  {
    title: "Lab 7 · An uncertainty budget for one reading",
    template: "uncertainty",
    state: "open",
    spec: {
      reading: list([0.05, 0.25, 1]),
      readingAccuracyPercent: fixed(0.5),
      readingCounts: fixed(2),
      countSize: list([1e-4, 1e-3]),
      shuntResistance: list([0.1, 1, 10]),
      shuntTolerancePercent: fixed(1),
      coverageFactor: fixed(2),
    },
    questions: [predict("current", 2), predict("relativeStandardUncertaintyPercent", 4), predict("expandedUncertainty", 4)],
    showExpected: "after_due",
    instructions: "Write the uncertainty budget for your reading: treat each bound as rectangular, combine in quadrature and state the expanded uncertainty with k = 2.",
    safety: "",
  },
  {
    title: "Lab 8 · Four-wire shunt check",
    template: "shunt-burden",
    state: "upcoming",
    spec: { supplyVoltage: fixed(5), loadResistance: range(10, 100, "E24", 1), shuntResistance: list([0.1, 0.22, 0.47]) },
    questions: [bench("indicatedCurrent", 5), bench("burdenVoltage", 5)],
    showExpected: "after_due",
    instructions: "Connect the shunt with separate force and sense leads and compare the two-wire and four-wire readings.",
    safety: `${SAFETY.bench} ${SAFETY.shunt} Currents here reach hundreds of milliamps: let the shunt cool between runs.`,
  },
  {
    title: "Lab 9 · Nanoamps: noise floor of the most sensitive range (draft)",
    template: "filter-noise",
    state: "draft",
    spec: { filterResistance: fixed(10000, 1), filterCapacitance: fixed(1e-7), shuntResistance: fixed(10000), temperature: list([290, 300]) },
    questions: [predict("noiseBandwidth", 5), predict("thermalNoiseCurrent", 5)],
    showExpected: "after_due",
    instructions: "Draft: still to be written.",
    safety: "",
  },
  {
    title: "Lab 10 · Nanoamps: leakage and a guard ring",
    template: "leakage-guard",
    state: "open",
    spec: {
      sourceVoltage: list([5, 10, 15]),
      insulationResistance: list([2e10, 5e10, 1e11, 2e11]),
      measuredCurrent: list([0.5e-9, 1e-9, 2e-9]),
      biasCurrent: list([2e-12, 5e-12, 10e-12]),
      guardVoltage: list([1e-3, 2e-3, 5e-3]),
    },
    questions: [predict("leakageCurrent", 2), bench("unguardedErrorPercent", 3), predict("guardedLeakage", 2), bench("guardedErrorPercent", 3)],
    showExpected: "after_due",
    instructions:
      "Measure the test current with the feedback ammeter twice: first with the neighbouring trace at your voltage and no guard, then with the guard ring connected to the amplifier's non-inverting input.\n\n- Predict the leakage through the board's insulation.\n- Report the error of each reading against the current the source sets, in percent.\n- Do not forget the amplifier's bias current.",
    safety: `${SAFETY.esd} ${SAFETY.bench}`,
    reviews: {
      open: [
        "Question 2: my unguarded reading already had the bias current in it, so I counted it once. I think my error is right if it is not counted twice.",
      ],
      answered: [
        {
          message: "Question 3: the guard on my board sat at 2 mV, not at the voltage on my handout. Should my prediction have used what I measured?",
          answer: "Predict with the guard voltage on your handout; that is what the question asks. Your 2 mV is a good bench observation: write it beside your reading. The grade stands.",
        },
      ],
    },
  },
  {
    title: "Lab 11 · Microvolts: thermoelectric offsets and current reversal",
    template: "offset-thermal",
    state: "open",
    spec: {
      shuntResistance: list([1e-3, 2e-3, 5e-3], 1),
      current: list([0.1, 0.2, 0.5]),
      offsetVoltage: list([-20e-6, 5e-6, 15e-6]),
      seebeckMicrovoltsPerKelvin: list([3, 5]),
      junctionTemperatureDifference: list([0.5, 1, 2]),
    },
    questions: [predict("apparentCurrent", 3), bench("forwardVoltage", 2), bench("reverseVoltage", 2), bench("reversedCurrent", 3)],
    showExpected: "after_due",
    instructions:
      "Warm one solder junction of the sense leads with the heating block until the thermometer shows your temperature difference. Read the shunt voltage with the current forward, reverse the current, and read again.\n\n- Predict the current the offsets alone would read as.\n- Work out the current from half the difference of the two readings.",
    safety: `${SAFETY.solder} ${SAFETY.shunt}`,
    reviews: {
      open: ["Question 4: I reversed the current at the supply, not at the shunt. Does that change which half-difference I should report?"],
      answered: [
        {
          message: "Question {q}: the digits I wrote are the ones the meter showed, I only put the wrong prefix on the unit. Could the reading count for something?",
          answer: "Your digits match your circuit, only the prefix slipped, so I gave half of question {q}'s points back. At microvolts write every value in volts with its power of ten before you choose a prefix.",
          regrade: "Right digits, wrong prefix on the unit: half the points back.",
        },
      ],
    },
  },
  {
    title: "Lab 12 · How often to sample a waking node",
    template: "sampling-burst",
    state: "open",
    bench: "simulated",
    spec: {
      sampleRate: list([500, 1000, 2000]),
      burstWidth: list([2e-3, 5e-3, 10e-3]),
      requiredSamples: fixed(20),
      wakePeriod: list([0.9, 0.95, 1.02, 1.05]),
      logRate: fixed(1),
      activeCurrent: list([10e-3, 20e-3]),
      sleepCurrent: list([2e-6, 5e-6]),
    },
    questions: [predict("samplesPerBurst", 2), predict("minimumSampleRate", 2), bench("apparentWakeFrequency", 3), predict("worstCaseErrorPercent", 3)],
    showExpected: "after_due",
    instructions:
      "Log the node's current with the fast logger at your sample rate and, at the same time, with the once-a-second logger for five minutes.\n\n- Count the samples in a burst and find the rate that gives twenty.\n- From the slow log, measure how often the wakes appear to repeat.\n- Bound the error of the average from one sample interval per wake.\n\nThis lab is taken on the simulated bench (below the handout): the course teaching meter on your own node. Use a fixed range that holds the wake current, record a trace at your sample rate and one at 1 sample per second for five minutes, and attach the trace you analyse.",
    safety: SAFETY.cell,
    reviews: {
      open: ["Question 3: on the slow log the wakes drift the opposite way from my prediction. Is the size of the apparent frequency what counts?"],
      answered: [
        {
          message: "Question 1: I counted one sample fewer in a burst on the logger than the handout's numbers give. Which count should I report?",
          answer: "Report what your sample rate and burst width give. On the bench the first sample can land just after the burst starts, so one fewer is normal; that is why question 4 asks for the worst case. The grade stands.",
        },
      ],
    },
  },
  {
    title: "Lab 13 · The whole chain: a budget from shunt to converter code",
    template: "uncertainty",
    state: "open",
    spec: {
      reading: list([20e-3, 50e-3]),
      readingAccuracyPercent: fixed(0),
      readingCounts: fixed(0),
      countSize: fixed(1e-3),
      shuntResistance: list([0.1, 0.2], 1),
      shuntTolerancePercent: fixed(1),
      coverageFactor: fixed(2),
      shuntTempcoPpm: list([25, 50, 100]),
      temperatureChange: list([5, 10, 20]),
      gainErrorPercent: list([0.1, 0.2]),
      referenceTolerancePercent: list([0.1, 0.2]),
      amplifierGain: list([10, 20, 50]),
      adcBits: list([12, 14]),
      adcReference: fixed(2.5),
      repeatStdDev: list([20e-6, 50e-6]),
      repeatCount: list([10, 25]),
    },
    questions: [predict("tempcoContribution", 2), predict("quantisationContribution", 3), predict("combinedStandardUncertainty", 3), predict("dominantContribution", 2), predict("repeatabilityContribution", 2)],
    showExpected: "after_due",
    instructions:
      "The front end reads your shunt through its amplifier and converter, as the teaching meter does. Write the budget table for one reading: every bound as a standard uncertainty, each times its sensitivity coefficient, combined in quadrature, and name the contribution that dominates.",
    safety: "",
    reviews: {
      open: ["Question 4: on my values two contributions are almost equal. I named the temperature coefficient; could the gain error be accepted as well?"],
      answered: [
        {
          message: "Question 2: I used the whole converter step instead of dividing it by the square root of twelve. Is the rest of my budget still marked?",
          answer: "Each question is marked on its own, so the rest of your budget kept its points; the combined uncertainty used your larger quantisation term, so it moved too. You have attempts left: resubmit with the step divided by √12.",
        },
      ],
    },
  },
];

type Outcome = { kind: "correct" | "close" | "wrong" | "unit" | "missing" } | { kind: "mistake"; key: MistakeKey };

/** How a student might type a value: with the display unit, in base units, or in scientific notation. */
function typed(value: number | string, unit: string, displayUnit: string, style: number): string {
  if (typeof value === "string") return value;
  if (unit === "" || unit === "%") return String(Number(value.toPrecision(4)));
  if (style === 1) return `${Number(value.toPrecision(4))} ${unit === "ohm" ? "ohm" : unit}`;
  if (style === 2) return `${value.toExponential(3)} ${unit === "ohm" ? "ohm" : unit}`;
  return formatQuantity(value, unit, { displayUnit: displayUnit || undefined }).replace("µ", style === 3 ? "u" : "µ");
}

function readingFor(t: (typeof templates)[TemplateKey], params: Params, quantity: string, outcome: Outcome, style: number): string | null {
  const spec = t.quantities.find((q) => q.key === quantity)!;
  const expected = t.compute(params)[quantity];
  switch (outcome.kind) {
    case "missing":
      return null;
    case "correct":
      return typed(expected, spec.unit, spec.displayUnit, style);
    case "close":
      return typeof expected === "number" && spec.unit !== "" ? typed(expected * 1.014, spec.unit, spec.displayUnit, 0) : typed(expected, spec.unit, spec.displayUnit, style);
    case "wrong":
      if (typeof expected === "string") return spec.choices?.find((c) => c !== expected) ?? "none";
      return typed(expected * 1.37 + (expected === 0 ? 1 : 0), spec.unit, spec.displayUnit, style);
    case "unit":
      if (typeof expected !== "number" || spec.unit === "" || spec.unit === "%") return typed(expected, spec.unit, spec.displayUnit, style);
      return `${Number(Math.abs(expected).toPrecision(3))} ${spec.unit === "V" ? "A" : "V"}`;
    case "mistake": {
      if (outcome.key === "prefix-slip" && typeof expected === "number") return typed(expected * 1000, spec.unit, spec.displayUnit, 1);
      const c = t.mistakes(params, quantity).find((m) => m.key === outcome.key);
      return c ? typed(c.value, spec.unit, spec.displayUnit, style) : typed(expected, spec.unit, spec.displayUnit, style);
    }
  }
}

function chooseOutcome(r: () => number): Outcome {
  const x = r();
  if (x < 0.62) return { kind: "correct" };
  if (x < 0.72) return { kind: "close" };
  if (x < 0.82) return { kind: "wrong" };
  if (x < 0.87) return { kind: "unit" };
  if (x < 0.92) return { kind: "missing" };
  return { kind: "mistake", key: "prefix-slip" };
}

/** The demo labs that come with seeded review requests, by title. */
export function demoLabReviews(): { title: string; reviews: DemoReviews }[] {
  return LABS.flatMap((l) => (l.reviews ? [{ title: l.title, reviews: l.reviews }] : []));
}

export interface SeedStorage {
  put(key: string, body: Uint8Array, contentType: string): Promise<void>;
}

export async function seedLabs(
  db: Kysely<Database>,
  courseId: string,
  instructorId: string,
  students: { graded: { id: string }[]; open: { id: string }[] },
  storage?: SeedStorage,
) {
  // seeded before: keep those labs as they are, and add only the demo labs that are not there yet
  const existing = new Set((await db.selectFrom("labs").select("title").where("course_id", "=", courseId).execute()).map((l) => l.title));
  const now = Date.now();
  const covered = new Set<MistakeKey>();

  for (const [index, demo] of LABS.entries()) {
    if (existing.has(demo.title)) continue;
    const dates = {
      graded: { opensAt: new Date(now - (40 - index * 7) * DAY), dueAt: new Date(now - (26 - index * 7) * DAY) },
      open: { opensAt: new Date(now - 6 * DAY), dueAt: new Date(now + (8 + index) * DAY) },
      upcoming: { opensAt: new Date(now + 9 * DAY), dueAt: new Date(now + 23 * DAY) },
      draft: { opensAt: null, dueAt: null },
    }[demo.state];
    const labId = await insertLab(
      db,
      courseId,
      instructorId,
      {
        title: demo.title,
        templateKey: demo.template,
        spec: { template: demo.template, parameters: demo.spec },
        questions: withIds(demo.questions),
        policy: { relativeTolerance: 0.01, closeMultiple: 2, closeCredit: 0.5, instrumentAccuracyPercent: 0.5 },
        attemptsAllowed: 3,
        counting: "best",
        opensAt: dates.opensAt,
        dueAt: dates.dueAt,
        latePenaltyPercentPerDay: 10,
        lateFloorPercent: 50,
        showExpected: demo.showExpected,
        instructions: demo.instructions,
        safetyNotes: demo.safety,
        bench: demo.bench ?? "real",
      },
      demo.state === "draft" ? "draft" : "published",
    );
    if (demo.state === "draft" || demo.state === "upcoming") continue;
    const lab = toLab((await findLab(db, labId))!);
    const t = templates[lab.templateKey];
    // the template's recognised mistakes, then a prefix slip: the first students of the lab show one each
    const probe = drawVariant(lab.spec, "probe");
    const pending: MistakeKey[] = [
      ...MISTAKE_KEYS.filter((k) => k !== "prefix-slip" && lab.questions.some((q) => t.mistakes(probe, q.quantity).some((m) => m.key === k))),
      "prefix-slip",
    ];
    const submitters = demo.state === "graded" ? students.graded.slice(0, 30) : students.open.slice(0, 18);

    for (const [si2, student] of submitters.entries()) {
      const seed = `${lab.id}:${student.id}`;
      const params = drawVariant(lab.spec, seed);
      await db.insertInto("lab_variants").values({ lab_id: lab.id, user_id: student.id, seed, params: JSON.stringify(params) }).execute();
      const r = seededRandom(`demo-attempts:${seed}`);
      const attemptsMade = r() < 0.25 ? 2 : 1;
      for (let n = 1; n <= attemptsMade; n++) {
        const readings: Record<string, string | null> = {};
        for (const q of lab.questions) {
          let outcome: Outcome = n === 2 ? { kind: r() < 0.85 ? "correct" : "close" } : chooseOutcome(r);
          // the first students of each lab show the template's recognised mistakes, one each
          const numeric = typeof t.compute(params)[q.quantity] === "number";
          const forced =
            n === 1
              ? pending.find((k) => (k === "prefix-slip" ? numeric : t.mistakes(params, q.quantity).some((m) => m.key === k)))
              : undefined;
          if (forced) outcome = { kind: "mistake", key: forced };
          readings[q.id] = readingFor(t, params, q.quantity, outcome, Math.floor(r() * 4));
        }
        const uploadIds: string[] = [];
        const traces: StoredTrace[] = [];
        if (demo.traces && storage && si2 < 6 && n === 1) {
          const csv = squareWaveCsv({
            sleepCurrent: params.sleepCurrent as number,
            activeCurrent: params.activeCurrent as number,
            activeTime: params.activeTime as number,
            period: params.period as number,
            cycles: 4,
            sampleInterval: 0.001,
            units: { time: "ms", current: "mA" },
            garbageEvery: si2 === 0 ? 500 : undefined,
          });
          const bytes = new TextEncoder().encode(csv);
          const analysis = await analyzeTrace(Buffer.from(bytes), { batteryCapacity: params.batteryCapacity as number, usableFraction: params.usableFraction as number });
          const key = `${courseId}/${student.id}/${crypto.randomUUID()}.csv`;
          await storage.put(key, bytes, "text/csv");
          uploadIds.push(
            await insertUpload(db, {
              ownerId: student.id,
              courseId,
              labId: lab.id,
              kind: "trace",
              contentType: "text/csv",
              size: bytes.byteLength,
              sha256: crypto.createHash("sha256").update(bytes).digest("hex"),
              storageKey: key,
              originalName: `node-trace-${si2 + 1}.csv`,
              analysis,
            }),
          );
          traces.push(analysis as unknown as StoredTrace);
        }
        const result = gradeForLab(lab, params, readings, {}, traces);
        for (const res of result.results) {
          if (!res.mistake) continue;
          covered.add(res.mistake);
          if (pending.includes(res.mistake)) pending.splice(pending.indexOf(res.mistake), 1);
        }
        // one student in each graded lab submits a day and a half late
        const late = demo.state === "graded" && si2 === 7 && n === 1;
        const submittedAt = new Date((late ? lab.dueAt!.getTime() + 1.5 * DAY : (lab.opensAt?.getTime() ?? now) + (1 + r() * 5) * DAY + n * 3600_000));
        const record = attemptRecord({ lab, userId: student.id, number: n, idempotencyKey: `demo-${n}`, readings, measured: { typed: {}, values: {} }, uploadIds, params, result, submittedAt });
        // on a lab that allows either bench, every third student took the simulated one
        const simulated = demo.bench === "simulated" || (demo.bench === "either" && si2 % 3 === 0);
        const attemptId = await insertAttempt(db, { ...record, simulated });
        await insertGradeEvent(db, { attemptId, kind: "graded", pointsAfter: record.rawScore, scoreAfter: record.score, graderVersion: record.graderVersion, at: submittedAt });
      }
    }
  }
  return covered;
}
