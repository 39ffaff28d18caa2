// The instruments of a course: what the routes and the course's instruments page read and change.
import "server-only";
import { db } from "@/db";
import { deleteInstrument, findInstrument, insertInstrument, listInstruments, lockInstrument, publishedLabsUsing, updateInstrument, type InstrumentRow } from "@/db/queries/instruments";
import { requireCourseRole, type CourseAccess } from "@/lib/auth/access";
import { AppError, notFound } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { applyPatch, instrumentProfileSchema, type InstrumentCreate, type InstrumentPatch } from "@/lib/validation/instruments";
import { parseOr400 } from "@/lib/validation/zod-errors";
import { copyOfLibrary, LIBRARY } from "./library";
import type { InstrumentProfile } from "./profile";

/** A stored instrument as the API shows it: `{ id, name, kind, ranges, autoRange?, offset?, description? }`. */
export type InstrumentJson = InstrumentProfile & { id: string };

export function instrumentJson(row: InstrumentRow): InstrumentJson {
  const p = row.profile as InstrumentProfile;
  return {
    id: row.id,
    name: p.name,
    kind: p.kind,
    ranges: p.ranges,
    ...(p.autoRange ? { autoRange: p.autoRange } : {}),
    ...(p.offset ? { offset: p.offset } : {}),
    ...(p.description ? { description: p.description } : {}),
  };
}

/** The built-in profiles, each with the key `POST … { copyOf }` takes. */
export function libraryJson() {
  return { instruments: LIBRARY.map((i) => structuredClone(i)) };
}

export async function courseInstruments(courseId: string): Promise<InstrumentJson[]> {
  return (await listInstruments(db, courseId)).map(instrumentJson);
}

export async function createInstrument(access: CourseAccess, input: InstrumentCreate): Promise<InstrumentJson> {
  let profile: InstrumentProfile;
  let libraryKey: string | null = null;
  if ("copyOf" in input) {
    const copy = copyOfLibrary(input.copyOf);
    if (!copy) throw new AppError("bad_request", "copyOf names no built-in instrument.", { copyOf: ["copyOf names no built-in instrument."] });
    profile = { ...copy, name: input.name ?? `${copy.name} (copy)` };
    libraryKey = input.copyOf;
  } else profile = input as InstrumentProfile;
  return instrumentJson(await insertInstrument(db, access.course.id, profile, libraryKey));
}

/** The instrument and the caller's access to its course (404 for an unknown id or a course the caller is not in). */
export async function instrumentWithAccess(instrumentId: string, roles: Parameters<typeof requireCourseRole>[1]): Promise<{ row: InstrumentRow; access: CourseAccess }> {
  if (!uuidSchema.safeParse(instrumentId).success) throw notFound("That instrument");
  const row = await findInstrument(db, instrumentId);
  if (!row) throw notFound("That instrument");
  const access = await requireCourseRole(row.courseId, roles);
  return { row, access };
}

export async function patchInstrument(instrumentId: string, patch: InstrumentPatch): Promise<InstrumentJson> {
  return db.transaction().execute(async (trx) => {
    await lockInstrument(trx, instrumentId);
    const row = await findInstrument(trx, instrumentId);
    if (!row) throw new AppError("not_found", "No such instrument.");
    const next = parseOr400(instrumentProfileSchema, applyPatch(row.profile as InstrumentProfile, patch)) as InstrumentProfile;
    const saved = await updateInstrument(trx, instrumentId, next);
    if (!saved) throw new AppError("not_found", "No such instrument.");
    return instrumentJson(saved);
  });
}

export async function removeInstrument(instrumentId: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await lockInstrument(trx, instrumentId);
    const labs = await publishedLabsUsing(trx, instrumentId);
    if (labs.length) throw new AppError("conflict", `Published labs use this instrument (${labs.join(", ")}); it cannot be deleted while they do.`);
    await deleteInstrument(trx, instrumentId);
  });
}
