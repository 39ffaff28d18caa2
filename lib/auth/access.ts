// The one set of authorization helpers. Every page, server action and route handler asks these; the
// proxy only redirects early. Course roles are read from the database on every call.
import "server-only";
import { getServerSession } from "next-auth";
import { cache } from "react";
import { notFound as pageNotFound, redirect } from "next/navigation";
import { db } from "@/db";
import { findCourse, findMembership } from "@/db/queries/courses";
import { findUserById, sessionsValidAfter, type PublicUser } from "@/db/queries/users";
import type { Role } from "@/db/types";
import { AppError, forbidden, notFound, unauthorized } from "@/lib/errors";
import { uuidSchema } from "@/lib/validation/common";
import { authOptions } from "./options";

export const STAFF: Role[] = ["ta", "instructor"];
export const EVERYONE: Role[] = ["student", "ta", "instructor"];

/** The signed-in user, read once per request (the layout and the page share it). */
export const currentUser = cache(async (): Promise<PublicUser | null> => {
  const session = await getServerSession(authOptions);
  const id = (session?.user as { id?: string } | undefined)?.id;
  if (!id || !uuidSchema.safeParse(id).success) return null;
  // the session callback could not reach the database: check the revocation here, where an error
  // still reaches the caller (503 in a route) instead of reading as "signed out"
  const unchecked = (session as { uncheckedSince?: number } | null)?.uncheckedSince;
  if (typeof unchecked === "number") {
    const validAfter = await sessionsValidAfter(db, id);
    if (validAfter && unchecked < validAfter.getTime()) return null;
  }
  return (await findUserById(db, id)) ?? null;
});

export async function requireUser(): Promise<PublicUser> {
  const user = await currentUser();
  if (!user) throw unauthorized();
  return user;
}

export interface CourseAccess {
  user: PublicUser;
  course: NonNullable<Awaited<ReturnType<typeof findCourse>>>;
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
  const [course, membership] = await Promise.all([findCourse(db, courseId), findMembership(db, courseId, user.id)]);
  if (!course) throw notFound("That course");
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
