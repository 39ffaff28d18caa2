"use client";
// The files attached to an attempt: a logged trace with its analysis, and a scope capture whose signed
// link is fetched again each time the viewer asks to see it (it works for about a minute).
import { useMutation, useQueries } from "@tanstack/react-query";
import { useEffect } from "react";
import { api, ApiError } from "@/lib/http/client";
import type { TraceAnalysis } from "@/lib/trace/types";
import { TracePanel } from "./trace-panel";
import { loadError, type AttemptView, type UploadView } from "./types";

const uploadQuery = (id: string) => ({
  queryKey: ["upload", id] as const,
  queryFn: ({ signal }: { signal: AbortSignal }) => api<{ upload: UploadView }>(`/api/uploads/${id}`, { signal }).then((b) => b.upload),
});

/** `inline`: scope captures load at once (the review page), instead of on request. */
export function Files({ attempt, inline = false }: { attempt: AttemptView; inline?: boolean }) {
  const ids = attempt.uploadIds;
  const all = useQueries({ queries: ids.map(uploadQuery) });
  if (!ids.length) return null;
  const loading = all.some((q) => q.isPending);
  const data = all.flatMap((q) => (q.data ? [q.data] : []));
  const failed = all.find((q) => q.isError);
  return (
    <section aria-labelledby="files-heading" className="mt-8">
      <h2 id="files-heading" className="text-xl">
        Attached files
      </h2>
      {loading ? <p className="mt-2 text-sm text-ink-soft">Loading the attached files…</p> : null}
      {!loading && failed && data.length === 0 ? <p className="mt-2 text-sm text-verdict-wrong">{loadError(failed.error, "the attached files")}</p> : null}
      {!loading
        ? data.map((u) =>
            u.kind === "trace" && u.analysis ? (
              <TracePanel key={u.id} name={u.originalName ?? "trace.csv"} analysis={u.analysis as TraceAnalysis} uploadId={u.id} zoomable={u.zoomable === true} />
            ) : u.kind === "image" ? (
              <ScopeCapture key={u.id} upload={u} inline={inline} />
            ) : null,
          )
        : null}
    </section>
  );
}

/** The image's link is signed for 60 s, so it is fetched again when the student asks to see it. */
function ScopeCapture({ upload, inline }: { upload: UploadView; inline: boolean }) {
  const link = useMutation({
    mutationFn: async () => {
      const { upload: fresh } = await api<{ upload: UploadView }>(`/api/uploads/${upload.id}`);
      if (!fresh.url) throw new ApiError(200, "bad_response", "The answer held no link.");
      return fresh.url;
    },
  });
  const { mutate, isIdle } = link;
  useEffect(() => {
    if (inline && isIdle) mutate();
  }, [inline, isIdle, mutate]);
  return (
    <div className="card mt-3" data-testid="scope-capture">
      <h3 className="text-lg">Scope capture</h3>
      <p className="text-sm text-ink-soft">{upload.originalName ?? "image"}</p>
      <button type="button" className="btn-quiet mt-2" onClick={() => link.mutate()} disabled={link.isPending}>
        {link.isSuccess ? "Load the image again" : "Show the scope capture"}
      </button>
      <div aria-live="polite">
        {link.isPending ? <p className="mt-2 text-sm text-ink-soft">Fetching a link…</p> : null}
        {link.isError ? <p className="mt-2 text-sm text-verdict-wrong">{loadError(link.error, "the scope capture")}</p> : null}
        {link.isSuccess ? (
          <figure className="mt-3">
            {/* eslint-disable-next-line @next/next/no-img-element -- a short-lived signed URL from object storage */}
            <img src={link.data} alt={`Scope capture attached to this attempt (${upload.originalName ?? "image"})`} className="max-h-[32rem] max-w-full rounded border border-ink/10" />
            <figcaption className="mt-1 text-xs text-ink-soft">
              <a href={link.data} target="_blank" rel="noreferrer">
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
