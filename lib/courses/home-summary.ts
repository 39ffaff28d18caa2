// What a course home says is next for a student: pure functions over the labs and the student's attempts.
import { countingAttempt, isOpen } from "@/lib/labs/policy";

export interface HomeLab {
  id: string;
  title: string;
  opensAt: Date | null;
  dueAt: Date | null;
  attemptsAllowed: number;
  counting: "best" | "last";
  maxPoints: number;
  /** the instructor holds this lab's grades: the student sees no score yet */
  gradesHeld?: boolean;
}

export interface HomeAttempt {
  id: string;
  labId: string;
  number: number;
  score: number;
  maxScore: number;
}

export interface LabStanding {
  lab: HomeLab;
  attemptsUsed: number;
  attemptsLeft: number;
  /** the attempt that counts (best or last, as the lab says), or null before the first */
  counted: { attemptId: string; score: number; maxScore: number } | null;
}

export interface StudentSummary {
  /** the open lab with the soonest due date still ahead (and attempts left) */
  nextDue: (LabStanding & { msLeft: number }) | null;
  /** open labs where the student still has attempts, soonest due first */
  open: LabStanding[];
  /** every published lab with the counted score, in due order */
  standings: LabStanding[];
  /** labs that open later */
  upcoming: HomeLab[];
}

const byDue = (a: HomeLab, b: HomeLab) => (a.dueAt?.getTime() ?? Infinity) - (b.dueAt?.getTime() ?? Infinity);

export function studentSummary(labs: HomeLab[], attempts: HomeAttempt[], now: Date): StudentSummary {
  const sorted = [...labs].sort(byDue);
  const standings = sorted.map((lab): LabStanding => {
    const mine = attempts.filter((a) => a.labId === lab.id);
    const c = countingAttempt(mine, lab.counting);
    return {
      lab,
      attemptsUsed: mine.length,
      attemptsLeft: Math.max(0, lab.attemptsAllowed - mine.length),
      counted: c && !lab.gradesHeld ? { attemptId: c.id, score: c.score, maxScore: c.maxScore } : null,
    };
  });
  const open = standings.filter((s) => isOpen(s.lab, now) && s.attemptsLeft > 0);
  const ahead = open.find((s) => s.lab.dueAt && s.lab.dueAt.getTime() > now.getTime());
  return {
    nextDue: ahead ? { ...ahead, msLeft: ahead.lab.dueAt!.getTime() - now.getTime() } : null,
    open,
    standings: standings.filter((s) => isOpen(s.lab, now)),
    upcoming: sorted.filter((l) => !isOpen(l, now)).sort((a, b) => a.opensAt!.getTime() - b.opensAt!.getTime()),
  };
}

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;

const plural = (n: number, unit: string) => `${n} ${unit}${n === 1 ? "" : "s"}`;

/** "3 days 4 hours", "5 hours 10 minutes", "12 minutes", "less than a minute": the two largest units. */
export function timeLeft(ms: number): string {
  if (ms < MINUTE) return "less than a minute";
  const days = Math.floor(ms / DAY);
  const hours = Math.floor((ms % DAY) / HOUR);
  const minutes = Math.floor((ms % HOUR) / MINUTE);
  if (days > 0) return hours > 0 ? `${plural(days, "day")} ${plural(hours, "hour")}` : plural(days, "day");
  if (hours > 0) return minutes > 0 ? `${plural(hours, "hour")} ${plural(minutes, "minute")}` : plural(hours, "hour");
  return plural(minutes, "minute");
}
