"use client";
// Progress of a lab's regrade job: polls GET /api/labs/{labId} until the latest regrade is done or failed.
import { useQuery } from "@tanstack/react-query";
import { api } from "@/lib/http/client";

type Regrade = { id?: string; status: "queued" | "running" | "done" | "failed"; total: number; done: number };

const finished = (r: Regrade | undefined) => r?.status === "done" || r?.status === "failed";

export function RegradeProgress({ labId, regradeId, total, intervalMs = 1000 }: { labId: string; regradeId: string; total: number; intervalMs?: number }) {
  const poll = useQuery({
    queryKey: ["lab", labId, "regrade"],
    queryFn: ({ signal }) => api<{ regrade?: Regrade | null }>(`/api/labs/${labId}`, { signal }),
    // Only this regrade's progress counts; an older one in the answer is ignored.
    select: (body): Regrade | undefined => (body.regrade && (!body.regrade.id || body.regrade.id === regradeId) ? body.regrade : undefined),
    refetchInterval: (q) => {
      const r = q.state.data?.regrade;
      return r && (!r.id || r.id === regradeId) && finished(r) ? false : intervalMs;
    },
    // Keep polling through failures: each one is reported and the next poll tries again.
    refetchIntervalInBackground: true,
    retry: false,
    staleTime: 0,
  });
  const state: Regrade = poll.data ?? { id: regradeId, status: "queued", total, done: 0 };
  const problem = poll.isError && !finished(poll.data) ? "Could not fetch the progress; trying again." : null;

  const max = Math.max(state.total, 0);
  const now = state.status === "done" ? max : Math.min(state.done, max);
  const percent = max === 0 ? 100 : Math.round((now / max) * 100);
  const label =
    state.status === "done"
      ? `Regrade finished: ${max} attempt${max === 1 ? "" : "s"} recomputed.`
      : state.status === "failed"
        ? `Regrade failed after ${now} of ${max} attempts. Save again to retry, or ask an administrator.`
        : state.status === "queued"
          ? `Regrade waiting to start (${max} attempt${max === 1 ? "" : "s"}).`
          : `Recomputing grades: ${now} of ${max} attempts.`;
  return (
    <section className="card my-4" aria-labelledby="regrade-title" data-testid="regrade-progress">
      <h2 id="regrade-title" className="text-lg">
        Recomputing grades
      </h2>
      <div
        role="progressbar"
        aria-label="Attempts recomputed"
        aria-valuemin={0}
        aria-valuemax={max}
        aria-valuenow={now}
        aria-valuetext={`${now} of ${max} attempts (${percent} %)`}
        className="mt-2 h-3 w-full overflow-hidden rounded-full bg-paper-sunk"
      >
        <div className={`h-full ${state.status === "failed" ? "bg-verdict-wrong" : "bg-copper"} transition-[width]`} style={{ width: `${percent}%` }} />
      </div>
      <p className="mt-2 text-sm" role="status" aria-live="polite">
        {label}
      </p>
      {problem ? <p className="mt-1 text-sm text-ink-soft">{problem}</p> : null}
    </section>
  );
}
