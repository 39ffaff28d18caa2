// The one set of authorization helpers. Every page, server action and route handler asks these; the
// proxy only redirects early. Course roles are read from the database on every call.
import "server-only";
import { getToken } from "next-auth/jwt";
import { cache } from "react";
import { cookies } from "next/headers";
import { notFound as pageNotFound, redirect } from "next/navigation";
import { db } from "@/db";
import { findCourseForMember, type CourseRow } from "@/db/queries/courses";
import type { PublicUser } from "@/db/queries/users";
import type { Role } from "@/db/types";
import { AppError, forbidden, notFound, unauthorized } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { authOptions, sessionOf, sessionUser } from "./options";
import { decodeSessionToken } from "./session-token";

export const STAFF: Role[] = ["ta", "instructor"];
export const EVERYONE: Role[] = ["student", "ta", "instructor"];

/** The request's session token (decrypted from its cookie), once per request. */
const requestToken = cache(async () =>
  getToken({ req: { cookies: await cookies(), headers: {} } as unknown as Parameters<typeof getToken>[0]["req"], secureCookie: authOptions.useSecureCookies, decode: decodeSessionToken }),
);

/**
 * The signed-in user, read once per request (the layout and the page share it): the session cookie is
 * decrypted here and the user with their session is one statement (db/queries/sessions.ts). (next-auth's
 * getServerSession would also run its callbacks and sign a renewed cookie that a server component cannot set.)
 */
export const currentUser = cache(async (): Promise<PublicUser | null> => sessionUser(await requestToken()));

/** The id of the caller's session (the row their cookie names), or null when not signed in. */
export async function currentSessionId(): Promise<string | null> {
  if (!(await currentUser())) return null;
  return sessionOf(await requestToken())?.sessionId ?? null;
}

export async function requireUser(): Promise<PublicUser> {
  const user = await currentUser();
  if (!user) throw unauthorized();
  return user;
}

export interface CourseAccess {
  user: PublicUser;
  course: CourseRow;
  /** The member's role; a site admin who is not a member acts as instructor. */
  role: Role;
  section: string | null;
}

/**
 * Signed in, member of the course, and one of `allowed`. A non-member (or a course that does not exist)
 * gets not_found, so outsiders cannot learn which courses exist; a member with another role, forbidden.
 */
export async function requireCourseRole(courseId: string, allowed: Role[] = EVERYONE): Promise<CourseAccess> {
  const user = await requireUser();
  if (!uuidSchema.safeParse(courseId).success) throw notFound("That course");
  const found = await findCourseForMember(db, courseId, user.id);
  if (!found) throw notFound("That course");
  return courseAccess(user, found.course, found.membership, allowed);
}

/** The access of a signed-in user to a course already read with their membership (see requireCourseRole). */
export function courseAccess(user: PublicUser, course: CourseRow, membership: { role: Role; section: string | null } | null, allowed: Role[] = EVERYONE): CourseAccess {
  const role: Role | undefined = membership?.role ?? (user.isAdmin ? "instructor" : undefined);
  if (!role) throw notFound("That course");
  const access = { user, course, role, section: membership?.section ?? null };
  assertRole(access, allowed);
  return access;
}

/** Throws forbidden unless the member's role is one of `allowed`. */
export function assertRole(access: CourseAccess, allowed: Role[]): void {
  if (!allowed.includes(access.role)) {
    throw forbidden(allowed.every((r) => r !== "student") ? "Only the course staff can see this." : undefined);
  }
}

export const isStaff = (role: Role) => role === "ta" || role === "instructor";

/**
 * For pages: turns an AppError into what a page does with it: sign-in redirect, not-found page, or a
 * `{ refused }` value that the page renders as a refusal.
 */
export async function forPage<T>(p: Promise<T>, here?: string): Promise<T | { refused: string }> {
  try {
    return await p;
  } catch (e) {
    if (e instanceof AppError) {
      if (e.code === "unauthorized") redirect(here ? `/signin?next=${encodeURIComponent(here)}` : "/signin");
      if (e.code === "not_found") pageNotFound();
      if (e.code === "forbidden") return { refused: e.message };
    }
    throw e;
  }
}

export function refused<T>(v: T | { refused: string }): v is { refused: string } {
  return typeof v === "object" && v !== null && "refused" in v;
}

/** Signed in with the site-wide admin flag; anyone else is refused (403). */
export async function requireAdmin(): Promise<PublicUser> {
  const user = await requireUser();
  if (!user.isAdmin) throw forbidden("Only a site administrator can do this.");
  return user;
}
