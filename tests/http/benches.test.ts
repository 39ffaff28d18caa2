// Benches over HTTP: the arrangement's exact shapes, who may read and replace it, bad arrangements refused
// naming the field with nothing changed, the roster CSV's bench column, and the student's bench on the
// course home.
import { beforeAll, describe, expect, it } from "vitest";
import type { Client } from "../support/http";
import { addPerson, clientFor, clientsOf, courseWithPeople } from "./fixtures";

let f: Awaited<ReturnType<typeof courseWithPeople>>;
let as: Record<"instructor" | "ta" | "student" | "outsider", Client>;
let more: { id: string; email: string }[];

const send = (c: Client, method: string, path: string, body?: unknown) =>
  c.json(path, { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
const url = () => `/api/courses/${f.courseId}/benches`;

beforeAll(async () => {
  f = await courseWithPeople();
  as = await clientsOf(f.people);
  more = await Promise.all(
    ["Ines Partner", "Oskar Third", "Pia Fourth", "Quin Fifth", "Rhea Sixth"].map((name, i) => addPerson(`bench-${i}`, { courseId: f.courseId, role: "student", section: i < 3 ? "A" : "B", name })),
  );
});

describe("GET and PUT /api/courses/{courseId}/benches", () => {
  it("starts with no bench and every student unseated, with their section", async () => {
    const r = await as.ta.json(url());
    expect(r.status).toBe(200);
    expect(r.body.benches).toEqual([]);
    expect(r.body.unseated).toHaveLength(6);
    expect(r.body.unseated).toContainEqual({ userId: more[0].id, name: "Ines Partner", section: "A" });
  });

  it("replaces the arrangement and answers it in the issue's shape; a bench keeps its id while its name stays", async () => {
    const put = await send(as.instructor, "PUT", url(), {
      benches: [
        { name: "Bench 01", section: "A", memberIds: [f.people.student.id, more[0].id] },
        { name: "Bench 02", memberIds: [more[1].id] },
      ],
    });
    expect(put.status).toBe(200);
    const first = put.body.benches[0];
    expect(first).toEqual({ id: expect.any(String), name: "Bench 01", section: "A", members: expect.arrayContaining([{ userId: more[0].id, name: "Ines Partner" }]) });
    expect(first.members).toHaveLength(2);
    expect(put.body.benches[1]).toMatchObject({ name: "Bench 02", section: null, members: [{ userId: more[1].id, name: "Oskar Third" }] });
    expect(put.body.unseated.map((u: { userId: string }) => u.userId).sort()).toEqual([more[2].id, more[3].id, more[4].id].sort());

    // move Oskar to Bench 01's place of Ines (a swap), drop Bench 02
    const again = await send(as.instructor, "PUT", url(), { benches: [{ name: "Bench 01", section: "A", memberIds: [f.people.student.id, more[1].id] }] });
    expect(again.status).toBe(200);
    expect(again.body.benches).toHaveLength(1);
    expect(again.body.benches[0].id).toBe(first.id);
    expect(again.body.unseated.map((u: { userId: string }) => u.userId)).toContain(more[0].id);
  });

  it("refuses a student on two benches, a non-student, a fifth student and a duplicate name with 400 naming the field; nothing changes", async () => {
    const before = (await as.instructor.json(url())).body;
    const cases: [unknown, string][] = [
      [{ benches: [{ name: "Bench 01", memberIds: [more[0].id] }, { name: "Bench 02", memberIds: [more[0].id] }] }, "benches.1.memberIds.0"],
      [{ benches: [{ name: "Bench 01", memberIds: [more[0].id, f.people.ta.id] }] }, "benches.0.memberIds.1"],
      [{ benches: [{ name: "Bench 01", memberIds: [f.people.outsider.id] }] }, "benches.0.memberIds.0"],
      [{ benches: [{ name: "Bench 01", memberIds: [f.people.student.id, ...more.slice(0, 4).map((m) => m.id)] }] }, "benches.0.memberIds"],
      [{ benches: [{ name: "Bench 01", memberIds: [] }, { name: " Bench 01", memberIds: [] }] }, "benches.1.name"],
      [{ benches: [{ name: "Bench\u000701", memberIds: [] }] }, "benches.0.name"],
      [{ benches: [{ name: "Bench 01", section: 7, memberIds: [] }] }, "benches.0.section"],
      [{ benches: "all of them" }, "benches"],
    ];
    for (const [body, field] of cases) {
      const r = await send(as.instructor, "PUT", url(), body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(r.body.error.fields), JSON.stringify(body)).toContain(field);
    }
    expect((await as.instructor.json(url())).body).toEqual(before);
  });

  it("a student gets 403 for both, a TA 403 for PUT, an outsider 404", async () => {
    const body = { benches: [] };
    expect((await as.student.json(url())).status).toBe(403);
    expect((await send(as.student, "PUT", url(), body)).status).toBe(403);
    expect((await send(as.ta, "PUT", url(), body)).status).toBe(403);
    expect((await as.outsider.json(url())).status).toBe(404);
    expect((await send(as.outsider, "PUT", url(), body)).status).toBe(404);
    // a copied request without the site's Origin is refused before anything is read
    const forged = await as.instructor.json(url(), { method: "PUT", headers: { "content-type": "application/json", origin: "https://elsewhere.example" }, body: JSON.stringify(body) });
    expect(forged.status).toBe(403);
    expect((await as.instructor.json(url())).body.benches).toHaveLength(1);
  });

  it("two replacements at once leave one of them whole, never a mix", async () => {
    const a = { benches: [{ name: "Bench 10", memberIds: [more[2].id, more[3].id] }] };
    const b = { benches: [{ name: "Bench 20", memberIds: [more[2].id] }, { name: "Bench 21", memberIds: [more[3].id] }] };
    const [ra, rb] = await Promise.all([send(as.instructor, "PUT", url(), a), send(as.instructor, "PUT", url(), b)]);
    expect([ra.status, rb.status]).toEqual([200, 200]);
    const names = (await as.instructor.json(url())).body.benches.map((x: { name: string }) => x.name).sort();
    expect([["Bench 10"], ["Bench 20", "Bench 21"]]).toContainEqual(names);
  });
});

describe("the roster CSV's bench column and the course home", () => {
  it("seats imported students at the named benches, making a bench that does not exist", async () => {
    const put = await send(as.instructor, "PUT", url(), { benches: [{ name: "Bench 01", section: "A", memberIds: [more[0].id] }] });
    expect(put.status).toBe(200);
    const csv = ["name,email,section,bench", `Fixture student,${f.people.student.email},A,Bench 01`, "Tova Newcomer,tova.newcomer.bench@test.example,A,Bench 01", "Uma Newcomer,uma.newcomer.bench@test.example,B,Bench 09"].join("\n");
    const preview = await send(as.instructor, "POST", `/api/courses/${f.courseId}/members/import`, { csv, confirm: false });
    expect(preview.status).toBe(200);
    expect(preview.body.rows.map((r: { bench: string }) => r.bench)).toEqual(["Bench 01", "Bench 01", "Bench 09"]);
    const done = await send(as.instructor, "POST", `/api/courses/${f.courseId}/members/import`, { csv, confirm: true });
    expect(done.status).toBe(200);
    const benches = (await as.instructor.json(url())).body.benches as { name: string; section: string | null; members: { name: string }[] }[];
    expect(benches.find((b) => b.name === "Bench 01")!.members.map((m) => m.name).sort()).toEqual(["Fixture student", "Ines Partner", "Tova Newcomer"]);
    expect(benches.find((b) => b.name === "Bench 09")).toMatchObject({ section: "B", members: [{ name: "Uma Newcomer" }] });
  });

  it("the student sees their bench and partners on the course home; a student at no bench is told so", async () => {
    const home = await as.student.fetch(`/courses/${f.courseId}`);
    const html = await home.text();
    expect(html).toMatch(/You sit at <strong>Bench 01<\/strong>/);
    expect(html).toContain("Ines Partner");
    expect(html).toContain("Tova Newcomer");
    const alone = await clientFor(more[4].email);
    expect(await (await alone.fetch(`/courses/${f.courseId}`)).text()).toContain("You have no bench yet");
  });

  it("the Benches page lists the benches for the staff and refuses students", async () => {
    const page = await as.ta.fetch(`/courses/${f.courseId}/benches`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Bench 09");
    expect(html).toContain("Only the instructor can change the benches.");
    expect((await as.student.fetch(`/courses/${f.courseId}/benches`)).status).toBe(403);
  });
});
