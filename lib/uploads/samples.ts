// The compact stored form of a trace's samples, for zooming without parsing the CSV again: one object
// holding the n times as little-endian Float64 (8n bytes) followed by the n currents as Float32 (4n bytes;
// 24-bit mantissa, far finer than any logger's resolution), SI units. An index in the upload's row gives
// the time of every BLOCK-th sample, so a window is found without reading the times first; a window of
// the trace is two ranged GETs (its blocks' times and currents).
import "server-only";
import { Readable } from "node:stream";
import type { StoredSamples } from "@/db/types";
import { getObjectRange, putObjectStream } from "@/lib/uploads/storage";
import { minMaxColumns, type PlotPoints } from "@/lib/trace";

export const SAMPLES_BLOCK = 4096;

const littleEndian = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** Stores the samples under `key` and returns their index. */
export async function writeSamples(key: string, t: Float64Array, i: Float64Array): Promise<StoredSamples> {
  if (!littleEndian) throw new Error("the compact samples are written little-endian only");
  const n = Math.min(t.length, i.length);
  const currents = Float32Array.from(i.subarray(0, n));
  const times = Buffer.from(t.buffer, t.byteOffset, n * 8);
  const body = Readable.from([times, Buffer.from(currents.buffer, currents.byteOffset, n * 4)]);
  await putObjectStream(key, body, n * 12, "application/octet-stream");
  const index: number[] = [];
  for (let k = 0; k < n; k += SAMPLES_BLOCK) index.push(t[k]);
  return { key, rows: n, block: SAMPLES_BLOCK, index };
}

/**
 * The samples of [from, to] reduced to at most about 2 × `points` points by min/max per pixel column
 * (all of them when fewer), plus how many samples the window held.
 */
export async function readWindow(s: StoredSamples, from: number, to: number, points: number): Promise<PlotPoints & { samples: number }> {
  // blocks whose span meets the window: the last block starting at or before `from` to the last starting at or before `to`
  const last = (x: number) => {
    let lo = 0;
    let hi = s.index.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (s.index[mid] <= x) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  };
  const b0 = last(from);
  const b1 = last(to);
  const start = b0 * s.block;
  const end = Math.min(s.rows, (b1 + 1) * s.block); // exclusive
  if (end <= start) return { t: [], i: [], samples: 0 };
  const [tBytes, iBytes] = await Promise.all([
    getObjectRange(s.key, start * 8, end * 8 - 1),
    getObjectRange(s.key, s.rows * 8 + start * 4, s.rows * 8 + end * 4 - 1),
  ]);
  const t = new Float64Array(aligned(tBytes, 8));
  const i = new Float32Array(aligned(iBytes, 4));
  let a = 0;
  while (a < t.length && t[a] < from) a++;
  let b = a;
  while (b < t.length && t[b] <= to) b++;
  return { ...minMaxColumns(t.subarray(a, b), i.subarray(a, b), from, to, points), samples: b - a };
}

function aligned(bytes: Uint8Array, size: number): ArrayBuffer {
  if (bytes.byteOffset % size === 0 && bytes.byteLength % size === 0) return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  const copy = new Uint8Array(bytes.byteLength - (bytes.byteLength % size));
  copy.set(bytes.subarray(0, copy.length));
  return copy.buffer;
}
