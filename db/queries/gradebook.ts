// The gradebook: every student of a course against every published lab, computed in PostgreSQL.
// One statement builds the whole JSON document the API answers, so the route neither walks rows nor
// issues a query per student or per cell; the statistics are two more statements.
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database } from "../types";

type Db = Kysely<Database> | Transaction<Database>;

export interface GradebookLab {
  id: string;
  title: string;
  dueAt: string | null;
  maxPoints: number;
  /** The stored weight; null = weighted by its points. */
  weight: number | null;
}

export interface GradebookCell {
  score: number;
  maxScore: number;
  attemptId: string;
  attempts: number;
  late: boolean;
  changedByStaff: boolean;
  reviewOpen: boolean;
  /** the counted attempt's readings came from the simulated bench */
  simulated: boolean;
}

export interface GradebookStudent {
  userId: string;
  name: string;
  email: string;
  section: string | null;
  /** Weighted percentage over the labs that count so far (past due, or submitted); null when none does. */
  total: number | null;
  cells: Record<string, GradebookCell | null>;
  /** the reason of each exception the student has (own dates or extra attempts), by lab */
  exceptions: Record<string, string>;
}

export interface Gradebook {
  labs: GradebookLab[];
  students: GradebookStudent[];
}

/** A student's review request on an attempt that the staff have not answered since it was made. */
const REVIEW_OPEN = sql`(a.review_requested_at is not null and (a.review_answered_at is null or a.review_answered_at < a.review_requested_at))`;
/** The staff overrode a question's points or re-ran the grader on the attempt. */
const CHANGED_BY_STAFF = sql`a.changed_by_staff`;

const iso = (col: string) => sql.raw(`to_char(${col} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`);

/**
 * The common part: the course's published labs with their points and effective weight, its students,
 * and for each (lab, student) pair with attempts the counted attempt (best score, ties to the later
 * attempt; or the last one) with the attempt count and whether a review is open.
 * `gc` holds every person's counted attempts in the course's labs (the document keeps the students' as
 * it joins them to `gs`), or with `studentsOnly` only the current students' (for the statistics).
 * `onlyUser` narrows it to one student; `hideHeld` (the student's own view) leaves out the scores of labs
 * whose grades are held back (they neither show nor count in the total).
 */
function gradebookCtes(courseId: string, onlyUser?: string, hideHeld = false, studentsOnly = false) {
  const userFilter = onlyUser ? sql`and m.user_id = ${onlyUser}` : sql``;
  const attemptUser = onlyUser ? sql`and a.user_id = ${onlyUser}` : sql``;
  const studentAttempts = studentsOnly ? sql`and a.user_id in (select gs.user_id from gs)` : sql``;
  const released = hideHeld ? sql`not gl.grades_held` : sql`true`;
  // the course's (released) labs as an array: an index condition on attempts_gradebook_idx that reads
  // only these labs' attempts, in index order (lab, student, number)
  const labIds = sql`array(select gl.id from gl where ${released})`;
  return sql`
    gl as (
      select l.id, l.title, l.due_at, l.created_at, l.weight, l.counting, l.grades_held,
        row_number() over (order by l.due_at nulls last, l.created_at, l.id) as ord,
        coalesce((select sum((q->>'points')::float8) from jsonb_array_elements(l.questions) q), 0) as max_points
      from labs l
      where l.course_id = ${courseId} and l.status = 'published'
    ),
    gs as (
      select u.id as user_id, u.name, u.email, m.section, row_number() over (order by u.name, u.email, u.id) as ord
      from memberships m join users u on u.id = m.user_id
      where m.course_id = ${courseId} and m.role = 'student' ${userFilter}
    ),
    gk as (
      -- one pass over the labs' attempts from the covering index, already in (lab, student) order, so
      -- grouped without hashing or sorting: the count, an open review on any attempt, and the number of
      -- the counted one. max() over [score, number] arrays orders like "score desc, number desc" (best;
      -- ties to the later attempt); with the score left at 0 it is the last attempt.
      select a.lab_id, a.user_id, count(*)::int as attempts, bool_or(${REVIEW_OPEN}) as review_open,
        (max(array[case when a.lab_id = any(array(select gl.id from gl where gl.counting = 'best')) then a.score::float8 else 0 end,
          a.number::float8]))[2]::int as number
      from attempts a
      where a.lab_id = any(${labIds}) ${attemptUser} ${studentAttempts}
      group by a.lab_id, a.user_id
    ),
    gc as (
      -- the counted attempt's columns: merged with a second scan of the same index in the same order
      -- (no hash of the attempts, no read of the table)
      select gk.lab_id, gk.user_id, a.id as attempt_id, a.score, a.max_score, a.late_days,
        ${CHANGED_BY_STAFF} as changed_by_staff, a.simulated, gk.attempts, gk.review_open
      from gk join attempts a on a.lab_id = gk.lab_id and a.user_id = gk.user_id and a.number = gk.number
      where a.lab_id = any(${labIds}) ${attemptUser}
    )`;
}

const jbool = (col: string) => sql.raw(`case when ${col} then 'true' else 'false' end`);

/**
 * The gradebook document, as the JSON text the API answers. PostgreSQL writes it as text with concat()
 * and string_agg() (json_build_object per cell cost about twice as much for a course-sized gradebook);
 * every string that is not a uuid, a number or a literal goes through to_json, which escapes it.
 */
export function gradebookJsonQuery(courseId: string, onlyUser?: string, hideHeld = false) {
  const released = hideHeld ? sql`not gl.grades_held` : sql`true`;
  return sql<{ doc: string }>`
    with ${gradebookCtes(courseId, onlyUser, hideHeld)},
    gx as (
      -- the students' exceptions in these labs (a handful): their own due dates and the reasons by lab
      select x.lab_id, x.user_id, x.due_at, x.reason from lab_exceptions x where x.lab_id = any(array(select gl.id from gl))
    ),
    grid as (
      -- every (student, lab) pair, kept narrow (the names join back at the end) so its sort stays in memory;
      -- a lab counts once submitted or past the student's own due date
      select gs.ord, gl.ord as lab_ord, gl.id as lab_id, coalesce(gl.weight, gl.max_points) as w,
        gc.attempt_id, gc.score, gc.max_score, gc.late_days, gc.changed_by_staff, gc.simulated, gc.attempts, gc.review_open,
        ((gc.attempt_id is not null or coalesce(gx.due_at, gl.due_at) <= now()) and ${released}) as counts
      from gs cross join gl
      left join gc on gc.lab_id = gl.id and gc.user_id = gs.user_id
      left join gx on gx.lab_id = gl.id and gx.user_id = gs.user_id
    ),
    gxs as (
      select gx.user_id, string_agg(concat('"', gx.lab_id, '":', to_json(gx.reason)::text), ',') as exceptions from gx group by gx.user_id
    ),
    gcells as (
      select ord,
        string_agg(concat('"', lab_id, '":', case when attempt_id is null then 'null' else concat(
            '{"score":', score, ',"maxScore":', max_score, ',"attemptId":"', attempt_id, '","attempts":', attempts,
            ',"late":', ${jbool("late_days > 0")}, ',"changedByStaff":', ${jbool("changed_by_staff")},
            ',"reviewOpen":', ${jbool("review_open")}, ',"simulated":', ${jbool("simulated")}, '}') end), ',' order by lab_ord) as cells,
        case when sum(w) filter (where counts) > 0 then
          round((100 * sum(w * coalesce(score::float8 / nullif(max_score, 0), 0)) filter (where counts)
            / sum(w) filter (where counts))::numeric, 1)::float8
        end as total
      from grid
      group by ord
    ),
    grow as (
      select gs.ord, concat('{"userId":"', gs.user_id, '","name":', to_json(gs.name), ',"email":', to_json(gs.email),
        ',"section":', coalesce(to_json(gs.section)::text, 'null'), ',"total":', coalesce(gcells.total::text, 'null'),
        ',"cells":{', gcells.cells, '},"exceptions":{', gxs.exceptions, '}}') as student
      from gs left join gcells on gcells.ord = gs.ord left join gxs on gxs.user_id = gs.user_id
    )
    select concat(
      '{"labs":', coalesce((select json_agg(json_build_object(
          'id', id, 'title', title, 'dueAt', ${iso("due_at")}, 'maxPoints', max_points, 'weight', weight)
          order by ord) from gl), '[]'::json),
      ',"students":[', (select string_agg(student, ',' order by ord) from grow), ']}') as doc`;
}

export async function gradebookJson(db: Db, courseId: string, onlyUser?: string, hideHeld = false): Promise<string> {
  const r = await gradebookJsonQuery(courseId, onlyUser, hideHeld).execute(db);
  return r.rows[0].doc;
}

export async function gradebook(db: Db, courseId: string, onlyUser?: string): Promise<Gradebook> {
  return JSON.parse(await gradebookJson(db, courseId, onlyUser)) as Gradebook;
}

/** A student's own row, as the student may see it: held grades left out; and which labs are held. */
export async function ownGrades(db: Db, courseId: string, userId: string): Promise<{ gradebook: Gradebook; heldLabIds: string[] }> {
  const [doc, held] = await Promise.all([
    gradebookJson(db, courseId, userId, true),
    db.selectFrom("labs").select("id").where("course_id", "=", courseId).where("status", "=", "published").where("grades_held", "=", true).execute(),
  ]);
  return { gradebook: JSON.parse(doc) as Gradebook, heldLabIds: held.map((l) => l.id) };
}

export interface LabStatistics {
  labId: string;
  submitted: number;
  missing: number;
  mean: number | null;
  median: number | null;
  /** Counted scores as a percentage of the attempt's maximum, one per submitting student. */
  percents: number[];
}

export interface QuestionStatistics {
  labId: string;
  questionId: string;
  quantity: string;
  position: number;
  templateKey: string;
  /** Counts over the counted attempts, plus students with no attempt as missing. */
  correct: number;
  close: number;
  mistake: number;
  wrong: number;
  missing: number;
  /** Of `missing`, the students with no counted attempt at all (not submitted). */
  notSubmitted: number;
  topMistake: string | null;
  topMistakeCount: number;
}

/**
 * The gradebook's statistics in one statement, so the counted attempts are found once: per lab, how many
 * students submitted, how many did not, mean and median of counted scores; per question of each published
 * lab, verdicts of the counted attempts (unit counts as wrong; a student who did not submit counts as
 * missing) and the most frequent recognised mistake. Only the course's current students count.
 */
export async function gradebookStatistics(db: Db, courseId: string): Promise<{ labs: LabStatistics[]; questions: QuestionStatistics[] }> {
  return (await gradebookStatisticsQuery(courseId).execute(db)).rows[0];
}

export function gradebookStatisticsQuery(courseId: string) {
  return sql<{ labs: LabStatistics[]; questions: QuestionStatistics[] }>`
    with ${gradebookCtes(courseId, undefined, false, true)},
    ls as (
      select gl.ord, gl.id as "labId",
        count(gc.attempt_id)::int as submitted,
        ((select count(*) from gs) - count(gc.attempt_id))::int as missing,
        round(avg(gc.score)::numeric, 2)::float8 as mean,
        round((percentile_cont(0.5) within group (order by gc.score))::numeric, 2)::float8 as median,
        coalesce(array_agg(round((100 * gc.score::float8 / nullif(gc.max_score, 0))::numeric, 1)::float8 order by gc.score)
          filter (where gc.attempt_id is not null), '{}') as percents
      from gl left join gc on gc.lab_id = gl.id
      group by gl.id, gl.ord
    ),
    ca as (
      select gc.lab_id, a.result from gc join attempts a on a.id = gc.attempt_id
    ),
    qs as (
      select l.id as lab_id, l.template_key, q.ord::int as position, coalesce(q.v->>'id', 'q' || q.ord) as question_id, q.v->>'quantity' as quantity
      from labs l cross join lateral jsonb_array_elements(l.questions) with ordinality as q(v, ord)
      where l.course_id = ${courseId} and l.status = 'published'
    ),
    vs as (
      select ca.lab_id, r.ord::int as position, r.v->>'verdict' as verdict, r.v->>'mistake' as mistake
      from ca cross join lateral jsonb_array_elements(ca.result->'results') with ordinality as r(v, ord)
    ),
    tm as (
      select distinct on (lab_id, position) lab_id, position, mistake, count(*) as n
      from vs where verdict = 'mistake' and mistake is not null
      group by lab_id, position, mistake
      order by lab_id, position, count(*) desc, mistake
    ),
    qst as (
      select qs.lab_id as "labId", qs.question_id as "questionId", qs.quantity, qs.position, qs.template_key as "templateKey",
        count(*) filter (where vs.verdict = 'correct')::int as correct,
        count(*) filter (where vs.verdict = 'close')::int as close,
        count(*) filter (where vs.verdict = 'mistake')::int as mistake,
        count(*) filter (where vs.verdict in ('wrong', 'unit'))::int as wrong,
        (count(*) filter (where vs.verdict = 'missing') + (select count(*) from gs) - count(vs.verdict))::int as missing,
        ((select count(*) from gs) - count(vs.verdict))::int as "notSubmitted",
        tm.mistake as "topMistake", coalesce(tm.n, 0)::int as "topMistakeCount"
      from qs
      left join vs on vs.lab_id = qs.lab_id and vs.position = qs.position
      left join tm on tm.lab_id = qs.lab_id and tm.position = qs.position
      group by qs.lab_id, qs.question_id, qs.quantity, qs.position, qs.template_key, tm.mistake, tm.n
    )
    select
      coalesce((select jsonb_agg(to_jsonb(ls) - 'ord' order by ls.ord) from ls), '[]') as labs,
      coalesce((select jsonb_agg(qst order by qst."labId", qst.position) from qst), '[]') as questions`;
}

/** The course's published labs with their stored weight (null = by points) and points, for the weights form. */
export async function labWeights(db: Db, courseId: string): Promise<{ id: string; title: string; weight: number | null; maxPoints: number }[]> {
  const r = await sql<{ id: string; title: string; weight: number | null; maxPoints: number }>`
    select l.id, l.title, l.weight,
      coalesce((select sum((q->>'points')::float8) from jsonb_array_elements(l.questions) q), 0) as "maxPoints"
    from labs l where l.course_id = ${courseId} and l.status = 'published'
    order by l.due_at nulls last, l.created_at`.execute(db);
  return r.rows;
}

/**
 * What the gradebook page prints around the table (which it fetches itself): the published labs in due
 * order and the number of students, without building the whole document.
 */
export async function gradebookOutline(db: Db, courseId: string): Promise<{ labs: GradebookLab[]; students: number }> {
  const [labs, students] = await Promise.all([
    sql<GradebookLab>`
      select l.id, l.title, ${iso("l.due_at")} as "dueAt", l.weight,
        coalesce((select sum((q->>'points')::float8) from jsonb_array_elements(l.questions) q), 0) as "maxPoints"
      from labs l where l.course_id = ${courseId} and l.status = 'published'
      order by l.due_at nulls last, l.created_at, l.id`.execute(db),
    db.selectFrom("memberships").select((eb) => eb.fn.countAll<string>().as("n")).where("course_id", "=", courseId).where("role", "=", "student").executeTakeFirstOrThrow(),
  ]);
  return { labs: labs.rows, students: Number(students.n) };
}

/** Ids of every lab of the course, drafts too (a weight may be set before publishing). */
export async function courseLabIds(db: Db, courseId: string): Promise<Set<string>> {
  const rows = await db.selectFrom("labs").select("id").where("course_id", "=", courseId).execute();
  return new Set(rows.map((r) => r.id));
}

/** Sets the weights of labs of one course; labs of other courses are left alone. Returns how many changed. */
export async function setLabWeights(db: Db, courseId: string, weights: { labId: string; weight: number | null }[]) {
  let n = 0;
  for (const w of weights) {
    const r = await db.updateTable("labs").set({ weight: w.weight }).where("id", "=", w.labId).where("course_id", "=", courseId).executeTakeFirst();
    n += Number(r.numUpdatedRows);
  }
  return n;
}
