// Sends a file straight to object storage in parts with Uppy's S3 multipart uploader (@uppy/aws-s3): the
// app starts the upload (POST /api/uploads → the signed part URLs), Uppy sends the parts to the store with
// progress, retries a part whose connection dropped (only that part: finished parts are not sent again),
// and on a retry after it gave up asks the app which parts the store already holds
// (GET /api/uploads/{id}/parts). Then the app completes it (POST /api/uploads/{id}/complete) and the page
// follows the analysis (GET /api/uploads/{id}) until the upload is ready or failed.
import Uppy from "@uppy/core";
import AwsS3 from "@uppy/aws-s3";
import { api, ApiError } from "@/lib/http/client";
import { partBytes, UPLOAD_TYPES, type UploadRequest } from "@/lib/validation/uploads";
import type { UploadedFile } from "./upload";

type Asked = { upload: { id: string }; parts: { number: number; url: string }[]; partSize: number };
export type DirectUploaded = UploadedFile & { status: "analysing" | "ready" | "failed"; progress: number | null; failure: string | null };

export interface DirectUploadHandlers {
  /** Fraction of the bytes sent to storage. */
  onProgress(fraction: number): void;
  /** The connection dropped and Uppy is waiting to send again. */
  onRetrying?(): void;
}

/** The type the upload announces: the browser's when it is one the app takes, else from the name's ending. */
export function announcedType(file: File): UploadRequest["type"] {
  if ((UPLOAD_TYPES as readonly string[]).includes(file.type)) return file.type as UploadRequest["type"];
  const name = file.name.toLowerCase();
  if (name.endsWith(".png")) return "image/png";
  if (name.endsWith(".jpg") || name.endsWith(".jpeg")) return "image/jpeg";
  return "text/csv";
}

export function sendDirect(file: File, labId: string, handlers: DirectUploadHandlers): { done: Promise<DirectUploaded>; abort: () => void } {
  let asked: Asked | null = null;
  // the app's refusal (a 4xx with its message and fields), kept: Uppy reports failures as text only
  let refusal: ApiError | null = null;
  const call = async <T,>(url: string, opts?: Parameters<typeof api>[1]): Promise<T> => {
    try {
      return await api<T>(url, opts);
    } catch (e) {
      if (e instanceof ApiError && e.status >= 400 && e.status < 500) refusal = e;
      throw e;
    }
  };
  const uppy = new Uppy({ autoProceed: false, allowMultipleUploadBatches: false });
  uppy.use(AwsS3, {
    shouldUseMultipart: true,
    limit: 3,
    retryDelays: [0, 1000, 3000, 5000, 10_000, 20_000],
    getChunkSize: (f) => partBytes(f.size),
    async createMultipartUpload() {
      asked = await call<Asked>("/api/uploads", { method: "POST", body: { labId, name: file.name, size: file.size, type: announcedType(file) } });
      return { uploadId: asked.upload.id, key: asked.upload.id };
    },
    signPart(_f, { partNumber }) {
      const part = asked?.parts.find((p) => p.number === partNumber);
      if (!part) throw new Error(`No address for part ${partNumber}.`);
      return { method: "PUT", url: part.url };
    },
    async listParts(_f, { uploadId }) {
      const { parts } = await call<{ parts: { number: number; etag: string; size: number }[] }>(`/api/uploads/${uploadId}/parts`);
      return parts.map((p) => ({ PartNumber: p.number, ETag: p.etag, Size: p.size }));
    },
    async completeMultipartUpload(_f, { uploadId }) {
      const { upload } = await call<{ upload: DirectUploaded }>(`/api/uploads/${uploadId}/complete`, { method: "POST" });
      return { location: `/api/uploads/${upload.id}`, upload };
    },
    async abortMultipartUpload() {
      // nothing to do: an upload never completed is removed with its parts after a day
    },
  });
  uppy.on("upload-progress", (_f, progress) => {
    if (progress.bytesTotal) handlers.onProgress(Math.min(1, (progress.bytesUploaded ?? 0) / progress.bytesTotal));
  });
  uppy.on("upload-retry", () => handlers.onRetrying?.());
  uppy.addFile({ name: file.name, type: file.type, data: file, source: "Local" });

  let aborted = false;
  const done = (async () => {
    let result = await uppy.upload();
    // Uppy gave up after its retries (the network stayed down): try again once it is back, sending only the missing parts
    for (let round = 0; !aborted && !refusal && result && result.failed && result.failed.length > 0 && round < 5; round++) {
      handlers.onRetrying?.();
      await new Promise((r) => setTimeout(r, 3000));
      result = await uppy.retryAll();
    }
    if (aborted) throw new ApiError(-1, "network", "The upload was cancelled.");
    const ok = result?.successful?.[0];
    if (!ok) {
      if (refusal) throw refusal;
      throw new ApiError(0, "network", "The file could not be sent; check the connection and choose it again.");
    }
    return (ok.response?.body as unknown as { upload: DirectUploaded }).upload;
  })().finally(() => uppy.destroy());
  return {
    done,
    abort: () => {
      aborted = true;
      uppy.cancelAll();
    },
  };
}

/** Follows an upload's analysis until it is ready or failed, reporting each state. */
export async function followAnalysis(id: string, onState: (u: DirectUploaded) => void, signal: { stopped: boolean }): Promise<DirectUploaded> {
  for (;;) {
    const { upload } = await api<{ upload: DirectUploaded }>(`/api/uploads/${id}`);
    onState(upload);
    if (upload.status === "ready" || upload.status === "failed" || signal.stopped) return upload;
    await new Promise((r) => setTimeout(r, 1000));
  }
}
