"use client";
// The review queue: the course's review requests, open ones first (oldest first), then answered ones.
// Fetched from GET /api/courses/{courseId}/reviews and fetched again when the window regains focus, so a
// teaching assistant coming back to the tab sees requests that arrived meanwhile.
import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useId, useState } from "react";
import { api, type Jsonified } from "@/lib/http/client";
import type { ReviewItem } from "@/db/queries/reviews";
import { utcDate } from "@/lib/dates";
import { loadError } from "../labs/feedback/types";
import { points } from "../labs/feedback/verdict";

type Item = Jsonified<ReviewItem>;
type Flag = "" | "true" | "false";

interface Filters {
  status: "open" | "answered" | "all";
  labId: string;
  section: string;
  mistake: Flag;
  late: Flag;
  changed: Flag;
}

export function ReviewQueue({ courseId, labs, sections }: { courseId: string; labs: { id: string; title: string }[]; sections: string[] }) {
  const id = useId();
  const [f, setF] = useState<Filters>({ status: "open", labId: "", section: "", mistake: "", late: "", changed: "" });
  const search = new URLSearchParams(Object.entries(f).filter(([, v]) => v !== "")).toString();
  const q = useQuery({
    queryKey: ["reviews", courseId, search],
    queryFn: ({ signal }) => api<{ reviews: Item[] }>(`/api/courses/${courseId}/reviews?${search}`, { signal }).then((b) => b.reviews),
    refetchOnWindowFocus: true,
    staleTime: 0,
    placeholderData: (previous) => previous,
  });
  const set = <K extends keyof Filters>(k: K) => (e: { target: { value: string } }) => setF((old) => ({ ...old, [k]: e.target.value as Filters[K] }));
  const yesNo = (k: "mistake" | "late" | "changed", label: string, yes: string, no: string) => (
    <div>
      <label htmlFor={`${id}-${k}`} className="field-label">
        {label}
      </label>
      <select id={`${id}-${k}`} className="field-input" value={f[k]} onChange={set(k)}>
        <option value="">either</option>
        <option value="true">{yes}</option>
        <option value="false">{no}</option>
      </select>
    </div>
  );

  return (
    <>
      <form aria-label="Filter the review requests" className="card mt-4 grid gap-3 sm:grid-cols-3" onSubmit={(e) => e.preventDefault()}>
        <div>
          <label htmlFor={`${id}-status`} className="field-label">
            Requests
          </label>
          <select id={`${id}-status`} className="field-input" value={f.status} onChange={set("status")}>
            <option value="open">waiting for an answer</option>
            <option value="answered">answered</option>
            <option value="all">all</option>
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-lab`} className="field-label">
            Lab
          </label>
          <select id={`${id}-lab`} className="field-input" value={f.labId} onChange={set("labId")}>
            <option value="">every lab</option>
            {labs.map((l) => (
              <option key={l.id} value={l.id}>
                {l.title}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-section`} className="field-label">
            Section
          </label>
          <select id={`${id}-section`} className="field-input" value={f.section} onChange={set("section")}>
            <option value="">every section</option>
            {sections.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </div>
        {yesNo("mistake", "Recognised mistake", "with one", "without")}
        {yesNo("late", "Submitted late", "late", "on time")}
        {yesNo("changed", "Points changed by staff", "changed", "not changed")}
      </form>

      <div className="mt-6" aria-busy={q.isFetching}>
        {q.isPending ? (
          <p className="text-sm text-ink-soft">Loading the requests…</p>
        ) : q.isError ? (
          <p className="text-sm text-verdict-wrong" role="alert">
            {loadError(q.error, "the review requests")}
          </p>
        ) : q.data.length === 0 ? (
          <p className="text-sm text-ink-soft" role="status">
            No review requests match these filters.
          </p>
        ) : (
          <>
            <p className="sr-only" role="status">
              {q.data.length} request{q.data.length === 1 ? "" : "s"}
            </p>
            <ul className="space-y-3" data-testid="review-queue">
              {q.data.map((r) => (
                <li key={r.attemptId} className={`card border-l-4 ${r.status === "open" ? "border-copper" : "border-ink/15"}`} data-status={r.status}>
                  <div className="flex flex-wrap items-baseline justify-between gap-2">
                    <h2 className="text-lg">
                      <Link href={`/courses/${courseId}/reviews/${r.attemptId}`}>
                        {r.student.name}: {r.labTitle}
                      </Link>
                    </h2>
                    <p className="text-sm tabular-nums">
                      {points(r.score)} of {points(r.maxScore)} points
                    </p>
                  </div>
                  <p className="text-sm text-ink-soft">
                    {r.student.section ? `Section ${r.student.section} · ` : ""}asked {utcDate(r.requestedAt)} ·{" "}
                    {r.status === "open" ? <span className="font-semibold text-copper-dark">waiting for an answer</span> : `answered ${utcDate(r.answeredAt)}${r.answeredBy ? ` by ${r.answeredBy}` : ""}`}
                  </p>
                  {r.message ? <p className="mt-2 line-clamp-3 whitespace-pre-line text-sm">{r.message}</p> : null}
                </li>
              ))}
            </ul>
          </>
        )}
      </div>
    </>
  );
}
