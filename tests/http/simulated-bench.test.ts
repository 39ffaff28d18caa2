// The simulated bench over HTTP: the bench of a lab (seed, instrument, the student's own circuit), the replay
// of readings (equal to the module's for the same seed, run and time, which is what the lab page runs), who
// may replay whose, bad queries, the attempt's record of the simulated bench, and grading of readings taken on it.
import { beforeAll, describe, expect, it } from "vitest";
import { simulateReadings, type BenchCircuit } from "@/lib/simulation";
import type { InstrumentProfile } from "@/lib/instruments/profile";
import { addPerson, clientFor, courseWithPeople, fixedCircuitLab, publishedLab, sendAs, type Send } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
const as = {} as Record<"instructor" | "ta" | "student" | "peer" | "outsider", Send>;
let peerId: string;

/**
 * A lab on the teaching meter's 500 µA range: 0.4 V across a 1 kΩ load with the range's 100 Ω shunt in
 * series (lib/instruments/library.ts). By hand (PHYSICS.md §2): I_true = 0.4 V / 1 kΩ = 400.0 µA, with the
 * meter 0.4 V / 1.1 kΩ = 363.6 µA (ε = −9.091 %), V_B = 363.6 µA × 100 Ω = 36.36 mV.
 */
function burdenLab(bench: "real" | "simulated" | "either", title: string) {
  return fixedCircuitLab({
    title,
    bench,
    spec: {
      template: "shunt-burden",
      parameters: {
        supplyVoltage: { mode: "fixed", value: 0.4 },
        loadResistance: { mode: "fixed", value: 1000 },
        shuntResistance: { mode: "fixed", value: 100 },
      },
    },
    questions: [
      { quantity: "indicatedCurrent", kind: "bench", points: 4 },
      { quantity: "burdenVoltage", kind: "bench", points: 3 },
      { quantity: "trueCurrent", kind: "prediction", points: 3 },
    ],
  });
}

let simLab: string, eitherLab: string, realLab: string, drawnLab: string;

beforeAll(async () => {
  f = await courseWithPeople();
  const peer = await addPerson("bench-peer", { courseId: f.courseId, role: "student" });
  peerId = peer.id;
  const [instructor, ta, student, peerC, outsider] = await Promise.all(
    [f.people.instructor.email, f.people.ta.email, f.people.student.email, peer.email, f.people.outsider.email].map(clientFor),
  );
  Object.assign(as, { instructor: sendAs(instructor), ta: sendAs(ta), student: sendAs(student), peer: sendAs(peerC), outsider: sendAs(outsider) });
  [simLab, eitherLab, realLab] = await Promise.all([
    publishedLab(as.instructor, f.courseId, burdenLab("simulated", "Burden on the simulated bench")),
    publishedLab(as.instructor, f.courseId, burdenLab("either", "Burden on either bench")),
    publishedLab(as.instructor, f.courseId, burdenLab("real", "Burden on the real bench")),
  ]);
  // a lab whose load is drawn per student: each student's bench is their own circuit
  drawnLab = await publishedLab(
    as.instructor,
    f.courseId,
    fixedCircuitLab({
      title: "Drawn loads",
      bench: "simulated",
      spec: {
        template: "shunt-burden",
        parameters: {
          supplyVoltage: { mode: "fixed", value: 3.3 },
          loadResistance: { mode: "range", min: 1000, max: 10000, series: "E24" },
          shuntResistance: { mode: "fixed", value: 1 },
        },
      },
    }),
  );
});

interface Bench {
  seed: string;
  instrument: InstrumentProfile;
  circuit: BenchCircuit;
}

describe("GET /api/labs/{labId}/bench", () => {
  it("gives the student their own circuit, the lab's instrument and a seed", async () => {
    const r = await as.student("GET", `/api/labs/${drawnLab}/bench`);
    expect(r.status).toBe(200);
    const bench = r.body.bench as Bench;
    const handout = await as.student("GET", `/api/labs/${drawnLab}/handout`);
    expect(bench.circuit.supplyVoltage).toBe(3.3);
    expect(bench.circuit.loadResistance).toBe(handout.body.handout.params.loadResistance);
    expect(handout.body.handout.lab.bench).toBe("simulated");
    expect(bench.instrument.ranges.length).toBeGreaterThan(1);
    expect(bench.seed).toMatch(/^[0-9a-f]{32}$/);
    // another student has another seed
    const other = await as.peer("GET", `/api/labs/${drawnLab}/bench`);
    expect(other.body.bench.seed).not.toBe(bench.seed);
  });

  it("is not found on a lab taken on the real bench, and for outsiders", async () => {
    expect((await as.student("GET", `/api/labs/${realLab}/bench`)).status).toBe(404);
    expect((await as.outsider("GET", `/api/labs/${simLab}/bench`)).status).toBe(404);
  });
});

describe("GET /api/labs/{labId}/bench/readings", () => {
  it("replays exactly what the module shows for the same seed, range, filter and time", async () => {
    const bench = (await as.student("GET", `/api/labs/${simLab}/bench`)).body.bench as Bench;
    const r = await as.student("GET", `/api/labs/${simLab}/bench/readings?range=r500u&count=12&from=37.25`);
    expect(r.status).toBe(200);
    const local = simulateReadings(bench.seed, bench.instrument, bench.circuit, { range: "r500u", filter: true, from: 37.25, count: 12 });
    expect(r.body.readings).toEqual(local);
    expect(r.body.readings[0]).toMatchObject({ t: 37.25, unit: "A", range: "r500u" });
    const fast = await as.student("GET", `/api/labs/${simLab}/bench/readings?range=auto&count=40&from=3&rate=100&filter=off`);
    expect(fast.body.readings).toEqual(simulateReadings(bench.seed, bench.instrument, bench.circuit, { range: "auto", filter: false, from: 3, count: 40, rate: 100 }));
  });

  it("lets staff replay a student's readings with userId=, and refuses another student's (404)", async () => {
    const own = await as.student("GET", `/api/labs/${drawnLab}/bench/readings?range=r50m&count=5&from=10`);
    for (const staff of [as.ta, as.instructor]) {
      const r = await staff("GET", `/api/labs/${drawnLab}/bench/readings?range=r50m&count=5&from=10&userId=${f.people.student.id}`);
      expect(r.status).toBe(200);
      expect(r.body.readings).toEqual(own.body.readings);
    }
    expect((await as.peer("GET", `/api/labs/${drawnLab}/bench/readings?range=r50m&count=5&userId=${f.people.student.id}`)).status).toBe(404);
    expect((await as.student("GET", `/api/labs/${drawnLab}/bench/readings?range=r50m&count=5&userId=${peerId}`)).status).toBe(404);
    // staff naming someone who is no student of the course
    expect((await as.ta("GET", `/api/labs/${drawnLab}/bench/readings?range=r50m&userId=${f.people.outsider.id}`)).status).toBe(404);
    expect((await as.ta("GET", `/api/labs/${drawnLab}/bench/readings?range=r50m&userId=${f.people.instructor.id}`)).status).toBe(404);
  });

  it("answers 400 naming the field for a bad query", async () => {
    const bad: [string, string][] = [
      ["range=nope", "range"],
      ["range=", "range"],
      ["range=r50m&count=0", "count"],
      ["range=r50m&count=10001", "count"],
      ["range=r50m&count=2.5", "count"],
      ["range=r50m&count=abc", "count"],
      ["range=r50m&from=-1", "from"],
      ["range=r50m&from=Infinity", "from"],
      ["range=r50m&rate=0", "rate"],
      ["range=r50m&filter=maybe", "filter"],
      ["range=r50m&userId=not-a-uuid", "userId"],
      ["range=r50m%00x", "range"],
    ];
    for (const [q, field] of bad) {
      const r = await as.student("GET", `/api/labs/${simLab}/bench/readings?${q}`);
      expect(r.status, q).toBe(400);
      expect(Object.keys(r.body.error.fields ?? {}), q).toContain(field);
    }
  });
});

/** The settled mean of 20 display readings on a range, as a student reads the display. */
async function benchMean(send: Send, labId: string, range: string): Promise<number> {
  const r = await send("GET", `/api/labs/${labId}/bench/readings?range=${range}&count=21&from=100`);
  const values = (r.body.readings as { value: number }[]).slice(1).map((x) => x.value);
  return values.reduce((a, b) => a + b, 0) / values.length;
}

async function submit(send: Send, labId: string, answers: string[], extra: Record<string, unknown> = {}) {
  const h = await send("GET", `/api/labs/${labId}/handout`);
  const ids = (h.body.handout.questions as { id: string }[]).map((q) => q.id);
  return send("POST", `/api/labs/${labId}/attempts`, {
    idempotencyKey: `sim-${Date.now()}-${Math.random().toString(36).slice(2)}`,
    readings: Object.fromEntries(ids.map((id, i) => [id, answers[i]])),
    ...extra,
  });
}

describe("grading readings taken on the simulated bench", () => {
  it("gives full marks to a student who reads the bench and computes correctly, and records the simulated bench", async () => {
    const mean = await benchMean(as.student, simLab, "r500u");
    // the reading carries the loading: near 363.6 µA, far from 400.0 µA
    expect(Math.abs(mean - 363.6e-6)).toBeLessThan(0.01 * 363.6e-6);
    const indicated = `${(mean * 1e6).toFixed(2)} uA`;
    const burden = `${(mean * 100 * 1e3).toFixed(3)} mV`; // V_B = I × 100 Ω
    const r = await submit(as.student, simLab, [indicated, burden, "400 uA"]);
    expect(r.status).toBe(201);
    expect(r.body.attempt.score).toBe(10);
    expect(r.body.attempt.simulated).toBe(true);
    const gb = await as.instructor("GET", `/api/courses/${f.courseId}/gradebook`);
    const row = (gb.body.students as { userId: string; cells: Record<string, { simulated: boolean } | null> }[]).find((s) => s.userId === f.people.student.id)!;
    expect(row.cells[simLab]?.simulated).toBe(true);
  });

  it("flags readings that ignore the burden with the existing mistake", async () => {
    // V_s/R_L = 400 µA where the meter in the loop lets 363.6 µA through
    const r = await submit(as.peer, simLab, ["400 uA", "40 mV", "400 uA"]);
    expect(r.status).toBe(201);
    const results = r.body.attempt.results as { quantity: string; verdict: string; mistake?: { key: string } }[];
    expect(results.find((x) => x.quantity === "indicatedCurrent")).toMatchObject({ verdict: "mistake", mistake: { key: "ignored-burden" } });
    expect(results.find((x) => x.quantity === "burdenVoltage")).toMatchObject({ verdict: "mistake", mistake: { key: "ignored-burden" } });
  });

  it("records what the student says where the lab allows either, and refuses the simulated bench on a real-bench lab", async () => {
    const yes = await submit(as.student, eitherLab, ["363.6 uA", "36.36 mV", "400 uA"], { simulated: true });
    expect(yes.body.attempt.simulated).toBe(true);
    const no = await submit(as.student, eitherLab, ["363.6 uA", "36.36 mV", "400 uA"]);
    expect(no.body.attempt.simulated).toBe(false);
    const refused = await submit(as.student, realLab, ["363.6 uA", "36.36 mV", "400 uA"], { simulated: true });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toContain("simulated");
    const notBool = await submit(as.student, eitherLab, ["363.6 uA", "36.36 mV", "400 uA"], { simulated: "yes" });
    expect(notBool.status).toBe(400);
    expect(Object.keys(notBool.body.error.fields)).toContain("simulated");
  });

  it("lets the instructor choose the bench per lab; a bad choice names the field", async () => {
    expect((await as.instructor("PATCH", `/api/labs/${realLab}`, { bench: "lab-bench" })).status).toBe(400);
    const r = await as.instructor("PATCH", `/api/labs/${realLab}`, { bench: "either" });
    expect(r.status).toBe(200);
    expect((await as.student("GET", `/api/labs/${realLab}/bench`)).status).toBe(200);
    expect((await as.ta("PATCH", `/api/labs/${realLab}`, { bench: "real" })).status).toBe(403);
  });
});
