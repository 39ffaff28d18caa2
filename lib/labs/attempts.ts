// Lab use cases shared by pages, server actions and route handlers: authorization, variants, grading,
// submission. Callers pass plain data; every function checks who is asking.
import "server-only";
import { db } from "@/db";
import type { Database, Db, Role } from "@/db/types";
import type { Transaction } from "kysely";
import { countAttempts, findAttempt, insertGradedAttempt, listAttempts, lockStudentLab, submissionState, type AttemptRow, type AttemptWrite } from "@/db/queries/attempts";
import { findLabForMember, findVariant, insertLab, listLabs, storeVariant } from "@/db/queries/labs";
import { findUploads, lockUploadsForAttempt } from "@/db/queries/uploads";
import { assertRole, courseAccess, currentUser, EVERYONE, isStaff, type CourseAccess } from "@/lib/auth/access";
import { AppError, notFound, unauthorized } from "@/lib/errors";
import { queueGradeMail } from "@/lib/mail/grade";
import { drawVariant, type Params } from "@/lib/grader";
import { studentExceptions } from "@/db/queries/exceptions";
import { attemptRecord, checkReadings, forStudent, gradeForLab, parseMeasured, toLab, withIds, type Lab, type StoredTrace } from "./grading";
import { closeOf, expectedVisible, isClosed, isOpen } from "./policy";
import { reviewIsOpen } from "./overrides";
import { presentResults, type StoredResult } from "./visible-results";

export { gradeForLab, parseMeasured, policyFor, toLab, withIds, type Lab } from "./grading";
import type { LabData } from "@/lib/validation/labs";
import { uuidSchema } from "@/lib/validation/common";

/** The lab and the caller's access to its course. Students never see drafts (404). */
export async function labAccess(labId: string, allowed: Role[] = EVERYONE): Promise<{ lab: Lab; access: CourseAccess }> {
  if (!uuidSchema.safeParse(labId).success) throw notFound("That lab");
  // the lab, its course and the caller's membership in one query (a caller not signed in learns only
  // whether the lab exists: 404, else 401)
  const user = await currentUser();
  const found = await findLabForMember(db, labId, user?.id ?? null);
  if (!found) throw notFound("That lab");
  if (!user) throw unauthorized();
  const access = courseAccess(user, found.course, found.membership, EVERYONE);
  // a student works the lab with their own dates and attempts when the instructor granted an exception
  const lab = access.role === "student" ? forStudent(toLab(found.lab), found.exception) : toLab(found.lab);
  if (!isStaff(access.role) && lab.status !== "published") throw notFound("That lab");
  assertRole(access, allowed);
  return { lab, access };
}

export async function labsForCourse(access: CourseAccess): Promise<Lab[]> {
  if (isStaff(access.role)) return (await listLabs(db, access.course.id, { publishedOnly: false })).map(toLab);
  const [rows, exceptions] = await Promise.all([listLabs(db, access.course.id, { publishedOnly: true }), studentExceptions(db, access.course.id, access.user.id)]);
  return rows.map((r) => forStudent(toLab(r), exceptions.get(r.id)));
}

export async function createLab(access: CourseAccess, data: LabData, status: "draft" | "published" = "draft"): Promise<string> {
  return insertLab(db, access.course.id, access.user.id, { ...data, questions: withIds(data.questions) }, status);
}

/** The caller's own circuit values: drawn once with the seed `${labId}:${userId}` and stored. */
export async function variantFor(lab: Lab, userId: string, conn: Db = db): Promise<Params> {
  const stored = await findVariant(conn, lab.id, userId);
  return stored ? (stored.params as Params) : drawVariantFor(lab, userId, conn);
}

/** Draws the caller's circuit values and stores them, unless another request stored them first (then those count). */
async function drawVariantFor(lab: Lab, userId: string, conn: Db): Promise<Params> {
  const seed = `${lab.id}:${userId}`;
  return (await storeVariant(conn, lab.id, userId, seed, drawVariant(lab.spec, seed))).params as Params;
}

export interface SubmitInput {
  idempotencyKey: string;
  readings: Record<string, string | null>;
  measured: Record<string, string | null>;
  uploadIds: string[];
  /** the readings came from the simulated bench (only a lab that allows either asks) */
  simulated?: boolean;
}

/** Whether an attempt's readings came from the simulated bench: the lab decides, or the student where it allows either. */
export function attemptSimulated(lab: Pick<Lab, "bench">, said: boolean | undefined): boolean {
  if (lab.bench === "real" && said) {
    throw new AppError("bad_request", "This lab is taken on the real bench.", { simulated: ["This lab has no simulated bench."] });
  }
  return lab.bench === "simulated" || (lab.bench === "either" && said === true);
}

/**
 * Submits and grades an attempt in one transaction. A retry with the same idempotency key returns
 * the attempt already made (`created: false`). Answers the stored attempt and how many attempts the
 * student has made at the lab, as the transaction saw them, so the caller reads nothing again.
 */
export async function submitAttempt(
  lab: Lab,
  access: CourseAccess,
  input: SubmitInput,
  now = new Date(),
): Promise<{ attemptId: string; created: boolean; attempt: AttemptRow; attemptsUsed: number }> {
  if (lab.status !== "published") throw new AppError("conflict", "This lab is not published yet.");
  const known = new Set(lab.questions.map((q) => q.id));
  const unknown = Object.keys(input.readings).filter((k) => !known.has(k));
  if (unknown.length) {
    throw new AppError("bad_request", `These readings answer no question of this lab: ${unknown.join(", ")}.`, Object.fromEntries(unknown.map((k) => [`readings.${k}`, ["This lab has no such question."]])));
  }
  checkReadings(lab, input.readings);
  const simulated = attemptSimulated(lab, input.simulated);
  const measured = parseMeasured(lab, input.measured);
  const userId = access.user.id;

  const uploads = await findUploads(db, input.uploadIds);
  if (uploads.length !== new Set(input.uploadIds).size || uploads.some((u) => u.ownerId !== userId || u.courseId !== lab.courseId)) {
    throw new AppError("bad_request", "One of the attached files is not yours or not in this course.", { uploadIds: ["Attach only files you uploaded for this course."] });
  }
  const notReady = uploads.find((u) => u.status !== "ready");
  if (notReady) {
    const why = notReady.status === "failed" ? `could not be analysed${notReady.failure ? ` (${notReady.failure})` : ""}` : notReady.status === "analysing" ? "is still being analysed; wait until it is ready" : "has not finished uploading";
    throw new AppError("bad_request", `The attached file ${notReady.originalName} ${why}.`, { uploadIds: ["Attach only files that are ready."] });
  }
  const traces = uploads.filter((u) => u.kind === "trace" && u.analysis).map((u) => u.analysis as StoredTrace);

  return db.transaction().execute(async (trx: Transaction<Database>) => {
    await lockStudentLab(trx, lab.id, userId);
    // the attached files stay while this attempt is written (the sweep of unattached uploads skips them)
    if ((await lockUploadsForAttempt(trx, uploads.map((u) => u.id))) !== uploads.length) {
      throw new AppError("bad_request", "One of the attached files is no longer stored; upload it again.", { uploadIds: ["Upload the file again."] });
    }
    const state = await submissionState(trx, lab.id, userId, input.idempotencyKey);
    if (state.previous) return { attemptId: state.previous.id, created: false, attempt: state.previous, attemptsUsed: state.used };
    if (!isOpen(lab, now)) throw new AppError("conflict", `This lab opens on ${lab.opensAt!.toISOString().slice(0, 16).replace("T", " ")} UTC.`);
    if (isClosed(lab, now)) throw new AppError("conflict", `This lab closed on ${closeOf(lab)!.toISOString().slice(0, 16).replace("T", " ")} UTC and accepts no more attempts.`);
    if (state.used >= lab.attemptsAllowed) {
      throw new AppError("conflict", `You have used all ${lab.attemptsAllowed} attempt${lab.attemptsAllowed === 1 ? "" : "s"} of this lab.`);
    }
    const params = (state.params as Params | null) ?? (await drawVariantFor(lab, userId, trx));
    const result = gradeForLab(lab, params, input.readings, measured, traces);
    const record: AttemptWrite = attemptRecord({
      lab,
      userId,
      number: state.used + 1,
      idempotencyKey: input.idempotencyKey,
      readings: input.readings,
      measured: { typed: input.measured, values: measured },
      uploadIds: input.uploadIds,
      params,
      result,
      submittedAt: now,
    });
    record.simulated = simulated;
    // the attempt and its "graded" event are one statement
    const attempt = await insertGradedAttempt(trx, record);
    // the message is queued in this transaction: no grade without its e-mail job, no job without its grade.
    // Everything it says was read or written above in this transaction.
    await queueGradeMail(
      trx,
      { attemptId: attempt.id, eventKey: `graded:${attempt.id}`, kind: "graded" },
      {
        attemptId: attempt.id,
        number: attempt.number,
        score: attempt.score,
        maxScore: attempt.maxScore,
        penaltyPercent: attempt.penaltyPercent,
        result: attempt.result,
        labId: lab.id,
        labTitle: lab.title,
        templateKey: lab.templateKey,
        gradesHeld: state.gradesHeld,
        courseCode: access.course.code,
        courseTitle: access.course.title,
        email: access.user.email,
        studentName: access.user.name,
        gradeMail: state.gradeMail,
      },
    );
    return { attemptId: attempt.id, created: true, attempt, attemptsUsed: state.used + 1 };
  });
}

/** An attempt as the caller may see it: the owner and the course staff only; anyone else gets 404. */
export async function attemptAccess(attemptId: string) {
  if (!uuidSchema.safeParse(attemptId).success) throw notFound("That attempt");
  const attempt = await findAttempt(db, attemptId);
  if (!attempt) throw notFound("That attempt");
  const { lab, access } = await labAccess(attempt.labId).catch((e) => {
    if (e instanceof AppError && (e.code === "forbidden" || e.code === "not_found")) throw notFound("That attempt");
    throw e;
  });
  if (attempt.userId !== access.user.id && !isStaff(access.role)) throw notFound("That attempt");
  return { attempt, lab, access };
}

/** How many attempts the attempt's student has made at its lab (the rule for expected values needs it). */
export async function attemptsUsed(attempt: Pick<AttemptRow, "labId" | "userId">): Promise<number> {
  return countAttempts(db, attempt.labId, attempt.userId);
}

/**
 * An attempt as its viewer may see it. Expected values, bands and worked solutions reach a student only
 * when `expectedVisible` allows it (never while they can still earn points); staff always see them.
 * `studentAttempts` is how many attempts the attempt's student has made at this lab.
 */
export function presentAttempt(attempt: AttemptRow, lab: Lab, viewerIsStaff: boolean, studentAttempts: number, now = new Date()) {
  const show = viewerIsStaff || expectedVisible(lab, studentAttempts, now);
  const stored = attempt.result as StoredResult & { params?: Params };
  return {
    id: attempt.id,
    labId: attempt.labId,
    labTitle: lab.title,
    templateKey: lab.templateKey,
    number: attempt.number,
    status: "graded" as const,
    submittedAt: attempt.submittedAt,
    gradedAt: attempt.gradedAt,
    score: attempt.score,
    rawScore: attempt.rawScore,
    maxScore: attempt.maxScore,
    lateDays: attempt.lateDays,
    penaltyPercent: attempt.penaltyPercent,
    graderVersion: attempt.graderVersion,
    expectedShown: show,
    params: stored.params,
    results: presentResults(lab.templateKey, stored, show),
    uploadIds: attempt.uploadIds,
    /** what the student typed, as typed */
    typed: { readings: attempt.readings as Record<string, string | null>, measured: ((attempt.measured as { typed?: Record<string, string | null> }).typed ?? {}) },
    reviewRequestedAt: attempt.reviewRequestedAt,
    reviewMessage: attempt.reviewMessage,
    reviewAnswer: attempt.reviewAnswer,
    reviewAnsweredAt: attempt.reviewAnsweredAt,
    reviewOpen: reviewIsOpen(attempt),
    changedByStaff: attempt.changedByStaff,
    /** the readings came from the simulated bench */
    simulated: attempt.simulated,
  };
}

export type PresentedAttempt = ReturnType<typeof presentAttempt>;

export const HELD_NOTICE = "Graded, not yet released";

/** While a lab's grades are held, a student sees that an attempt was graded, not its result. */
export function heldAttempt(attempt: { id: string; labId: string; number: number; submittedAt: Date }, lab: Lab) {
  return { id: attempt.id, labId: attempt.labId, labTitle: lab.title, number: attempt.number, status: "held" as const, submittedAt: attempt.submittedAt, notice: HELD_NOTICE };
}

/** The attempt as this viewer may see it now: held grades hide the result from students. */
export function viewAttempt(attempt: AttemptRow, lab: Lab, viewerIsStaff: boolean, studentAttempts: number, now = new Date()) {
  return !viewerIsStaff && lab.gradesHeld ? heldAttempt(attempt, lab) : presentAttempt(attempt, lab, viewerIsStaff, studentAttempts, now);
}

/** A student's own attempts; for staff every attempt, or one student's when `studentId` is given. */
export async function attemptsFor(lab: Lab, access: CourseAccess, now = new Date(), studentId?: string) {
  const staff = isStaff(access.role);
  const rows = await listAttempts(db, lab.id, staff ? studentId : access.user.id);
  const counts = new Map<string, number>();
  for (const r of rows) counts.set(r.userId, (counts.get(r.userId) ?? 0) + 1);
  return rows.map((r) => ({ ...presentAttempt(r, lab, staff, counts.get(r.userId)!, now), studentId: r.userId, studentName: r.studentName }));
}

