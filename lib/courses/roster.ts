// Roster use cases: add, change and remove members, and import students from a CSV. Callers authorize
// first (instructor). A course always keeps at least one instructor; the check and the change run in one
// transaction that locks the course row, so two concurrent changes cannot both remove the last one.
import "server-only";
import type { Transaction } from "kysely";
import type { z } from "zod";
import { db } from "@/db";
import {
  accountsByEmail,
  countInstructors,
  deleteMembership,
  findMembership,
  insertMembershipIfAbsent,
  lockCourse,
  updateMembership,
  upsertMembership,
} from "@/db/queries/courses";
import { findUserByEmail, insertUser } from "@/db/queries/users";
import type { Database, Role } from "@/db/types";
import { AppError, notFound } from "@/lib/errors";
import { queuePasswordMail } from "@/lib/mail/tokens";
import type { addMemberSchema, updateMemberSchema } from "@/lib/validation/members";
import { seatByName, seatCounts } from "@/db/queries/benches";
import { checkBenchRoom, classifyRows, lookupEmails, readRosterCsv, type ImportRow, type KnownAccount } from "./roster-csv";

const LAST_INSTRUCTOR = "A course must keep at least one instructor: make someone else an instructor first.";

async function guardLastInstructor(trx: Transaction<Database>, courseId: string, current: Role, next: Role | null) {
  if (current !== "instructor" || next === "instructor") return;
  if ((await countInstructors(trx, courseId)) <= 1) throw new AppError("conflict", LAST_INSTRUCTOR, { role: [LAST_INSTRUCTOR] });
}

async function lockedMembership(trx: Transaction<Database>, courseId: string, userId: string) {
  if (!(await lockCourse(trx, courseId))) throw notFound("That course");
  return findMembership(trx, courseId, userId);
}

/** Adds an existing account to the course with a role (or changes the role of a member). */
export async function addMember(courseId: string, input: z.output<typeof addMemberSchema>) {
  const user = await findUserByEmail(db, input.email);
  if (!user) {
    throw new AppError("not_found", "No account uses that e-mail address. Ask the person to sign up first, or import them from a CSV to invite them.", {
      email: ["No account uses that e-mail address."],
    });
  }
  const section = input.section ?? null;
  await db.transaction().execute(async (trx) => {
    const current = await lockedMembership(trx, courseId, user.id);
    if (current) await guardLastInstructor(trx, courseId, current.role, input.role);
    await upsertMembership(trx, { courseId, userId: user.id, role: input.role, section });
  });
  return { userId: user.id, name: user.name, email: user.email, role: input.role, section };
}

/** Changes a member's role and/or section. */
export async function changeMember(courseId: string, userId: string, patch: z.output<typeof updateMemberSchema>) {
  return db.transaction().execute(async (trx) => {
    const current = await lockedMembership(trx, courseId, userId);
    if (!current) throw notFound("That member");
    if (patch.role) await guardLastInstructor(trx, courseId, current.role, patch.role);
    await updateMembership(trx, courseId, userId, patch);
    return { userId, role: patch.role ?? current.role, section: patch.section !== undefined ? patch.section : current.section };
  });
}

/** Removes a member. Their attempts stay and show again if they are added back. */
export async function removeMember(courseId: string, userId: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const current = await lockedMembership(trx, courseId, userId);
    if (!current) throw notFound("That member");
    await guardLastInstructor(trx, courseId, current.role, null);
    await deleteMembership(trx, courseId, userId);
  });
}

export interface ImportResult {
  rows: ImportRow[];
  saved: number;
}

async function preview(conn: Transaction<Database> | typeof db, courseId: string, csv: string): Promise<ImportRow[]> {
  const entries = readRosterCsv(csv);
  const found = await accountsByEmail(conn, courseId, lookupEmails(entries));
  const accounts = new Map<string, KnownAccount>(found.map((a) => [a.email, { id: a.id, role: a.role ?? null }]));
  const rows = classifyRows(entries, accounts);
  if (!rows.some((r) => r.bench)) return rows;
  return checkBenchRoom(rows, await seatCounts(conn, courseId), (r) => seatable(r, accounts));
}

/** Whether the import seats this row's person: a student it adds, or a student already in the course. */
function seatable(row: ImportRow, accounts: Map<string, { role: Role | null }>): boolean {
  return row.outcome === "invite" || row.outcome === "add" || (row.outcome === "member" && accounts.get(row.email)?.role === "student");
}

/**
 * Previews (confirm false: nothing is saved) or imports students from a CSV of name, e-mail and section.
 * Confirming adds existing accounts, creates accounts without a password for new addresses and queues one
 * invitation e-mail (a set-password link) per new account, all in one transaction.
 */
export async function importMembers(courseId: string, csv: string, confirm: boolean): Promise<ImportResult> {
  if (readRosterCsv(csv).length === 0) {
    throw new AppError("bad_request", "The CSV has no rows to import.", { csv: ["The CSV has no rows to import."] });
  }
  if (!confirm) return { rows: await preview(db, courseId, csv), saved: 0 };
  return db.transaction().execute(async (trx) => {
    if (!(await lockCourse(trx, courseId))) throw notFound("That course");
    const rows = await preview(trx, courseId, csv);
    const found = await accountsByEmail(trx, courseId, rows.map((r) => r.email));
    const accounts = new Map(found.map((a) => [a.email, a.id]));
    const roles = new Map(found.map((a) => [a.email, { role: a.role ?? null }]));
    const seats: { userId: string; bench: string; section: string | null }[] = [];
    let saved = 0;
    for (const row of rows) {
      if (row.outcome !== "invite" && row.outcome !== "add") continue;
      let userId = accounts.get(row.email);
      if (!userId) {
        const user = await insertUser(trx, { email: row.email, name: row.name, passwordHash: null });
        userId = user.id;
        accounts.set(row.email, userId);
        // the invitation: a set-password link through the mail queue, in this transaction
        await queuePasswordMail(trx, user, "set");
      }
      if (await insertMembershipIfAbsent(trx, { courseId, userId, role: "student", section: row.section })) saved++;
    }
    for (const row of rows) {
      if (!row.bench || !seatable(row, roles)) continue;
      seats.push({ userId: accounts.get(row.email)!, bench: row.bench, section: row.section });
    }
    await seatByName(trx, courseId, seats);
    return { rows, saved };
  });
}
