// The bench parts list against real PostgreSQL: reading it stores nothing (a read never writes); the
// publish job draws every student's circuit, and then its counts equal a count over the stored circuits.
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { findLab } from "@/db/queries/labs";
import { drawForEveryone } from "@/lib/labs/draws";
import { benchParts } from "@/lib/labs/parts-list";
import { toLab } from "@/lib/labs/grading";
import { partsCsv } from "@/lib/labs/parts";
import Papa from "papaparse";

describe("bench parts list", () => {
  it("counts every resistor of every student's circuit per value and per section", async () => {
    const course = await db
      .insertInto("courses")
      .values({ code: "P-1", title: "Parts", term: "S", institution: "I", join_code: "P-JOIN" })
      .returning("id")
      .executeTakeFirstOrThrow();
    const sections = ["A", "A", "A", "B", "B", "B", "B", null, "A", "B", "B", "A"];
    const students: { id: string; section: string | null }[] = [];
    for (const [i, section] of sections.entries()) {
      const u = await db.insertInto("users").values({ email: `parts${i}@college.example`, name: `Student ${i}`, password_hash: "x" }).returning("id").executeTakeFirstOrThrow();
      await db.insertInto("memberships").values({ course_id: course.id, user_id: u.id, role: "student", section }).execute();
      students.push({ id: u.id, section });
    }
    // a TA is not a student: no circuit of theirs is stocked
    const ta = await db.insertInto("users").values({ email: "ta.parts@college.example", name: "TA", password_hash: "x" }).returning("id").executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ course_id: course.id, user_id: ta.id, role: "ta" }).execute();
    const lab = await db
      .insertInto("labs")
      .values({
        course_id: course.id,
        title: "Burden",
        template_key: "shunt-burden",
        status: "published",
        spec: JSON.stringify({
          template: "shunt-burden",
          parameters: {
            supplyVoltage: { mode: "fixed", value: 5 },
            loadResistance: { mode: "range", min: 100, max: 470, series: "E6", tolerancePercent: 1 },
            shuntResistance: { mode: "list", values: [10, 22], tolerancePercent: 1 },
          },
        }),
        questions: JSON.stringify([{ id: "q1", quantity: "trueCurrent", kind: "prediction", points: 1 }]),
        policy: "{}",
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    // one student opened the lab already: their stored circuit is the one stocked
    await db.insertInto("lab_variants").values({ lab_id: lab.id, user_id: students[0].id, seed: "opened", params: JSON.stringify({ supplyVoltage: 5, loadResistance: 330, shuntResistance: 22 }) }).execute();

    const storedDraws = async () => (await db.selectFrom("lab_variants").select("user_id").where("lab_id", "=", lab.id).execute()).length;
    // reading the list before the publish job ran counts the one stored circuit and stores nothing
    const early = await benchParts(toLab((await findLab(db, lab.id))!));
    expect(early).toMatchObject({ students: 12, drawn: 1 });
    expect(await storedDraws()).toBe(1);

    // the publish job draws the other eleven (the opened one is kept), and a second run draws none
    expect(await drawForEveryone(lab.id)).toBe(11);
    expect(await drawForEveryone(lab.id)).toBe(0);
    const list = await benchParts(toLab((await findLab(db, lab.id))!));
    expect(list).toMatchObject({ students: 12, drawn: 12 });

    // the count made here, from the stored circuits
    const stored = await db.selectFrom("lab_variants").select(["user_id", "params"]).where("lab_id", "=", lab.id).execute();
    expect(stored).toHaveLength(12);
    expect(stored.find((v) => v.user_id === students[0].id)!.params).toEqual({ supplyVoltage: 5, loadResistance: 330, shuntResistance: 22 });
    const expected = new Map<number, Record<string, number>>();
    for (const v of stored) {
      const section = students.find((s) => s.id === v.user_id)!.section ?? "no section";
      const p = v.params as Record<string, number>;
      for (const value of [p.loadResistance, p.shuntResistance]) {
        const row = expected.get(value) ?? {};
        row[section] = (row[section] ?? 0) + 1;
        expected.set(value, row);
      }
    }
    expect(new Map(list.rows.map((r) => [r.value, r.bySection]))).toEqual(expected);
    for (const r of list.rows) expect(r.total).toBe(Object.values(r.bySection).reduce((a, b) => a + b, 0));
    expect(list.rows.reduce((a, r) => a + r.total, 0)).toBe(24); // two resistors per circuit
    expect(list.sections).toEqual(["A", "B", "no section"]);
    // E6 values between 100 and 470 ohm (IEC 60063: 100, 150, 220, 330, 470) and the listed shunts
    for (const r of list.rows) expect([10, 22, 100, 150, 220, 330, 470]).toContain(r.value);

    // the CSV says the same
    const csv = Papa.parse<Record<string, string>>(partsCsv(list.rows, list.sections), { header: true, skipEmptyLines: true });
    expect(csv.data.map((d) => [Number(d.value_ohm), Number(d.total), Number(d["section A"])])).toEqual(list.rows.map((r) => [r.value, r.total, r.bySection.A ?? 0]));

    // reading again stores nothing and counts the same
    const again = await benchParts(toLab((await findLab(db, lab.id))!));
    expect(await storedDraws()).toBe(12);
    expect(again.rows).toEqual(list.rows);
  });
});
