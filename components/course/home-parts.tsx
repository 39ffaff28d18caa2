// Pieces of the course home pages: what a student should do next, and what the staff should look at.
import Link from "next/link";
import { timeLeft, type StudentSummary } from "@/lib/courses/home-summary";

export function when(d: Date | string | null | undefined): string {
  if (!d) return "";
  return new Intl.DateTimeFormat("en-GB", { weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", timeZoneName: "short" }).format(new Date(d));
}

const points = (n: number) => (Math.round(n * 100) / 100).toString();

export function Panel({ title, children, id }: { title: string; children: React.ReactNode; id: string }) {
  return (
    <section className="card" aria-labelledby={id}>
      <h2 id={id} className="text-lg">{title}</h2>
      <div className="mt-2 text-sm">{children}</div>
    </section>
  );
}

export function NextLabDue({ summary }: { summary: StudentSummary }) {
  const n = summary.nextDue;
  if (!n) {
    return (
      <section className="card border-copper/30" aria-labelledby="next-due">
        <h2 id="next-due" className="text-lg">Next lab due</h2>
        <p className="mt-2 text-sm text-ink-soft">
          {summary.upcoming[0] ? `Nothing is due right now. ${summary.upcoming[0].title} opens ${when(summary.upcoming[0].opensAt)}.` : "Nothing is due right now."}
        </p>
      </section>
    );
  }
  return (
    <section className="card border-copper/40 bg-copper-pale/40" aria-labelledby="next-due">
      <h2 id="next-due" className="text-lg">Next lab due</h2>
      <p className="mt-2 text-xl font-semibold">
        <Link href={`/labs/${n.lab.id}`}>{n.lab.title}</Link>
      </p>
      <p className="mt-1 text-sm">
        Due {when(n.lab.dueAt)}: <strong>{timeLeft(n.msLeft)} left</strong>. {n.attemptsLeft} of {n.lab.attemptsAllowed} attempt{n.lab.attemptsAllowed === 1 ? "" : "s"} left
        {n.counted ? `; counted so far ${points(n.counted.score)} of ${points(n.counted.maxScore)}` : ""}.
      </p>
      <p className="mt-3">
        <Link className="btn-primary no-underline" href={`/labs/${n.lab.id}`}>{n.attemptsUsed ? "Try again" : "Open the handout"}</Link>
      </p>
    </section>
  );
}

export function OpenLabs({ summary, now }: { summary: StudentSummary; now: Date }) {
  return (
    <Panel title="Labs open to you" id="open-labs">
      {summary.open.length === 0 ? (
        <p className="text-ink-soft">No open lab has attempts left.</p>
      ) : (
        <ul className="space-y-1">
          {summary.open.map((s) => (
            <li key={s.lab.id}>
              <Link href={`/labs/${s.lab.id}`}>{s.lab.title}</Link>: {s.attemptsLeft} attempt{s.attemptsLeft === 1 ? "" : "s"} left
              {s.lab.dueAt ? (s.lab.dueAt.getTime() > now.getTime() ? `, due ${when(s.lab.dueAt)}` : ", past due (late penalty applies)") : ""}
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
