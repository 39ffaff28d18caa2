// Where a lab stands for students, for the course's labs list. Pure, so it is tested without a database.
export type LabState = "upcoming" | "open" | "late" | "closed";

export interface Schedule {
  opensAt: Date | string | null;
  dueAt: Date | string | null;
  /** when attempts stop being accepted (the effective close, lib/labs/policy.ts closeOf); null: never */
  closesAt: Date | string | null;
}

function time(d: Date | string | null): number | null {
  if (!d) return null;
  const t = (d instanceof Date ? d : new Date(d)).getTime();
  return Number.isNaN(t) ? null : t;
}

/**
 * Upcoming before it opens, open until the due date, taking late attempts until it closes, and closed
 * only once no attempt is accepted any more.
 */
export function labState(lab: Schedule, now: Date): LabState {
  const opens = time(lab.opensAt);
  const due = time(lab.dueAt);
  const closes = time(lab.closesAt);
  if (opens !== null && now.getTime() < opens) return "upcoming";
  if (closes !== null && now.getTime() > closes) return "closed";
  if (due !== null && now.getTime() > due) return "late";
  return "open";
}

export const STATE_LABEL: Record<LabState, string> = { upcoming: "Upcoming", open: "Open", late: "Late attempts only", closed: "Closed" };
