// Lab rules applied around the grader: dates, attempts, late penalty and which attempt counts.
// Pure functions, so the rules are tested without a database.

export interface LabRules {
  opensAt: Date | null;
  dueAt: Date | null;
  attemptsAllowed: number;
  latePenaltyPercentPerDay: number;
  lateFloorPercent: number;
  counting: "best" | "last";
  showExpected: "after_attempt" | "after_due" | "never";
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

/** Whether a student may see expected values, bands and worked solutions now. */
export function expectedVisible(rules: Pick<LabRules, "showExpected" | "dueAt">, now: Date): boolean {
  if (rules.showExpected === "after_attempt") return true;
  if (rules.showExpected === "never") return false;
  return !rules.dueAt || now.getTime() > rules.dueAt.getTime();
}
