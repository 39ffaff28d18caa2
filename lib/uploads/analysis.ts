// The job that analyses a completed upload (queue "upload-analysis"): it streams the object from storage
// once, through the SHA-256 and, for a trace, the CSV parser and lib/trace's analysis, stores the compact
// samples (lib/uploads/samples.ts), and writes every result in one statement at the end, so an upload is
// either still "analysing" or "ready" with all of them. Progress (the fraction of the bytes read) is
// written as it goes. A run that fails on a fault of the file (no two usable rows) marks the upload
// "failed" with the reason; any other failure throws, pg-boss runs the job again (retryLimit), and the
// last try marks it failed. Running it twice does no harm: the samples object is overwritten and the
// results are written only while the upload is still analysing.
import "server-only";
import crypto from "node:crypto";
import { db } from "@/db";
import { failUpload, findUpload, finishUpload, setUploadProgress } from "@/db/queries/uploads";
import { getObjectStream } from "@/lib/uploads/storage";
import { analyzeTraceSamples, TraceError } from "@/lib/trace";
import type { Params } from "@/lib/grader";
import { writeSamples } from "./samples";

export type AnalysisJob = { uploadId: string; params: Params | null };

/** How often progress is written: every this fraction of the file. */
const PROGRESS_STEP = 0.05;

export async function analyseUpload(job: AnalysisJob, opts: { lastTry?: boolean } = {}): Promise<void> {
  const upload = await findUpload(db, job.uploadId);
  if (!upload || upload.status !== "analysing") return; // removed, or done by an earlier run
  try {
    const hash = crypto.createHash("sha256");
    const body = await getObjectStream(upload.storageKey);
    let seen = 0;
    let reported = 0;
    const counted = (async function* () {
      for await (const chunk of body as AsyncIterable<Buffer>) {
        hash.update(chunk);
        seen += chunk.length;
        if (seen / upload.size - reported >= PROGRESS_STEP) {
          reported = seen / upload.size;
          // the reading is 90 % of the work; storing the samples and the results the rest
          await setUploadProgress(db, upload.id, Math.min(0.9, 0.9 * reported));
        }
        yield chunk;
      }
    })();
    let analysis: unknown = null;
    let samples = null;
    if (upload.kind === "trace") {
      const capacity = typeof job.params?.batteryCapacity === "number" ? job.params.batteryCapacity : undefined;
      const usable = typeof job.params?.usableFraction === "number" ? job.params.usableFraction : undefined;
      const result = await analyzeTraceSamples(counted, { batteryCapacity: capacity, usableFraction: usable });
      analysis = result.analysis;
      samples = await writeSamples(`${upload.storageKey}.samples`, result.samples.t, result.samples.i);
    } else {
      for await (const chunk of counted) void chunk;
    }
    await finishUpload(db, upload.id, { sha256: hash.digest("hex"), analysis, samples });
  } catch (e) {
    if (e instanceof TraceError) {
      await failUpload(db, upload.id, `The trace could not be read: ${e.message}`);
      return;
    }
    if (opts.lastTry) await failUpload(db, upload.id, "The file could not be analysed; upload it again.");
    throw e;
  }
}
