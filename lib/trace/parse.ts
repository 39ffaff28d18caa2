// Streaming the CSV through papaparse, a chunk of rows at a time, into a SampleBuffer. Rows are never kept
// as objects: each chunk's rows are read into the typed arrays and dropped.
import Papa from "papaparse";
import { Readable } from "node:stream";
import { StringDecoder } from "node:string_decoder";
import { SampleBuffer } from "./samples";
import { parseNumberCell, sniffSeparator } from "./sniff";
import { columnsFromHeader, CURRENT_DIVISOR, TIME_DIVISOR } from "./units";
import type { BadRow, TraceFormat, TraceOptions, TraceUnits } from "./types";

/** A Node stream (file, upload, object-store body), a web stream (a File's stream()), bytes or text. */
export type TraceInput = NodeJS.ReadableStream | ReadableStream<Uint8Array> | AsyncIterable<Uint8Array | string> | Uint8Array | string;

const PIECE = 1 << 16;
const HEAD = 1 << 13;
const MAX_EXAMPLES = 10;

async function* textPieces(input: TraceInput): AsyncGenerator<string> {
  if (typeof input === "string") {
    for (let k = 0; k < input.length; k += PIECE) yield input.slice(k, k + PIECE);
    return;
  }
  const decoder = new StringDecoder("utf8");
  if (input instanceof Uint8Array) {
    const bytes = Buffer.from(input.buffer, input.byteOffset, input.byteLength);
    for (let k = 0; k < bytes.length; k += PIECE) yield decoder.write(bytes.subarray(k, k + PIECE));
  } else {
    const chunks = input as AsyncIterable<Uint8Array | string>;
    for await (const chunk of chunks) yield typeof chunk === "string" ? chunk : decoder.write(Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength));
  }
  const rest = decoder.end();
  if (rest) yield rest;
}

export type ReadResult = {
  samples: SampleBuffer;
  badRows: number;
  badRowExamples: BadRow[];
  format: TraceFormat;
  units: TraceUnits;
  warnings: string[];
};

export async function readTrace(input: TraceInput, options: TraceOptions = {}): Promise<ReadResult> {
  const pieces = textPieces(input);
  // Read enough of the start to guess the separator, then hand the whole text to papaparse as a stream.
  let head = "";
  let ended = false;
  while (head.length < HEAD) {
    const next = await pieces.next();
    if (next.done) {
      ended = true;
      break;
    }
    head += next.value;
  }
  if (head.charCodeAt(0) === 0xfeff) head = head.slice(1);
  const { delimiter, decimalComma } = sniffSeparator(head);
  const text = Readable.from(
    (async function* () {
      if (head) yield head;
      if (!ended) for await (const p of { [Symbol.asyncIterator]: () => pieces }) yield p;
    })(),
  );

  const samples = new SampleBuffer();
  const badRowExamples: BadRow[] = [];
  const warnings: string[] = [];
  let badRows = 0;
  let line = 0;
  let started = false;
  let header: string[] | null = null;
  let timeColumn = 0;
  let currentColumn = 1;
  let tDiv = 1;
  let iDiv = 1;
  let lastT = -Infinity;
  let units: TraceUnits = { time: "s", current: "A", timeSource: "default", currentSource: "default", inferred: true };

  const bad = (reason: string) => {
    badRows++;
    if (badRowExamples.length < MAX_EXAMPLES) badRowExamples.push({ line, reason });
  };

  const start = (row: string[]) => {
    started = true;
    const looksNumeric = parseNumberCell(row[0], decimalComma) !== null && parseNumberCell(row[1], decimalComma) !== null;
    let headerTime = null;
    let headerCurrent = null;
    if (!looksNumeric) {
      header = row.map((c) => c.trim());
      const cols = columnsFromHeader(header);
      timeColumn = cols.timeColumn;
      currentColumn = cols.currentColumn;
      headerTime = cols.timeUnit;
      headerCurrent = cols.currentUnit;
    }
    const time = headerTime ?? options.timeUnit ?? "s";
    const current = headerCurrent ?? options.currentUnit ?? "A";
    units = {
      time,
      current,
      timeSource: headerTime ? "header" : options.timeUnit ? "option" : "default",
      currentSource: headerCurrent ? "header" : options.currentUnit ? "option" : "default",
      inferred: !(headerTime || options.timeUnit) || !(headerCurrent || options.currentUnit),
    };
    if (headerTime && options.timeUnit && headerTime !== options.timeUnit)
      warnings.push(`The header gives time in ${headerTime}, the options ${options.timeUnit}: the header was followed.`);
    if (headerCurrent && options.currentUnit && headerCurrent !== options.currentUnit)
      warnings.push(`The header gives current in ${headerCurrent}, the options ${options.currentUnit}: the header was followed.`);
    tDiv = TIME_DIVISOR[time];
    iDiv = CURRENT_DIVISOR[current];
    return looksNumeric;
  };

  const takeRow = (row: string[]) => {
    line++;
    if (row.length === 1 && row[0].trim() === "") return; // blank line
    if (!started && !start(row)) return; // the header
    const tCell = row[timeColumn];
    const iCell = row[currentColumn];
    const t = parseNumberCell(tCell, decimalComma);
    const i = parseNumberCell(iCell, decimalComma);
    if (t === null || i === null) {
      if (tCell === undefined || iCell === undefined || tCell.trim() === "" || iCell.trim() === "") return bad("missing cell");
      if (header && row.length === header.length && row.every((c, k) => c.trim() === header![k])) return bad("repeated header");
      return bad(t === null ? "time is not a number" : "current is not a number");
    }
    const ts = t / tDiv;
    if (!(ts > lastT)) return bad("time not increasing");
    lastT = ts;
    samples.push(ts, i / iDiv);
  };

  await new Promise<void>((resolve, reject) => {
    Papa.parse<string[]>(text, {
      delimiter,
      header: false,
      dynamicTyping: false,
      skipEmptyLines: false,
      chunk: (results) => {
        const rows = results.data;
        for (let r = 0; r < rows.length; r++) takeRow(rows[r]);
      },
      complete: () => resolve(),
      error: (err: Error) => reject(err),
    });
  });

  const format: TraceFormat = { delimiter, decimalComma, header, timeColumn, currentColumn };
  return { samples, badRows, badRowExamples, format, units, warnings };
}
