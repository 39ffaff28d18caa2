"use client";
// One optional file of a submission (a scope capture or a logged trace). The file is uploaded as soon as
// it is chosen, with a progress bar; a refusal (too large, wrong type) is shown under the field. A logged
// trace (up to 200 MB) goes straight to storage in parts (./direct-upload.ts) and is then analysed on the
// server, with the analysis's progress shown; an image goes through the app (./upload.ts).
import { useEffect, useId, useRef, useState } from "react";
import { formatQuantity } from "@/lib/grader/format";
import { toApiError } from "@/lib/http/client";
import { uploadErrorMessage } from "./form-helpers";
import { sendUpload, type UploadedFile } from "./upload";

type State =
  | { step: "idle" }
  | { step: "uploading"; name: string; fraction: number; retrying?: boolean }
  | { step: "analysing"; name: string; fraction: number }
  | { step: "done"; name: string; upload: UploadedFile }
  | { step: "error"; name: string; message: string };

function sizeText(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

function traceSummary(analysis: unknown): string | null {
  if (!analysis || typeof analysis !== "object") return null;
  const a = analysis as { rows?: number; badRows?: number; averageCurrent?: number };
  if (typeof a.averageCurrent !== "number") return null;
  const rows = typeof a.rows === "number" ? `${a.rows.toLocaleString("en-GB")} rows read` : "read";
  const bad = a.badRows ? `, ${a.badRows} bad row${a.badRows === 1 ? "" : "s"} skipped` : "";
  return `Trace ${rows}${bad}; time-weighted average ${formatQuantity(a.averageCurrent, "A")}.`;
}

export function FileField({
  label,
  hint,
  accept,
  expectKind,
  labId,
  serverError,
  onChange,
  onBusy,
  testId,
}: {
  label: string;
  hint: string;
  accept: string;
  expectKind: "image" | "trace";
  labId: string;
  serverError?: string;
  onChange: (upload: UploadedFile | null) => void;
  onBusy: (busy: boolean) => void;
  testId?: string;
}) {
  const id = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const abortRef = useRef<(() => void) | null>(null);
  const [state, setState] = useState<State>({ step: "idle" });

  useEffect(() => () => abortRef.current?.(), []);

  async function startDirect(file: File) {
    abortRef.current?.();
    onChange(null);
    onBusy(true);
    setState({ step: "uploading", name: file.name, fraction: 0 });
    const stop = { stopped: false };
    // the upload client (Uppy) is loaded only when a trace is chosen: the lab page's first load stays light
    const { followAnalysis, sendDirect } = await import("./direct-upload");
    const { done, abort } = sendDirect(file, labId, {
      onProgress: (fraction) => setState((s) => (s.step === "uploading" && s.name === file.name ? { step: "uploading", name: s.name, fraction } : s)),
      onRetrying: () => setState((s) => (s.step === "uploading" && s.name === file.name ? { ...s, retrying: true } : s)),
    });
    abortRef.current = () => {
      stop.stopped = true;
      abort();
    };
    try {
      const sent = await done;
      setState({ step: "analysing", name: file.name, fraction: sent.progress ?? 0 });
      const upload = await followAnalysis(sent.id, (u) => setState((s) => (s.step === "analysing" && s.name === file.name ? { ...s, fraction: u.progress ?? s.fraction } : s)), stop);
      if (stop.stopped) return;
      if (upload.status === "failed") {
        setState({ step: "error", name: file.name, message: upload.failure ?? "The trace could not be analysed." });
        return;
      }
      setState({ step: "done", name: file.name, upload });
      onChange(upload);
    } catch (e) {
      if (stop.stopped) return;
      const err = e as { status?: number; detail?: Parameters<typeof uploadErrorMessage>[1] };
      setState({ step: "error", name: file.name, message: uploadErrorMessage(err.status ?? 0, err.detail ?? toApiError(err.status ?? 0, null).detail) });
    } finally {
      if (!stop.stopped) {
        abortRef.current = null;
        onBusy(false);
      }
    }
  }

  async function start(file: File) {
    if (expectKind === "trace") return startDirect(file);
    abortRef.current?.();
    onChange(null);
    onBusy(true);
    setState({ step: "uploading", name: file.name, fraction: 0 });
    const { done, abort } = sendUpload(file, labId, (fraction) =>
      setState((s) => (s.step === "uploading" && s.name === file.name ? { ...s, fraction } : s)),
    );
    abortRef.current = abort;
    const { status, body } = await done;
    abortRef.current = null;
    onBusy(false);
    if (status === -1) return; // replaced by another file or removed
    if (status === 201 || status === 200) {
      const upload = (body as { upload: UploadedFile }).upload;
      if (upload.kind !== expectKind) {
        const other = upload.kind === "trace" ? "a logged trace (CSV)" : "an image";
        setState({ step: "error", name: file.name, message: `That file is ${other}; attach it in the other file field.` });
        return;
      }
      setState({ step: "done", name: file.name, upload });
      onChange(upload);
      return;
    }
    setState({ step: "error", name: file.name, message: uploadErrorMessage(status, toApiError(status, body).detail) });
  }

  function remove() {
    abortRef.current?.();
    abortRef.current = null;
    onBusy(false);
    onChange(null);
    setState({ step: "idle" });
    if (inputRef.current) inputRef.current.value = "";
  }

  const error = state.step === "error" ? state.message : serverError;
  const statusId = `${id}-status`;
  const pct = state.step === "uploading" || state.step === "analysing" ? Math.round(state.fraction * 100) : state.step === "done" ? 100 : 0;

  return (
    <div className="mb-4" data-testid={testId}>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
        {hint}
      </p>
      <div className="mt-1 flex flex-wrap items-center gap-3">
        <input
          ref={inputRef}
          id={id}
          type="file"
          accept={accept}
          className="block text-sm file:mr-3 file:rounded-md file:border file:border-ink/20 file:bg-paper-raised file:px-3 file:py-1.5 file:text-sm file:font-semibold"
          aria-describedby={`${id}-hint ${statusId}`}
          aria-invalid={error ? true : undefined}
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) void start(file);
          }}
        />
        {state.step !== "idle" ? (
          <button type="button" className="btn-quiet px-3 py-1" onClick={remove}>
            {state.step === "uploading" || state.step === "analysing" ? "Cancel upload" : "Remove file"}
          </button>
        ) : null}
      </div>
      {state.step === "uploading" || state.step === "analysing" || state.step === "done" ? (
        <div className="mt-2">
          <div
            role="progressbar"
            aria-label={state.step === "analysing" ? `Analysis of ${state.name}` : `Upload of ${state.name}`}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={pct}
            aria-valuetext={`${pct} %`}
            className="h-2 w-full max-w-sm overflow-hidden rounded-full bg-paper-sunk"
          >
            <div className="h-full bg-trace transition-[width]" style={{ width: `${pct}%` }} />
          </div>
        </div>
      ) : null}
      <div id={statusId} aria-live="polite" className="mt-1 text-sm">
        {state.step === "uploading" ? (
          <p className="text-ink-soft">
            Uploading {state.name}: {pct} %{state.retrying ? " (connection lost; sending the missing parts again)" : ""}
          </p>
        ) : null}
        {state.step === "analysing" ? <p className="text-ink-soft">Analysing {state.name} on the server: {pct} %</p> : null}
        {state.step === "done" ? (
          <p className="text-ink-soft">
            <span aria-hidden="true">✓ </span>
            Attached {state.name} ({sizeText(state.upload.size)}).{" "}
            {expectKind === "trace" ? traceSummary(state.upload.analysis) : null}
          </p>
        ) : null}
        {error ? (
          <p className="field-error" role="alert">
            <span aria-hidden="true">✗ </span>
            {label}: {error}
          </p>
        ) : null}
      </div>
    </div>
  );
}
