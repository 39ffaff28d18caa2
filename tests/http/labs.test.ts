// Labs over HTTP against the test server and its real PostgreSQL and local object storage.
// Expected values are computed here from the handout's circuit values with the textbook formulas
// (lib/grader/PHYSICS.md §2: I = Vs/(RL + Rsh), V_B = I·Rsh), independently of lib/grader.
import { beforeAll, describe, expect, it } from "vitest";
import { baseURL, Client } from "../support/http";
import { addPerson, clientsOf, clientFor, courseWithPeople, fixedCircuitLab, publishedLab as publishedLabAs, sendAs } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider" | "student2", Client>;
const anon = new Client();

const DAY = 24 * 3600 * 1000;

/** A drawn circuit (every student's own values) with a bench question and a late penalty. */
function burdenLab(over: Record<string, unknown> = {}) {
  return fixedCircuitLab({
    title: "Burden check",
    spec: {
      template: "shunt-burden",
      parameters: {
        supplyVoltage: { mode: "list", values: [3.3, 5] },
        // a shunt of at least 4.7 % of the load, so ignoring the burden is a visible mistake
        loadResistance: { mode: "range", min: 100, max: 470, series: "E24", tolerancePercent: 1 },
        shuntResistance: { mode: "range", min: 22, max: 47, series: "E12", tolerancePercent: 1 },
      },
    },
    questions: [
      { quantity: "indicatedCurrent", kind: "prediction", points: 4 },
      { quantity: "trueCurrent", kind: "prediction", points: 3 },
      { quantity: "burdenVoltage", kind: "bench", points: 3 },
    ],
    latePenaltyPercentPerDay: 10,
    lateFloorPercent: 50,
    safetyNotes: "Set the current limit first.",
    ...over,
  });
}

function publishedLab(over: Record<string, unknown> = {}): Promise<string> {
  return publishedLabAs(sendAs(as.instructor), f.courseId, burdenLab(over));
}

/** Independent arithmetic on the student's own values. */
async function expectedFor(c: Client, labId: string) {
  const h = await c.json(`/api/labs/${labId}/handout`);
  expect(h.status).toBe(200);
  const p = h.body.handout.params as { supplyVoltage: number; loadResistance: number; shuntResistance: number };
  const indicated = p.supplyVoltage / (p.loadResistance + p.shuntResistance);
  return { p, indicated, trueI: p.supplyVoltage / p.loadResistance, burden: indicated * p.shuntResistance, questions: h.body.handout.questions as { id: string; quantity: string }[] };
}

function key() {
  return `k-${Math.random().toString(36).slice(2)}-${Date.now()}`;
}

beforeAll(async () => {
  f = await courseWithPeople();
  const email = (await addPerson("student2", { courseId: f.courseId, name: "Second student" })).email;
  as = { ...(await clientsOf(f.people)), student2: await clientFor(email) };
});

describe("templates and lab authoring", () => {
  it("lists the ten circuit templates with parameters and quantities", async () => {
    expect((await anon.json("/api/templates")).status).toBe(401);
    const r = await as.student.json("/api/templates");
    expect(r.status).toBe(200);
    expect(r.body.templates.map((t: { key: string }) => t.key).sort()).toEqual(
      [
        "bidirectional-offset",
        "duty-cycle",
        "filter-noise",
        "leakage-guard",
        "offset-thermal",
        "range-resolution",
        "sampling-burst",
        "shunt-burden",
        "shunt-selection",
        "uncertainty",
      ],
    );
  });

  it("only the instructor creates labs; a bad lab is a 400 naming the fields", async () => {
    expect((await as.ta.post(`/api/courses/${f.courseId}/labs`, burdenLab())).status).toBe(403);
    expect((await as.student.post(`/api/courses/${f.courseId}/labs`, burdenLab())).status).toBe(403);
    expect((await as.outsider.post(`/api/courses/${f.courseId}/labs`, burdenLab())).status).toBe(404);
    const bad = await as.instructor.post(
      `/api/courses/${f.courseId}/labs`,
      burdenLab({ title: "", questions: [{ quantity: "cutoffFrequency", kind: "prediction", points: 1 }], dueAt: new Date(Date.now() - 3 * DAY).toISOString() }),
    );
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(["title", "questions.0.quantity", "dueAt"]));
  });

  it("students do not see drafts; they see the lab once published", async () => {
    const created = await as.instructor.post(`/api/courses/${f.courseId}/labs`, burdenLab({ title: "Draft one" }));
    const id = created.body.lab.id;
    expect((await as.student.json(`/api/labs/${id}`)).status).toBe(404);
    const list = await as.student.json(`/api/courses/${f.courseId}/labs`);
    expect(list.body.labs.map((l: { id: string }) => l.id)).not.toContain(id);
    await as.instructor.json(`/api/labs/${id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ status: "published" }) });
    const seen = await as.student.json(`/api/labs/${id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.lab.spec).toBeUndefined(); // students do not get the draw ranges
    // publishing alone changes nothing else: instructions, cautions and policy stay
    expect(seen.body.lab.instructions).toBe("Measure it.");
    expect(seen.body.lab.safetyNotes).toBe("Set the current limit first.");
    const staff = await as.instructor.json(`/api/labs/${id}`);
    expect(staff.body.lab.policy).toMatchObject({ relativeTolerance: 0.01 });
  });
});

describe("handouts", () => {
  it("draws each student's values once and returns the same values on every read", async () => {
    const id = await publishedLab();
    const a1 = await as.student.json(`/api/labs/${id}/handout`);
    const a2 = await as.student.json(`/api/labs/${id}/handout`);
    expect(a2.body.handout.params).toEqual(a1.body.handout.params);
    const p = a1.body.handout.params;
    expect([3.3, 5]).toContain(p.supplyVoltage);
    expect(p.loadResistance).toBeGreaterThanOrEqual(100);
    expect(p.loadResistance).toBeLessThanOrEqual(470);
    // E24 mantissas (IEC 60063): the drawn load is a standard value
    const e24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];
    const mantissa = p.loadResistance / 10 ** Math.floor(Math.log10(p.loadResistance));
    expect(e24.some((m) => Math.abs(m - mantissa) < 1e-9)).toBe(true);
    expect((await as.outsider.json(`/api/labs/${id}/handout`)).status).toBe(404);
  });
});

describe("submitting attempts", () => {
  it("never grades an unreadable or wrong-kind answer: a 400 naming readings.{questionId}, and no attempt used", async () => {
    const id = await publishedLab();
    const e = await expectedFor(as.student, id);
    const q = Object.fromEntries(e.questions.map((x) => [x.quantity, x.id]));
    for (const [text, pattern] of [
      [`${e.burden.toPrecision(4)} A`, /current.*voltage/], // a current where a voltage is asked
      ["3,267 mV", /two ways/], // ambiguous comma
      ["twelve", /Could not read/],
    ] as const) {
      const r = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: { [q.indicatedCurrent]: "1 mA", [q.burdenVoltage]: text } });
      expect(r.status, text).toBe(400);
      expect(Object.keys(r.body.error.fields)).toEqual([`readings.${q.burdenVoltage}`]);
      expect(r.body.error.fields[`readings.${q.burdenVoltage}`][0]).toMatch(pattern);
    }
    const list = await as.student.json(`/api/labs/${id}/attempts`);
    expect(list.body.attempts).toHaveLength(0);
    // the same answers, readable, make the first attempt
    const ok = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: { [q.indicatedCurrent]: "1 mA", [q.burdenVoltage]: "3 mv" } });
    expect(ok.status).toBe(201);
    expect(ok.body.attempt.number).toBe(1);
  });

  it("grades correct, close, mistaken and missing answers at once", async () => {
    const id = await publishedLab();
    const e = await expectedFor(as.student, id);
    const q = Object.fromEntries(e.questions.map((x) => [x.quantity, x.id]));
    const r = await as.student.post(`/api/labs/${id}/attempts`, {
      idempotencyKey: key(),
      readings: {
        [q.indicatedCurrent]: `${(e.indicated * 1000).toPrecision(4)} mA`,
        [q.trueCurrent]: `${(e.indicated * 1e6).toPrecision(4)} uA`, // the burden ignored: Vs/(RL+Rsh) for the true current
        [q.burdenVoltage]: "",
      },
    });
    expect(r.status).toBe(201);
    const byQ = Object.fromEntries(r.body.attempt.results.map((x: { quantity: string }) => [x.quantity, x]));
    expect(byQ.indicatedCurrent.verdict).toBe("correct");
    expect(byQ.indicatedCurrent.readAs).toMatch(/mA$/);
    expect(byQ.trueCurrent.verdict).toBe("mistake");
    expect(byQ.trueCurrent.mistake.key).toBe("ignored-burden");
    expect(byQ.burdenVoltage.verdict).toBe("missing");
    expect(r.body.attempt.score).toBe(4);
    expect(r.body.attempt.maxScore).toBe(10);
    expect(r.body.attempt.graderVersion).toMatch(/^\d+\.\d+\.\d+$/);
    const staff = await as.ta.json(`/api/attempts/${r.body.attempt.id}`);
    expect(staff.body.attempt.results[0].expected).toBeCloseTo(e.indicated, 12);
  });

  it("gives partial credit to a close answer and none to a wrong one; a missing answer is missing", async () => {
    const id = await publishedLab();
    const e = await expectedFor(as.student2, id);
    const q = Object.fromEntries(e.questions.map((x) => [x.quantity, x.id]));
    const r = await as.student2.post(`/api/labs/${id}/attempts`, {
      idempotencyKey: key(),
      readings: { [q.indicatedCurrent]: `${(e.indicated * 1.015).toExponential(4)} A`, [q.trueCurrent]: `${(e.trueI * 1.6).toExponential(4)} A`, [q.burdenVoltage]: "" },
    });
    expect(r.status).toBe(201);
    const byQ = Object.fromEntries(r.body.attempt.results.map((x: { quantity: string }) => [x.quantity, x]));
    expect(byQ.indicatedCurrent.verdict).toBe("close");
    expect(byQ.indicatedCurrent.points).toBe(2);
    expect(byQ.trueCurrent.verdict).toBe("wrong");
    expect(byQ.burdenVoltage.verdict).toBe("missing");
  });

  it("makes one attempt from a retried request with the same idempotency key", async () => {
    const id = await publishedLab();
    const body = { idempotencyKey: key(), readings: {} };
    const [a, b] = await Promise.all([as.student.post(`/api/labs/${id}/attempts`, body), as.student.post(`/api/labs/${id}/attempts`, body)]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.attempt.id).toBe(b.body.attempt.id);
    const list = await as.student.json(`/api/labs/${id}/attempts`);
    expect(list.body.attempts).toHaveLength(1);
  });

  it("refuses an attempt beyond the limit with 409, keeping the earlier ones", async () => {
    const id = await publishedLab({ attemptsAllowed: 1 });
    expect((await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} })).status).toBe(201);
    const second = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} });
    expect(second.status).toBe(409);
    expect(second.body.error.message).toMatch(/all 1 attempt/);
    expect((await as.student.json(`/api/labs/${id}/attempts`)).body.attempts).toHaveLength(1);
  });

  it("applies the late penalty per day down to the floor", async () => {
    // due 2.5 days ago at 30 % a day: 3 days late → 90 %, limited by the 50 % floor to a 50 % penalty
    // (the default close would be ceil(50 / 30) = 2 days after the due date: this lab closes later)
    const id = await publishedLab({
      opensAt: new Date(Date.now() - 10 * DAY).toISOString(),
      dueAt: new Date(Date.now() - 2.5 * DAY).toISOString(),
      closesAt: new Date(Date.now() + DAY).toISOString(),
      latePenaltyPercentPerDay: 30,
      lateFloorPercent: 50,
    });
    const e = await expectedFor(as.student, id);
    const q = Object.fromEntries(e.questions.map((x) => [x.quantity, x.id]));
    const r = await as.student.post(`/api/labs/${id}/attempts`, {
      idempotencyKey: key(),
      readings: { [q.indicatedCurrent]: `${e.indicated} A`, [q.trueCurrent]: `${e.trueI} A`, [q.burdenVoltage]: `${e.burden} V` },
    });
    expect(r.status).toBe(201);
    expect(r.body.attempt.lateDays).toBe(3);
    expect(r.body.attempt.penaltyPercent).toBe(50);
    expect(r.body.attempt.rawScore).toBe(10);
    expect(r.body.attempt.score).toBe(5);
  });

  it("refuses a lab that has not opened yet, and bad bodies with 400 naming the field", async () => {
    const id = await publishedLab({ opensAt: new Date(Date.now() + 3 * DAY).toISOString(), dueAt: new Date(Date.now() + 9 * DAY).toISOString() });
    const early = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} });
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/opens on/);
    const open = await publishedLab();
    const bad = await as.student.post(`/api/labs/${open}/attempts`, { idempotencyKey: key(), readings: { nope: "1 A" }, measured: { loadResistance: "12 V" } });
    expect(bad.status).toBe(400);
    const missingKey = await as.student.post(`/api/labs/${open}/attempts`, { readings: {} });
    expect(missingKey.status).toBe(400);
    expect(Object.keys(missingKey.body.error.fields)).toContain("idempotencyKey");
    const measured = await as.student.post(`/api/labs/${open}/attempts`, { idempotencyKey: key(), readings: {}, measured: { loadResistance: "12 V" } });
    expect(measured.status).toBe(400);
    expect(Object.keys(measured.body.error.fields)).toEqual(["measured.loadResistance"]);
    expect((await as.student.json(`/api/labs/${open}/attempts`)).body.attempts).toHaveLength(0);
  });

  it("recomputes bench expected values from the measured component values", async () => {
    const id = await publishedLab();
    const e = await expectedFor(as.student2, id);
    const q = Object.fromEntries(e.questions.map((x) => [x.quantity, x.id]));
    const shunt = e.p.shuntResistance * 1.04; // the student's shunt measures 4 % high
    const burden = (e.p.supplyVoltage / (e.p.loadResistance + shunt)) * shunt;
    const r = await as.student2.post(`/api/labs/${id}/attempts`, {
      idempotencyKey: key(),
      readings: { [q.burdenVoltage]: `${burden} V` },
      measured: { shuntResistance: `${shunt} ohm` },
    });
    expect(r.status).toBe(201);
    expect(r.body.attempt.results.find((x: { quantity: string }) => x.quantity === "burdenVoltage").verdict).toBe("correct");
    const staff = await as.ta.json(`/api/attempts/${r.body.attempt.id}`);
    const res = staff.body.attempt.results.find((x: { quantity: string }) => x.quantity === "burdenVoltage");
    expect(res.expected).toBeCloseTo(burden, 9);
  });
});

describe("who can read attempts", () => {
  it("another student and an outsider get 404; the TA sees every attempt", async () => {
    const id = await publishedLab();
    const mine = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} });
    const attemptId = mine.body.attempt.id;
    expect((await as.student.json(`/api/attempts/${attemptId}`)).status).toBe(200);
    expect((await as.student2.json(`/api/attempts/${attemptId}`)).status).toBe(404);
    expect((await as.outsider.json(`/api/attempts/${attemptId}`)).status).toBe(404);
    expect((await anon.json(`/api/attempts/${attemptId}`)).status).toBe(401);
    expect((await as.ta.json(`/api/attempts/${attemptId}`)).status).toBe(200);
    expect((await as.student2.json(`/api/labs/${id}/attempts`)).body.attempts).toHaveLength(0);
    const all = await as.ta.json(`/api/labs/${id}/attempts`);
    expect(all.body.attempts.map((a: { id: string }) => a.id)).toContain(attemptId);
    const one = await as.ta.json(`/api/labs/${id}/attempts?userId=${f.people.student.id}`);
    expect(one.body.attempts.map((a: { studentId: string }) => a.studentId)).toEqual([f.people.student.id]);
    expect((await as.ta.json(`/api/labs/${id}/attempts?userId=nope`)).status).toBe(400);
    // a student cannot widen their view with the filter
    const sneaky = await as.student2.json(`/api/labs/${id}/attempts?userId=${f.people.student.id}`);
    expect(sneaky.body.attempts).toHaveLength(0);
  });

  it("hides expected values from students until the due date when the lab says so", async () => {
    const id = await publishedLab({ showExpected: "after_due" });
    const e = await expectedFor(as.student, id);
    const r = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: { [e.questions[0].id]: `${e.indicated * 2} A` } });
    const res = r.body.attempt.results[0];
    expect(r.body.attempt.expectedShown).toBe(false);
    expect(res.expected).toBeUndefined();
    expect(res.solution).toBeUndefined();
    expect(JSON.stringify(r.body)).not.toContain(String(e.indicated.toPrecision(3)).replace(/0+$/, ""));
    const staff = await as.ta.json(`/api/attempts/${r.body.attempt.id}`);
    expect(staff.body.attempt.results[0].expected).toBeCloseTo(e.indicated, 12);
  });

  it("lets the owner ask for a review with a message", async () => {
    const id = await publishedLab();
    const a = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} });
    expect((await as.student.post(`/api/attempts/${a.body.attempt.id}/review`, { message: "" })).status).toBe(400);
    expect((await as.ta.post(`/api/attempts/${a.body.attempt.id}/review`, { message: "please look" })).status).toBe(403);
    const ok = await as.student.post(`/api/attempts/${a.body.attempt.id}/review`, { message: "My shunt measured 4 % high." });
    expect(ok.status).toBe(201);
    const after = await as.student.json(`/api/attempts/${a.body.attempt.id}`);
    expect(after.body.attempt.reviewMessage).toBe("My shunt measured 4 % high.");
  });
});

describe("no expected value, band or solution while points can still be earned", () => {
  const patch = (id: string, body: unknown) =>
    as.instructor.json(`/api/labs/${id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

  /** Asserts what a student's views of an attempt reveal: the POST answer, GET one, GET the list and the feedback page. */
  async function studentSees(c: Client, labId: string, attemptId: string, shown: boolean, indicated: number) {
    const one = await c.json(`/api/attempts/${attemptId}`);
    const list = await c.json(`/api/labs/${labId}/attempts`);
    const fromList = list.body.attempts.find((a: { id: string }) => a.id === attemptId);
    for (const a of [one.body.attempt, fromList]) {
      expect(a.expectedShown).toBe(shown);
      for (const r of a.results) {
        if (shown) {
          expect(r.expected).toBeDefined();
          expect(r.band === null || Array.isArray(r.band)).toBe(true);
          expect(r.solution?.length).toBeGreaterThan(0);
        } else {
          expect(r.expected).toBeUndefined();
          expect(r.band).toBeUndefined();
          expect(r.solution).toBeUndefined();
          expect(r.method).toBeUndefined();
        }
      }
    }
    const indicatedResult = one.body.attempt.results.find((r: { quantity: string }) => r.quantity === "indicatedCurrent");
    if (shown) expect(indicatedResult.expected).toBeCloseTo(indicated, 12);
    // the feedback page: worked solutions are typeset on the server only when they may be shown
    const page = await c.fetch(`/attempts/${attemptId}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    if (shown) expect(html).toContain("katex");
    else expect(html).not.toContain("katex");
  }

  it("after each attempt: hidden while attempts are left, shown with the last one; staff always see them", async () => {
    const id = await publishedLab({ showExpected: "after_attempt", attemptsAllowed: 2 });
    const e = await expectedFor(as.student, id);
    const q = Object.fromEntries(e.questions.map((x) => [x.quantity, x.id]));
    const first = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: { [q.indicatedCurrent]: `${e.indicated * 2} A` } });
    expect(first.status).toBe(201);
    expect(first.body.attempt.expectedShown).toBe(false);
    expect(first.body.attempt.results[0].expected).toBeUndefined();
    expect(first.text).not.toContain(String(e.indicated));
    await studentSees(as.student, id, first.body.attempt.id, false, e.indicated);
    const staff = await as.ta.json(`/api/attempts/${first.body.attempt.id}`);
    expect(staff.body.attempt.results[0].expected).toBeCloseTo(e.indicated, 12);
    const staffPage = await as.ta.fetch(`/attempts/${first.body.attempt.id}`);
    expect(await staffPage.text()).toContain("katex");

    const last = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} });
    expect(last.status).toBe(201);
    expect(last.body.attempt.expectedShown).toBe(true);
    // attempts used up: the first attempt's expected values appear too
    await studentSees(as.student, id, first.body.attempt.id, true, e.indicated);
  });

  for (const showExpected of ["after_due", "after_attempt"] as const) {
    it(`"${showExpected}": after the due date while late attempts still earn points, still hidden; once the lab closes, shown`, async () => {
      // due half a day ago, 10 % a day down to a 50 % floor: accepts late attempts for 5 days after the due date
      const id = await publishedLab({
        showExpected,
        opensAt: new Date(Date.now() - 10 * DAY).toISOString(),
        dueAt: new Date(Date.now() - DAY / 2).toISOString(),
      });
      const lab = await as.student.json(`/api/labs/${id}`);
      const due = new Date(lab.body.lab.dueAt).getTime();
      // the default close, from the late rule by hand: (100 − 50) / 10 = 5 days after the due date
      expect(new Date(lab.body.lab.closesAt).getTime()).toBe(due + 5 * DAY);
      const e = await expectedFor(as.student, id);
      const q = Object.fromEntries(e.questions.map((x) => [x.quantity, x.id]));
      const late = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: { [q.indicatedCurrent]: "1 mA" } });
      expect(late.status).toBe(201);
      expect(late.body.attempt.lateDays).toBe(1);
      expect(late.body.attempt.expectedShown).toBe(false);
      await studentSees(as.student, id, late.body.attempt.id, false, e.indicated);

      // the instructor closes the lab now: no attempt is accepted, and the expected values appear
      const closed = await patch(id, { closesAt: new Date(Date.now() - 60_000).toISOString() });
      expect(closed.status).toBe(200);
      await studentSees(as.student, id, late.body.attempt.id, true, e.indicated);
      const refused = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} });
      expect(refused.status).toBe(409);
      expect(refused.body.error.message).toMatch(/closed/);
      expect((await as.student.json(`/api/labs/${id}/attempts`)).body.attempts).toHaveLength(1);
    });
  }

  it("a close before the due date is refused with a 400 naming the field", async () => {
    const id = await publishedLab();
    const bad = await patch(id, { closesAt: new Date(Date.now() + DAY).toISOString() });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain("closesAt");
  });

  it("the handout and the labs list show the close; the list says closed only when no attempt is accepted", async () => {
    const lateId = await publishedLab({ title: "Late but open", opensAt: new Date(Date.now() - 10 * DAY).toISOString(), dueAt: new Date(Date.now() - DAY).toISOString() });
    const closedId = await publishedLab({
      title: "Over and done",
      opensAt: new Date(Date.now() - 20 * DAY).toISOString(),
      dueAt: new Date(Date.now() - 10 * DAY).toISOString(),
    });
    const handout = await as.student.fetch(`/labs/${lateId}`);
    const html = await handout.text();
    expect(html).toMatch(/Closes: .*late attempts are accepted until then/);
    expect(html).toContain("never while points can still be earned");
    const closedPage = await (await as.student.fetch(`/labs/${closedId}`)).text();
    expect(closedPage).toContain("accepts no more attempts");
    expect(closedPage).not.toContain("Submit for grading");
    const list = await (await as.student.fetch(`/courses/${f.courseId}/labs`)).text();
    const row = (labId: string) => list.slice(list.indexOf(`data-lab="${labId}"`), list.indexOf("</tr>", list.indexOf(`data-lab="${labId}"`)));
    expect(row(lateId)).toContain('data-state="late"');
    expect(row(lateId)).not.toContain('data-state="closed"');
    expect(row(closedId)).toContain('data-state="closed"');
  });
});

describe("editing a published lab with attempts", () => {
  it("recomputes every attempt in a background job and reports progress", async () => {
    const id = await publishedLab();
    const e = await expectedFor(as.student, id);
    const off = await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: { [e.questions[0].id]: `${e.indicated * 1.03} A` } });
    expect(off.body.attempt.results[0].verdict).toBe("wrong"); // 3 % off with a 1 % tolerance (2× close band)
    const lab = await as.instructor.json(`/api/labs/${id}`);
    const questions = lab.body.lab.questions.map((q: { tolerancePercent?: number }, i: number) => (i === 0 ? { ...q, tolerancePercent: 5 } : q));
    const patch = await as.instructor.json(`/api/labs/${id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ questions }) });
    expect(patch.status).toBe(200);
    expect(patch.body.regrade).toMatchObject({ total: 1 });
    let status = "";
    for (let i = 0; i < 180 && status !== "done"; i++) { // up to 90 s on a loaded machine
      await new Promise((r) => setTimeout(r, 500));
      status = (await as.instructor.json(`/api/labs/${id}`)).body.regrade.status;
    }
    expect(status).toBe("done");
    const again = await as.student.json(`/api/attempts/${off.body.attempt.id}`);
    expect(again.body.attempt.results[0].verdict).toBe("correct");
    expect((await as.instructor.json(`/api/labs/${id}`)).body.lab.version).toBe(2);
  });
});

describe("editing without changing the grading", () => {
  it("recomputes nothing when only the wording changes, even if the grading fields are sent back as they were", async () => {
    const id = await publishedLab();
    await as.student.post(`/api/labs/${id}/attempts`, { idempotencyKey: key(), readings: {} });
    const lab = (await as.instructor.json(`/api/labs/${id}`)).body.lab;
    // the same questions and policy, keys in another order and the policy's defaults spelled out
    const questions = lab.questions.map((q: Record<string, unknown>) => Object.fromEntries(Object.entries(q).reverse()));
    const policy = { closeCredit: 0.5, closeMultiple: 2, ...lab.policy };
    const r = await as.instructor.json(`/api/labs/${id}`, {
      method: "PATCH",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ title: "Burden check (reworded)", instructions: "Measure it carefully.", questions, policy }),
    });
    expect(r.status).toBe(200);
    expect(r.body.regrade).toBeNull();
    expect(r.body.lab.version).toBe(1);
    expect(r.body.lab.title).toBe("Burden check (reworded)");
  });
});

describe("changing dates", () => {
  it("moves the due date of a lab with a PATCH", async () => {
    const id = await publishedLab();
    const dueAt = new Date(Date.now() + 20 * DAY);
    dueAt.setMilliseconds(0);
    const r = await as.instructor.json(`/api/labs/${id}`, {
      method: "PATCH",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ dueAt: dueAt.toISOString() }),
    });
    expect(r.status).toBe(200);
    expect(new Date(r.body.lab.dueAt).getTime()).toBe(dueAt.getTime());
    const early = await as.instructor.json(`/api/labs/${id}`, {
      method: "PATCH",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ dueAt: new Date(Date.now() - 30 * DAY).toISOString() }),
    });
    expect(early.status).toBe(400);
    expect(Object.keys(early.body.error.fields)).toEqual(["dueAt"]);
  });
});

describe("uploads", () => {
  async function upload(c: Client, labId: string, bytes: Uint8Array, name: string, type = "application/octet-stream") {
    const form = new FormData();
    form.set("labId", labId);
    form.set("file", new Blob([new Uint8Array(bytes)], { type }), name);
    return c.json("/api/uploads", { method: "POST", body: form });
  }
  // the eight-byte PNG signature (ISO/IEC 15948, 5.2) followed by an IHDR chunk
  const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde]);

  it("stores a PNG with its SHA-256 and serves it by a short-lived signed URL to the owner and staff only", async () => {
    const id = await publishedLab();
    const r = await upload(as.student, id, png, "scope.png", "text/plain");
    expect(r.status).toBe(201);
    expect(r.body.upload.kind).toBe("image");
    expect(r.body.upload.contentType).toBe("image/png");
    const { createHash } = await import("node:crypto");
    expect(r.body.upload.sha256).toBe(createHash("sha256").update(png).digest("hex"));
    const view = await as.student.json(`/api/uploads/${r.body.upload.id}`);
    expect(view.status).toBe(200);
    expect(view.body.upload.urlExpiresInSeconds).toBeLessThanOrEqual(60);
    const file = await fetch(view.body.upload.url);
    expect(new Uint8Array(await file.arrayBuffer())).toEqual(png);
    // never shown inline from the app's origin: the URL is the object store's, answered as a download
    expect(new URL(view.body.upload.url).origin).not.toBe(new URL(baseURL).origin);
    expect(file.headers.get("content-disposition")).toBe('attachment; filename="scope.png"');
    expect((await as.ta.json(`/api/uploads/${r.body.upload.id}`)).status).toBe(200);
    expect((await as.student2.json(`/api/uploads/${r.body.upload.id}`)).status).toBe(404);
    expect((await as.outsider.json(`/api/uploads/${r.body.upload.id}`)).status).toBe(404);
  });

  it("refuses a file of the wrong type whatever its name says, and an oversize one, with clear messages", async () => {
    const id = await publishedLab();
    const pdf = new TextEncoder().encode("%PDF-1.7\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n");
    const wrong = await upload(as.student, id, pdf, "capture.png", "image/png");
    expect(wrong.status).toBe(415);
    expect(wrong.body.error.message).toMatch(/PNG or JPEG.*CSV/);
    expect(wrong.body.error.fields).toHaveProperty("file");
    const big = new Uint8Array(10 * 1024 * 1024 + 1024);
    big.set(png);
    const over = await upload(as.student, id, big, "huge.png");
    expect(over.status).toBe(413);
    expect(over.body.error.message).toMatch(/limit is 10 MB|10 MB limit/);
  });

  it("analyses a trace CSV with garbage lines, counting the bad rows, and notes agreement with the typed average", async () => {
    const dutyLab = await as.instructor.post(`/api/courses/${f.courseId}/labs`, {
      ...burdenLab(),
      title: "Duty cycle",
      templateKey: "duty-cycle",
      spec: {
        template: "duty-cycle",
        parameters: {
          sleepCurrent: { mode: "fixed", value: 2e-6 },
          activeCurrent: { mode: "fixed", value: 0.02 },
          activeTime: { mode: "fixed", value: 0.01 },
          period: { mode: "fixed", value: 1 },
          batteryCapacity: { mode: "fixed", value: 792 },
          usableFraction: { mode: "fixed", value: 0.8 },
        },
      },
      questions: [{ quantity: "averageCurrent", kind: "bench", points: 5 }],
    });
    expect(dutyLab.status).toBe(201);
    const labId = dutyLab.body.lab.id;
    await as.instructor.json(`/api/labs/${labId}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ status: "published" }) });
    // 3 periods of 1 s sampled every 1 ms: 20 mA for 10 ms, 2 µA otherwise, plus four garbage lines
    const lines = ["time_s,current_A"];
    for (let k = 0; k <= 3000; k++) {
      const t = k / 1000;
      lines.push(`${t.toFixed(3)},${t % 1 < 0.01 - 1e-9 ? 0.02 : 2e-6}`);
      if (k === 100) lines.push("oops,not a number");
      if (k === 200) lines.push("0.150,");
      if (k === 300) lines.push("time_s,current_A");
      if (k === 400) lines.push("0.001,0.5");
    }
    const csv = new TextEncoder().encode(lines.join("\n") + "\n");
    const up = await upload(as.student, labId, csv, "trace.csv", "text/csv");
    expect(up.status).toBe(201);
    expect(up.body.upload.kind).toBe("trace");
    expect(up.body.upload.analysis.badRows).toBe(4);
    // lib/grader/PHYSICS.md §8a [FORMULA]: Ī = D·I_a + (1 − D)·I_s = 0.01·20 mA + 0.99·2 µA = 202.0 µA
    expect(up.body.upload.analysis.averageCurrent).toBeCloseTo(202e-6, 7);
    const r = await as.student.post(`/api/labs/${labId}/attempts`, { idempotencyKey: key(), readings: { q1: "202 uA" }, uploadIds: [up.body.upload.id] });
    expect(r.status).toBe(201);
    expect(r.body.attempt.results[0].verdict).toBe("correct");
    expect(r.body.attempt.results[0].traceNote).toMatch(/agrees/);
    // someone else's upload cannot be attached
    const theirs = await as.student2.post(`/api/labs/${labId}/attempts`, { idempotencyKey: key(), readings: {}, uploadIds: [up.body.upload.id] });
    expect(theirs.status).toBe(400);
    expect(theirs.body.error.fields).toHaveProperty("uploadIds");
  });
});
