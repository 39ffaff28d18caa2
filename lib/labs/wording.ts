// Sentences about a lab's rules that the handout page and the submission form both show. Pure.
import { utcDate } from "@/lib/dates";

/** "3 of 5 attempts left" and friends. */
export function attemptsLeftText(used: number, allowed: number): string {
  const left = Math.max(0, allowed - used);
  if (left === 0) return `You have used all ${allowed} attempt${allowed === 1 ? "" : "s"}.`;
  return `${left} of ${allowed} attempt${allowed === 1 ? "" : "s"} left.`;
}

/** The due date, late rule and close in a sentence or two; `closesAt` is the effective close. */
export function lateRuleText(rules: { dueAt: Date | string | null; closesAt: Date | string | null; latePenaltyPercentPerDay: number; lateFloorPercent: number }): string {
  const closes = rules.closesAt ? ` Closes ${utcDate(rules.closesAt)}: no attempt is accepted after that.` : "";
  if (!rules.dueAt) return `This lab has no due date.${closes}`;
  const due = `Due ${utcDate(rules.dueAt)}.`;
  const lateAccepted = rules.closesAt && new Date(rules.closesAt).getTime() > new Date(rules.dueAt).getTime();
  if (!lateAccepted) return `${due}${closes}`;
  if (!(rules.latePenaltyPercentPerDay > 0)) return `${due} Late attempts are graded without a penalty.${closes}`;
  const floor = rules.lateFloorPercent > 0 ? `, but a late attempt keeps at least ${rules.lateFloorPercent} % of its score` : "";
  return `${due} Each day late (or part of a day) takes ${rules.latePenaltyPercentPerDay} % off the score${floor}.${closes}`;
}
