// What a grade message needs, read in the transaction that stores the grade: the attempt, its lab,
// course and student, the lab's hold and the student's mail preference.
import type { Db } from "../types";

export async function gradeMailContext(db: Db, attemptId: string) {
  return db
    .selectFrom("attempts as a")
    .innerJoin("labs as l", "l.id", "a.lab_id")
    .innerJoin("courses as c", "c.id", "l.course_id")
    .innerJoin("users as u", "u.id", "a.user_id")
    .select([
      "a.id as attemptId",
      "a.number",
      "a.score",
      "a.max_score as maxScore",
      "a.penalty_percent as penaltyPercent",
      "a.result",
      "l.id as labId",
      "l.title as labTitle",
      "l.template_key as templateKey",
      "l.grades_held as gradesHeld",
      "c.code as courseCode",
      "c.title as courseTitle",
      "u.email",
      "u.name as studentName",
      "u.grade_mail as gradeMail",
    ])
    .where("a.id", "=", attemptId)
    .executeTakeFirst();
}

export type GradeMailContext = NonNullable<Awaited<ReturnType<typeof gradeMailContext>>>;
