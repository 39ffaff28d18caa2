// The bench parts list of a lab for its staff: every current student's circuit, drawing (and storing) the
// values of students who have not opened the lab yet, so the list is complete before the session.
import "server-only";
import { db } from "@/db";
import { listStudents } from "@/db/queries/courses";
import { listVariants } from "@/db/queries/labs";
import type { Params } from "@/lib/grader";
import type { Lab } from "./grading";
import { countParts } from "./parts";
import { variantFor } from "./attempts";

export async function benchParts(lab: Lab) {
  const [students, stored] = await Promise.all([listStudents(db, lab.courseId), listVariants(db, lab.id)]);
  const circuits = new Map<string, Params>(stored.map((v) => [v.userId, v.params as Params]));
  let drawnNow = 0;
  for (const s of students) {
    if (circuits.has(s.userId)) continue;
    circuits.set(s.userId, await variantFor(lab, s.userId));
    drawnNow++;
  }
  return { ...countParts(lab.templateKey, lab.spec, students, circuits), students: students.length, drawnNow };
}
