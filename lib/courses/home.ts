// Loads what the home pages show. Callers authorize first (the course role decides which one is called).
import "server-only";
import { db } from "@/db";
import { draftLabs, labsWithDates, openReviewRequests, regradesInProgress, studentAttemptScores, studentReviewRequests } from "@/db/queries/course-home";
import { lessonsForStudents } from "@/lib/courses/lesson-plan";
import type { Lab } from "@/lib/labs/grading";
import { closeOf } from "@/lib/labs/policy";
import { studentSummary, type HomeLab } from "./home-summary";

const WEEK = 7 * 24 * 3600 * 1000;

export function homeLab(lab: Lab): HomeLab {
  return {
    id: lab.id,
    title: lab.title,
    opensAt: lab.opensAt,
    dueAt: lab.dueAt,
    attemptsAllowed: lab.attemptsAllowed,
    counting: lab.counting,
    maxPoints: lab.questions.reduce((s, q) => s + q.points, 0),
    gradesHeld: lab.gradesHeld,
  };
}

/**
 * The lessons to point a student at: the one that opened most recently (or, when none has an opening
 * date, the first of the plan), and the next one to open.
 */
async function nextLesson(courseId: string, now: Date) {
  const lessons = await lessonsForStudents(courseId, now);
  const open = lessons.filter((l) => l.open);
  const dated = open.filter((l) => l.opensAt).sort((a, b) => b.opensAt!.getTime() - a.opensAt!.getTime());
  const current = dated[0] ?? open[0];
  const upcoming = lessons.filter((l) => !l.open && l.opensAt).sort((a, b) => a.opensAt!.getTime() - b.opensAt!.getTime())[0];
  return {
    current: current ? { slug: current.slug, title: current.title, latest: Boolean(dated[0]) } : null,
    upcoming: upcoming ? { slug: upcoming.slug, title: upcoming.title, opensAt: upcoming.opensAt } : null,
  };
}

export async function studentHome(courseId: string, userId: string, publishedLabs: Lab[], now = new Date()) {
  const [attempts, reviews, lesson] = await Promise.all([
    studentAttemptScores(db, courseId, userId),
    studentReviewRequests(db, courseId, userId),
    nextLesson(courseId, now),
  ]);
  return { summary: studentSummary(publishedLabs.map(homeLab), attempts, now), reviews, lesson };
}

export async function staffHome(courseId: string, now = new Date()) {
  const [reviews, dated, regrades, drafts] = await Promise.all([openReviewRequests(db, courseId), labsWithDates(db, courseId, now), regradesInProgress(db, courseId), draftLabs(db, courseId)]);
  // "closing" is when a lab stops taking attempts: its explicit close, else the due date plus the days
  // the late penalty takes to reach its floor. A lab due this week that takes late work for longer is
  // not closing yet; one past its due date that closes this week is (its missing students can still submit).
  const ahead = dated
    .map(({ latePenaltyPercentPerDay, lateFloorPercent, ...l }) => ({ ...l, closesAt: closeOf({ ...l, latePenaltyPercentPerDay, lateFloorPercent }) }))
    .filter((l): l is typeof l & { closesAt: Date } => l.closesAt !== null && l.closesAt.getTime() >= now.getTime())
    .sort((a, b) => a.closesAt.getTime() - b.closesAt.getTime());
  const closing = ahead.filter((l) => l.closesAt.getTime() < now.getTime() + WEEK);
  // with nothing closing this week, the next lab to close later (so the page still says what comes next)
  const nextLater = closing.length === 0 ? (ahead[0] ?? null) : null;
  return { reviews, closing, nextLater, regrades, drafts };
}
