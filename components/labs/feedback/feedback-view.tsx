"use client";
// The feedback on one attempt. The attempt, its history and its files are fetched in the browser from the
// JSON API; the worked solutions arrive already typeset (KaTeX on the server) as a LaTeX → HTML map.
import Link from "next/link";
import { useCallback, useEffect, useMemo, useState } from "react";
import type { PresentedAttempt } from "@/lib/labs/service";
import type { TraceAnalysis } from "@/lib/trace/types";
import { utcDate } from "../submit/read";
import { ReviewForm } from "./review-form";
import { TracePanel } from "./trace-panel";
import { bandText, expectedValue, points, scoreLine, studentValue, verdictInfo, verdictSummary } from "./verdict";

type Attempt = Omit<PresentedAttempt, "submittedAt" | "gradedAt" | "reviewRequestedAt"> & {
  submittedAt: string;
  gradedAt: string | null;
  reviewRequestedAt: string | null;
};
type Result = Attempt["results"][number];
type HistoryItem = { id: string; number: number; score: number; maxScore: number; submittedAt: string; studentId?: string; results: { verdict: string }[] };
type UploadView = { id: string; kind: "image" | "trace"; contentType: string; size: number; originalName?: string; url?: string; analysis: unknown };

type Load<T> = { state: "loading" } | { state: "ready"; data: T } | { state: "error"; message: string };

async function getJson<T>(url: string): Promise<{ status: number; body: T | null }> {
  try {
    const res = await fetch(url, { cache: "no-store", headers: { accept: "application/json" } });
    return { status: res.status, body: (await res.json().catch(() => null)) as T | null };
  } catch {
    return { status: 0, body: null };
  }
}

function loadMessage(status: number, what: string): string {
  if (status === 0) return `Could not reach the server to load ${what}. Check your connection and reload the page.`;
  if (status === 401) return "Your session has ended. Sign in again to see this feedback.";
  if (status === 404) return `${what[0].toUpperCase()}${what.slice(1)} was not found, or it is not yours to see.`;
  return `Could not load ${what} (HTTP ${status}).`;
}

export interface FeedbackProps {
  attemptId: string;
  labId: string;
  studentId: string;
  studentName: string | null;
  isOwner: boolean;
  typed: Record<string, string | null>;
  solutionHtml: Record<string, string>;
}

export function FeedbackView({ attemptId, labId, studentId, studentName, isOwner, typed, solutionHtml }: FeedbackProps) {
  const [attempt, setAttempt] = useState<Load<Attempt>>({ state: "loading" });
  const [history, setHistory] = useState<Load<HistoryItem[]>>({ state: "loading" });

  const loadAttempt = useCallback(
    () =>
      getJson<{ attempt: Attempt }>(`/api/attempts/${attemptId}`).then(({ status, body }) => {
        if (status === 200 && body?.attempt) setAttempt({ state: "ready", data: body.attempt });
        else setAttempt({ state: "error", message: loadMessage(status, "this attempt") });
      }),
    [attemptId],
  );

  useEffect(() => {
    // Both requests start at once; each state is set when its answer arrives.
    void getJson<{ attempt: Attempt }>(`/api/attempts/${attemptId}`).then(({ status, body }) => {
      if (status === 200 && body?.attempt) setAttempt({ state: "ready", data: body.attempt });
      else setAttempt({ state: "error", message: loadMessage(status, "this attempt") });
    });
    void getJson<{ attempts: HistoryItem[] }>(`/api/labs/${labId}/attempts`).then(({ status, body }) => {
      if (status === 200 && body?.attempts) {
        const mine = body.attempts.filter((a) => !a.studentId || a.studentId === studentId).sort((a, b) => a.number - b.number);
        setHistory({ state: "ready", data: mine });
      } else setHistory({ state: "error", message: loadMessage(status, "the attempt history") });
    });
  }, [attemptId, labId, studentId]);

  return (
    <>
      <p className="no-print text-sm">
        <Link href={`/labs/${labId}`}>← Back to the lab</Link>
      </p>
      <p role="status" className="sr-only">
        {attempt.state === "ready" ? `Graded: ${points(attempt.data.score)} of ${points(attempt.data.maxScore)} points.` : attempt.state === "loading" ? "Loading your grade." : ""}
      </p>
      <div aria-busy={attempt.state === "loading"}>
        {attempt.state === "loading" ? (
          <>
            <h1 className="mt-2 text-3xl">Feedback</h1>
            <p className="mt-4 text-ink-soft">
              Loading your grade…
            </p>
          </>
        ) : attempt.state === "error" ? (
          <>
            <h1 className="mt-2 text-3xl">Feedback</h1>
            <p className="mt-4 rounded-md bg-verdict-wrong/10 p-3 text-verdict-wrong" role="alert">
              {attempt.message}
            </p>
          </>
        ) : (
          <Graded attempt={attempt.data} typed={typed} solutionHtml={solutionHtml} studentName={studentName} />
        )}
      </div>

      {attempt.state === "ready" ? <Files attempt={attempt.data} /> : null}

      <section aria-labelledby="history-heading" className="no-print mt-8">
        <h2 id="history-heading" className="text-xl">
          {isOwner ? "Your attempts at this lab" : "This student's attempts at this lab"}
        </h2>
        {history.state === "loading" ? (
          <p className="mt-2 text-sm text-ink-soft">Loading…</p>
        ) : history.state === "error" ? (
          <p className="mt-2 text-sm text-verdict-wrong">{history.message}</p>
        ) : (
          <ol className="mt-2 space-y-1 text-sm" data-testid="attempt-history">
            {history.data.map((h) => (
              <li key={h.id}>
                {h.id === attemptId ? (
                  <span aria-current="page" className="font-semibold">
                    Attempt {h.number}: {points(h.score)} of {points(h.maxScore)} points (this one)
                  </span>
                ) : (
                  <Link href={`/attempts/${h.id}`}>
                    Attempt {h.number}: {points(h.score)} of {points(h.maxScore)} points
                  </Link>
                )}{" "}
                <span className="text-ink-soft">
                  ({verdictSummary(h.results)}; {utcDate(h.submittedAt)})
                </span>
              </li>
            ))}
          </ol>
        )}
      </section>

      {attempt.state === "ready" ? <Review attempt={attempt.data} isOwner={isOwner} onRequested={() => void loadAttempt()} /> : null}
    </>
  );
}

function Graded({ attempt, typed, solutionHtml, studentName }: { attempt: Attempt; typed: Record<string, string | null>; solutionHtml: Record<string, string>; studentName: string | null }) {
  return (
    <>
      <p className="mt-2 text-xs font-semibold uppercase tracking-wide text-copper">
        Attempt {attempt.number}
        {studentName ? ` · ${studentName}` : ""}
      </p>
      <h1 className="mt-1 text-3xl">Feedback: {attempt.labTitle}</h1>
      <section className="card mt-4" aria-labelledby="score-heading" data-testid="score">
        <h2 id="score-heading" className="sr-only">
          Score
        </h2>
        <p className="text-sm text-ink-soft" data-testid="attempt-status">
          Graded {utcDate(attempt.gradedAt ?? attempt.submittedAt)} · submitted {utcDate(attempt.submittedAt)}
        </p>
        <p className="mt-1 text-3xl font-semibold tabular-nums" data-testid="score-value">
          {points(attempt.score)} <span className="text-lg font-normal text-ink-soft">of {points(attempt.maxScore)} points</span>
        </p>
        <p className="mt-1 text-sm">{scoreLine(attempt)}.</p>
        <p className="mt-1 text-sm text-ink-soft">{verdictSummary(attempt.results)}.</p>
        {!attempt.expectedShown ? (
          <p className="mt-2 text-sm text-ink-soft">This lab does not show the expected values and worked solutions yet; the feedback below says how each answer was judged.</p>
        ) : null}
        <p className="mt-2 text-xs text-ink-soft">Grader version {attempt.graderVersion}</p>
      </section>

      <section aria-labelledby="questions-heading" className="mt-6">
        <h2 id="questions-heading" className="text-xl">
          Question by question
        </h2>
        <ol className="mt-3 space-y-4">
          {attempt.results.map((r, i) => (
            <ResultCard key={r.questionId} index={i} r={r} typed={typed[r.questionId]} solutionHtml={solutionHtml} />
          ))}
        </ol>
      </section>
    </>
  );
}

function ResultCard({ r, index, typed, solutionHtml }: { r: Result; index: number; typed?: string | null; solutionHtml: Record<string, string> }) {
  const v = verdictInfo(r.verdict);
  const expected = expectedValue(r);
  const band = bandText(r);
  return (
    <li className={`card border-l-4 ${v.border}`} data-testid="result" data-verdict={r.verdict} aria-labelledby={`q-${r.questionId}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`q-${r.questionId}`} className="text-lg">
          {index + 1}. {r.label}
        </h3>
        <p className="text-sm tabular-nums">
          {points(r.points)} / {points(r.maxPoints)} points
        </p>
      </div>
      <p className={`mt-1 inline-flex items-center gap-2 rounded-full px-3 py-0.5 text-sm font-semibold ${v.bg} ${v.text}`} data-testid="verdict">
        <span aria-hidden="true" className="font-mono">
          {v.icon}
        </span>
        {v.word}
      </p>
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-ink-soft">Your answer</dt>
          <dd className="m-0 font-semibold tabular-nums">
            {studentValue(r, typed)}
            {typed && r.readAs && typed.trim() !== r.readAs ? <span className="font-normal text-ink-soft"> (you typed “{typed.trim()}”)</span> : null}
          </dd>
        </div>
        {expected ? (
          <div>
            <dt className="text-ink-soft">Expected</dt>
            <dd className="m-0 font-semibold tabular-nums">
              {expected}
              {band ? <span className="block font-normal text-ink-soft">accepted {band}</span> : null}
            </dd>
          </div>
        ) : null}
      </dl>
      {r.mistake ? (
        <div className="mt-3 rounded-md border border-verdict-mistake/40 bg-verdict-mistake/5 p-3 text-sm" data-testid="mistake">
          <p className="font-semibold">What went wrong: {r.mistake.title}</p>
          <p className="mt-1">{r.mistake.explain}</p>
          <p className="mt-1">
            <span className="font-semibold">Next time: </span>
            {r.mistake.fix}
          </p>
        </div>
      ) : null}
      {r.feedback ? <p className="mt-3 text-sm">{r.feedback}</p> : null}
      {r.method ? <p className="mt-2 text-xs text-ink-soft">How the band was set: {r.method}</p> : null}
      {r.traceNote && !r.feedback?.includes(r.traceNote) ? <p className="mt-2 text-sm">{r.traceNote}</p> : null}
      {r.solution && r.solution.length ? (
        <details className="mt-3">
          <summary className="cursor-pointer text-sm font-semibold text-trace">Worked solution with your numbers</summary>
          <div className="mt-2 space-y-1 overflow-x-auto" data-testid="worked-solution">
            {r.solution.map((line, k) =>
              solutionHtml[line] ? (
                <div key={k} dangerouslySetInnerHTML={{ __html: solutionHtml[line] }} />
              ) : (
                <pre key={k} className="whitespace-pre-wrap font-mono text-xs">
                  {line}
                </pre>
              ),
            )}
          </div>
        </details>
      ) : null}
    </li>
  );
}

function Files({ attempt }: { attempt: Attempt }) {
  const [uploads, setUploads] = useState<Load<UploadView[]>>({ state: "loading" });
  const key = attempt.uploadIds.join(",");
  const ids = useMemo(() => (key ? key.split(",") : []), [key]);
  useEffect(() => {
    if (!ids.length) return;
    void Promise.all(ids.map((id) => getJson<{ upload: UploadView }>(`/api/uploads/${id}`))).then((all) => {
      const bad = all.find((a) => a.status !== 200 || !a.body?.upload);
      const data = all.filter((a) => a.status === 200 && a.body?.upload).map((a) => a.body!.upload);
      if (bad && data.length === 0) setUploads({ state: "error", message: loadMessage(bad.status, "the attached files") });
      else setUploads({ state: "ready", data });
    });
  }, [ids]);

  if (!ids.length) return null;
  return (
    <section aria-labelledby="files-heading" className="mt-8">
      <h2 id="files-heading" className="text-xl">
        Attached files
      </h2>
      {uploads.state === "loading" ? <p className="mt-2 text-sm text-ink-soft">Loading the attached files…</p> : null}
      {uploads.state === "error" ? <p className="mt-2 text-sm text-verdict-wrong">{uploads.message}</p> : null}
      {uploads.state === "ready"
        ? uploads.data.map((u) =>
            u.kind === "trace" && u.analysis ? (
              <TracePanel key={u.id} name={u.originalName ?? "trace.csv"} analysis={u.analysis as TraceAnalysis} />
            ) : u.kind === "image" ? (
              <ScopeCapture key={u.id} upload={u} />
            ) : null,
          )
        : null}
    </section>
  );
}

/** The image's link is signed for 60 s, so it is fetched again when the student asks to see it. */
function ScopeCapture({ upload }: { upload: UploadView }) {
  const [shown, setShown] = useState<Load<string> | null>(null);
  async function open() {
    setShown({ state: "loading" });
    const { status, body } = await getJson<{ upload: UploadView }>(`/api/uploads/${upload.id}`);
    if (status === 200 && body?.upload.url) setShown({ state: "ready", data: body.upload.url });
    else setShown({ state: "error", message: loadMessage(status, "the scope capture") });
  }
  return (
    <div className="card mt-3" data-testid="scope-capture">
      <h3 className="text-lg">Scope capture</h3>
      <p className="text-sm text-ink-soft">{upload.originalName ?? "image"}</p>
      <button type="button" className="btn-quiet mt-2" onClick={open} disabled={shown?.state === "loading"}>
        {shown?.state === "ready" ? "Load the image again" : "Show the scope capture"}
      </button>
      <div aria-live="polite">
        {shown?.state === "loading" ? <p className="mt-2 text-sm text-ink-soft">Fetching a link…</p> : null}
        {shown?.state === "error" ? <p className="mt-2 text-sm text-verdict-wrong">{shown.message}</p> : null}
        {shown?.state === "ready" ? (
          <figure className="mt-3">
            {/* eslint-disable-next-line @next/next/no-img-element -- a short-lived signed URL from object storage */}
            <img src={shown.data} alt={`Scope capture attached to this attempt (${upload.originalName ?? "image"})`} className="max-h-[32rem] max-w-full rounded border border-ink/10" />
            <figcaption className="mt-1 text-xs text-ink-soft">
              <a href={shown.data} target="_blank" rel="noreferrer">
                Open full size
              </a>{" "}
              (the link works for about a minute).
            </figcaption>
          </figure>
        ) : null}
      </div>
    </div>
  );
}

function Review({ attempt, isOwner, onRequested }: { attempt: Attempt; isOwner: boolean; onRequested: () => void }) {
  return (
    <section aria-labelledby="review-heading" className="no-print card mt-8" data-testid="review">
      <h2 id="review-heading" className="text-xl">
        Review
      </h2>
      {attempt.reviewRequestedAt ? (
        <div role="status">
          <p className="mt-2 text-sm">
            {isOwner ? "You asked" : "The student asked"} for a review on {utcDate(attempt.reviewRequestedAt)}. The course staff will look at it; a changed grade shows here.
          </p>
          {attempt.reviewMessage ? <blockquote className="mt-2 border-l-4 border-ink/20 pl-3 text-sm whitespace-pre-line">{attempt.reviewMessage}</blockquote> : null}
        </div>
      ) : isOwner ? (
        <>
          <p className="mt-2 text-sm text-ink-soft">If you think a question was judged wrongly, tell the course staff what to look at.</p>
          <ReviewForm attemptId={attempt.id} onRequested={onRequested} />
        </>
      ) : (
        <p className="mt-2 text-sm text-ink-soft">No review has been requested for this attempt.</p>
      )}
    </section>
  );
}
