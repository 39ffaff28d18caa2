// The bench parts list of a lab for its staff: every current student's stored circuit. Reading it draws
// nothing: circuits are drawn when the lab is published (lib/labs/draws.ts) and on a later joiner's first
// open; the list says how many students' circuits it counts.
import "server-only";
import { db } from "@/db";
import { listStudents } from "@/db/queries/courses";
import { listVariants } from "@/db/queries/labs";
import type { Params } from "@/lib/grader";
import type { Lab } from "./grading";
import { countParts } from "./parts";

export async function benchParts(lab: Lab) {
  const [students, stored] = await Promise.all([listStudents(db, lab.courseId), listVariants(db, lab.id)]);
  const circuits = new Map<string, Params>(stored.map((v) => [v.userId, v.params as Params]));
  const drawn = students.filter((s) => circuits.has(s.userId)).length;
  return { ...countParts(lab.templateKey, lab.spec, students, circuits), students: students.length, drawn };
}
