// Lab rules applied around the grader: dates, attempts, late penalty and which attempt counts.
// Pure functions, so the rules are tested without a database.
import type { ShowExpected } from "@/db/types";

export interface LabRules {
  opensAt: Date | null;
  dueAt: Date | null;
  attemptsAllowed: number;
  latePenaltyPercentPerDay: number;
  lateFloorPercent: number;
  counting: "best" | "last";
  showExpected: ShowExpected;
  /** The explicit close (late attempts accepted until then); null: the default close, see `closeOf`. */
  closesAt: Date | null;
}

const DAY = 24 * 3600 * 1000;

/** Whole days late, counting any part of a day as a day; 0 when on time or without a due date. */
export function lateDays(rules: Pick<LabRules, "dueAt">, submittedAt: Date): number {
  if (!rules.dueAt) return 0;
  const late = submittedAt.getTime() - rules.dueAt.getTime();
  return late > 0 ? Math.ceil(late / DAY) : 0;
}

/**
 * The penalty in percent of the raw score: `perDay` for each day late, never leaving less than
 * `lateFloorPercent` of the raw score.
 */
export function latePenaltyPercent(rules: Pick<LabRules, "latePenaltyPercentPerDay" | "lateFloorPercent">, days: number): number {
  const penalty = days * rules.latePenaltyPercentPerDay;
  return Math.max(0, Math.min(penalty, 100 - rules.lateFloorPercent, 100));
}

export function applyPenalty(rawScore: number, penaltyPercent: number): number {
  return Math.round(rawScore * (1 - penaltyPercent / 100) * 1000) / 1000;
}

/** The attempt that counts for the gradebook: the best score, or the last submitted. */
export function countingAttempt<T extends { score: number; number: number }>(attempts: T[], counting: LabRules["counting"]): T | undefined {
  if (attempts.length === 0) return undefined;
  if (counting === "last") return attempts.reduce((a, b) => (b.number > a.number ? b : a));
  return attempts.reduce((a, b) => (b.score > a.score || (b.score === a.score && b.number > a.number) ? b : a));
}

export function isOpen(rules: Pick<LabRules, "opensAt">, now: Date): boolean {
  return !rules.opensAt || rules.opensAt.getTime() <= now.getTime();
}

/**
 * Days after the due date until the late penalty reaches its floor (the score can fall no further):
 * 0 without a penalty, so that by default a lab without a late penalty takes no late attempts.
 */
export function daysToFloor(rules: Pick<LabRules, "latePenaltyPercentPerDay" | "lateFloorPercent">): number {
  if (!(rules.latePenaltyPercentPerDay > 0)) return 0;
  return Math.max(0, Math.ceil((100 - rules.lateFloorPercent) / rules.latePenaltyPercentPerDay));
}

/** The default close: the due date plus the days the late penalty takes to reach its floor. */
export function defaultClose(rules: Pick<LabRules, "dueAt" | "latePenaltyPercentPerDay" | "lateFloorPercent">): Date | null {
  if (!rules.dueAt) return null;
  return new Date(rules.dueAt.getTime() + daysToFloor(rules) * DAY);
}

/** When the lab stops accepting attempts: the explicit close, else the default one; null never closes. */
export function closeOf(rules: Pick<LabRules, "closesAt" | "dueAt" | "latePenaltyPercentPerDay" | "lateFloorPercent">): Date | null {
  return rules.closesAt ?? defaultClose(rules);
}

/** Whether the lab has closed: no attempt is accepted any more. */
export function isClosed(rules: Pick<LabRules, "closesAt" | "dueAt" | "latePenaltyPercentPerDay" | "lateFloorPercent">, now: Date): boolean {
  const close = closeOf(rules);
  return close !== null && now.getTime() > close.getTime();
}

type ExpectedRules = Pick<LabRules, "showExpected" | "dueAt" | "closesAt" | "attemptsAllowed" | "latePenaltyPercentPerDay" | "lateFloorPercent">;

/** Whether a student with `attemptsUsed` attempts can still earn points: attempts left and the lab not closed. */
export function canStillEarn(rules: Omit<ExpectedRules, "showExpected">, attemptsUsed: number, now: Date): boolean {
  return attemptsUsed < rules.attemptsAllowed && !isClosed(rules, now);
}

/**
 * Whether a student may see expected values, bands and worked solutions now. The one rule: never while
 * they can still earn points (attempts left and the lab still accepting attempts), whatever the lab's
 * setting; after that, as the setting says ("after the due date" also waits for the due date). Staff
 * always see them; callers decide that before asking.
 */
export function expectedVisible(rules: ExpectedRules, attemptsUsed: number, now: Date): boolean {
  if (rules.showExpected === "never") return false;
  if (canStillEarn(rules, attemptsUsed, now)) return false;
  if (rules.showExpected === "after_due") return !rules.dueAt || now.getTime() > rules.dueAt.getTime();
  return true;
}

/** When a student will see expected values, in words, for the builder and the handout. */
export function expectedWhenText(rules: ExpectedRules, formatDate: (d: Date) => string): string {
  if (rules.showExpected === "never") return "Never shown to students; they see their verdicts and feedback.";
  const close = closeOf(rules);
  const all = `all ${rules.attemptsAllowed} attempt${rules.attemptsAllowed === 1 ? " is" : "s are"} used`;
  const when = close ? `once ${all} or the lab closes (${formatDate(close)}), whichever comes first` : `once ${all} (the lab has no close date)`;
  const due = rules.showExpected === "after_due" && rules.dueAt ? `, and not before the due date (${formatDate(rules.dueAt)})` : "";
  return `Expected values, bands and worked solutions appear ${when}${due}: never while points can still be earned.`;
}

/** One student's exception to a lab's rules (granted by the instructor with a reason). */
export interface LabException {
  dueAt: Date | null;
  closesAt: Date | null;
  extraAttempts: number;
  reason: string;
}

/**
 * The lab's rules for a student with an exception: their own due date (no late penalty before it), their
 * own close, and the extra attempts added to the lab's. A new due date without a new close moves an
 * explicit close by as much as the due date moved (never earlier); the default close follows the due date
 * by itself.
 */
export function withException<R extends Pick<LabRules, "dueAt" | "closesAt" | "attemptsAllowed">>(rules: R, ex: LabException | null | undefined): R {
  if (!ex) return rules;
  const dueAt = ex.dueAt ?? rules.dueAt;
  let closesAt = ex.closesAt ?? rules.closesAt;
  if (!ex.closesAt && ex.dueAt && rules.closesAt && rules.dueAt) {
    const moved = ex.dueAt.getTime() - rules.dueAt.getTime();
    if (moved > 0) closesAt = new Date(rules.closesAt.getTime() + moved);
  }
  if (!ex.closesAt && ex.dueAt && rules.closesAt && !rules.dueAt && rules.closesAt < ex.dueAt) closesAt = ex.dueAt;
  return { ...rules, dueAt, closesAt, attemptsAllowed: rules.attemptsAllowed + ex.extraAttempts };
}
