// Where a lab stands for students, for the course's labs list. Pure, so it is tested without a database.
export type LabState = "upcoming" | "open" | "closed";

export interface Schedule {
  opensAt: Date | string | null;
  dueAt: Date | string | null;
}

function time(d: Date | string | null): number | null {
  if (!d) return null;
  const t = (d instanceof Date ? d : new Date(d)).getTime();
  return Number.isNaN(t) ? null : t;
}

/** Upcoming before it opens, open until the due date, closed after it (late attempts may still be accepted). */
export function labState(lab: Schedule, now: Date): LabState {
  const opens = time(lab.opensAt);
  const due = time(lab.dueAt);
  if (opens !== null && now.getTime() < opens) return "upcoming";
  if (due !== null && now.getTime() > due) return "closed";
  return "open";
}

export const STATE_LABEL: Record<LabState, string> = { upcoming: "Upcoming", open: "Open", closed: "Closed" };
