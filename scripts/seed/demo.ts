// The demo: an invented technical college's course on measuring small currents. Every name here is
// made up. Seeding is idempotent: existing rows are left as they are, so a second run keeps the data.
import type { Kysely } from "kysely";
import { hash } from "@node-rs/argon2";
import type { Database, Role } from "../../db/types";
import { seedBenches, seedDraws, seedExceptions } from "./benches";
import { seedLabs, type SeedStorage } from "./labs";
import { seedMail } from "./mail";
import { seedLabReviews, seedReviews } from "./reviews";
import { readLessonFiles } from "../../lib/lessons/files";

export const DEMO_PASSWORD = "bench-demo-2026";
export const DEMO_DOMAIN = "larkmoor-tech.example";
export const DEMO_COURSE = {
  code: "ELM-214",
  title: "Measuring Small Currents",
  term: "Spring 2027",
  institution: "Larkmoor Technical College",
  joinCode: "LARK-214",
};
export const SECOND_COURSE = {
  code: "ELM-305",
  title: "Precision Instrumentation Workshop",
  term: "Spring 2027",
  institution: "Larkmoor Technical College",
  joinCode: "LARK-305",
};

export const demoLogins: { role: string; email: string; name: string }[] = [
  { role: "admin", email: `admin@${DEMO_DOMAIN}`, name: "Orla Penhallow" },
  { role: "instructor", email: `instructor@${DEMO_DOMAIN}`, name: "Dr. Tamsin Okonkwo-Reyes" },
  { role: "ta", email: `ta.one@${DEMO_DOMAIN}`, name: "Bram Eskildsen" },
  { role: "student", email: `student.one@${DEMO_DOMAIN}`, name: "Noor Halvorsen" },
  { role: "student", email: `student.two@${DEMO_DOMAIN}`, name: "Felix Adeyemi-Strand" },
];

const FIRST = ["Ada", "Bilal", "Catalina", "Dmitri", "Elif", "Farah", "Gustav", "Hana", "Ismael", "Jonna", "Kofi", "Lucia", "Mateo", "Nadia", "Oskar", "Priya", "Quentin", "Rosa", "Sami", "Talia"];
const LAST = ["Abernethy-Lund", "Brightwater", "Castellane", "Duvekot", "Elmsworth", "Fairhaven", "Grisdale", "Hollinrake", "Ingleby", "Jessamyn"];

/** 38 further students, named from invented first-name and surname lists. */
export function demoStudents(): { email: string; name: string; section: string }[] {
  const out: { email: string; name: string; section: string }[] = [];
  for (let i = 0; out.length < 38; i++) {
    const first = FIRST[i % FIRST.length];
    const last = LAST[(i * 7 + Math.floor(i / FIRST.length)) % LAST.length];
    const n = String(out.length + 3).padStart(2, "0");
    out.push({ name: `${first} ${last}`, email: `student.${n}@${DEMO_DOMAIN}`, section: out.length % 2 ? "B" : "A" });
  }
  return out;
}

async function upsertUser(db: Kysely<Database>, u: { email: string; name: string; isAdmin?: boolean }, passwordHash: string) {
  const existing = await db.selectFrom("users").select("id").where("email", "=", u.email).executeTakeFirst();
  if (existing) return existing.id;
  const row = await db
    .insertInto("users")
    .values({ email: u.email, name: u.name, password_hash: passwordHash, is_admin: u.isAdmin ?? false })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

async function upsertCourse(db: Kysely<Database>, c: typeof DEMO_COURSE) {
  const existing = await db.selectFrom("courses").select("id").where("code", "=", c.code).executeTakeFirst();
  if (existing) return existing.id;
  const row = await db
    .insertInto("courses")
    .values({ code: c.code, title: c.title, term: c.term, institution: c.institution, join_code: c.joinCode })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

async function member(db: Kysely<Database>, courseId: string, userId: string, role: Role, section: string | null = null) {
  await db
    .insertInto("memberships")
    .values({ course_id: courseId, user_id: userId, role, section })
    .onConflict((oc) => oc.columns(["course_id", "user_id"]).doNothing())
    .execute();
}

/**
 * Seeds the demo. With `mailDatabaseUrl` (the same database, for the job queue) it also queues a few
 * graded e-mails, which the app's worker delivers to the local mailbox.
 */
export async function seedDemo(db: Kysely<Database>, opts: { storage?: SeedStorage; mailDatabaseUrl?: string } = {}): Promise<{ courseId: string }> {
  const passwordHash = await hash(DEMO_PASSWORD); // argon2id, the library default
  const seeded = await db.transaction().execute(async (trx) => {
    const courseId = await upsertCourse(trx, DEMO_COURSE);
    const secondId = await upsertCourse(trx, SECOND_COURSE);
    const ids: Record<string, string> = {};
    for (const l of demoLogins) ids[l.email] = await upsertUser(trx, { ...l, isAdmin: l.role === "admin" }, passwordHash);

    await member(trx, courseId, ids[`instructor@${DEMO_DOMAIN}`], "instructor");
    await member(trx, courseId, ids[`ta.one@${DEMO_DOMAIN}`], "ta", "A");
    const ta2 = await upsertUser(trx, { email: `ta.two@${DEMO_DOMAIN}`, name: "Ines Marchetti-Oduya" }, passwordHash);
    await member(trx, courseId, ta2, "ta", "B");
    await member(trx, courseId, ids[`student.one@${DEMO_DOMAIN}`], "student", "A");
    await member(trx, courseId, ids[`student.two@${DEMO_DOMAIN}`], "student", "B");
    const others: { id: string }[] = [];
    for (const s of demoStudents()) {
      const id = await upsertUser(trx, s, passwordHash);
      await member(trx, courseId, id, "student", s.section);
      others.push({ id });
    }
    // The two demo student logins have attempts in the graded labs but not in the open ones, so a
    // visitor can try submitting.
    await seedLabs(
      trx,
      courseId,
      ids[`instructor@${DEMO_DOMAIN}`],
      { graded: [{ id: ids[`student.one@${DEMO_DOMAIN}`] }, { id: ids[`student.two@${DEMO_DOMAIN}`] }, ...others], open: others },
      opts.storage,
    );

    // Review requests: a few waiting, one answered with a changed score.
    await seedReviews(trx, courseId, { studentOne: ids[`student.one@${DEMO_DOMAIN}`], studentTwo: ids[`student.two@${DEMO_DOMAIN}`], ta: ids[`ta.one@${DEMO_DOMAIN}`] });
    // and on the labs running now (labs 10 to 13), open and answered
    await seedLabReviews(trx, courseId, ids[`ta.one@${DEMO_DOMAIN}`]);

    // the forty students in twenty pairs by section, two extensions, and every published lab's circuits drawn
    await seedBenches(trx, courseId);
    await seedExceptions(trx, courseId, [ids[`student.one@${DEMO_DOMAIN}`], others[0].id], ids[`instructor@${DEMO_DOMAIN}`]);
    await seedDraws(trx, courseId);

    // The lesson plan: the whole syllabus, the last three lessons opening over the coming weeks. A plan
    // seeded before newer lessons existed gets them appended (visible, open), and keeps its own rows.
    const planned = await trx.selectFrom("course_lessons").select(["slug", "position"]).where("course_id", "=", courseId).execute();
    if (planned.length > 0) {
      const have = new Set(planned.map((r) => r.slug));
      const missing = readLessonFiles().filter((l) => !have.has(l.slug));
      const last = Math.max(...planned.map((r) => r.position));
      if (missing.length > 0)
        await trx
          .insertInto("course_lessons")
          .values(missing.map((l, i) => ({ course_id: courseId, slug: l.slug, position: last + i + 1, visible: true, opens_at: null })))
          .execute();
    } else {
      const now = Date.now();
      const slugs = readLessonFiles().map((l) => l.slug);
      await trx
        .insertInto("course_lessons")
        .values(
          slugs.map((slug, i) => ({
            course_id: courseId,
            slug,
            position: i + 1,
            visible: true,
            opens_at: new Date(now + (i < slugs.length - 3 ? -(30 - i * 2) : (i - slugs.length + 4) * 7) * 24 * 3600 * 1000),
          })),
        )
        .execute();
    }

    // Roles are per course: the first TA is a student in the advanced workshop.
    await member(trx, secondId, ids[`instructor@${DEMO_DOMAIN}`], "instructor");
    await member(trx, secondId, ids[`ta.one@${DEMO_DOMAIN}`], "student");
    return { courseId, students: [ids[`student.one@${DEMO_DOMAIN}`], ids[`student.two@${DEMO_DOMAIN}`]] };
  });
  if (opts.mailDatabaseUrl) await seedMail(db, opts.mailDatabaseUrl, seeded.students);
  return { courseId: seeded.courseId };
}
