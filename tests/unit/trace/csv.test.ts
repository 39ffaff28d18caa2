// Reading the CSV: headers, units, separators, bad rows, streams.
import { Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { analyzeTrace, squareWaveCsv, TraceError } from "../../../lib/trace";
import { closedForm, expectClose } from "./helpers";

// Hand-computed: samples at 0, 1, 2, 4 ms of 10, 30, 20, 5 µA. Sample-and-hold: (10·1 + 30·1 + 20·2) µA·ms
// over 4 ms = 20 µA. Trapezoidal: (20 + 25 + 25) µA·ms / 4 ms = 17.5 µA.
const SMALL = { t: [0, 1, 2, 4], i: [10, 30, 20, 5] };
const SMALL_AVERAGE = 20e-6;
const SMALL_TRAPEZOID = 17.5e-6;

function table(header: string | null, sep: string, t: string[], i: string[]): string {
  const rows = t.map((x, k) => `${x}${sep}${i[k]}`);
  return (header === null ? rows : [header, ...rows]).join("\n");
}

describe("header and unit detection", () => {
  it("reads ms and µA from the header", async () => {
    const csv = table("time (ms),current (µA)", ",", SMALL.t.map(String), SMALL.i.map(String));
    const r = await analyzeTrace(csv);
    expect(r.units).toEqual({ time: "ms", current: "uA", timeSource: "header", currentSource: "header", inferred: false });
    expect(r.format.header).toEqual(["time (ms)", "current (µA)"]);
    expectClose(r.averageCurrent, SMALL_AVERAGE, 1e-12);
    expectClose(r.averageCurrentTrapezoid, SMALL_TRAPEZOID, 1e-12);
    expectClose(r.duration, 4e-3, 1e-12);
    expectClose(r.minCurrent, 5e-6, 1e-12);
    expectClose(r.maxCurrent, 30e-6, 1e-12);
    expectClose(r.totalCharge, 80e-9, 1e-12);
  });

  it.each([
    ["t_ms,current_uA"],
    ["Time [ms],I [uA]"],
    ["ms,uA"],
    ["elapsed (milliseconds),current (microamps)"],
    ["time(ms),current(μA)"], // Greek mu
  ])("reads the units from the header %s", async (header) => {
    const r = await analyzeTrace(table(header, ",", SMALL.t.map(String), SMALL.i.map(String)));
    expect(r.units).toMatchObject({ time: "ms", current: "uA", inferred: false });
    expectClose(r.averageCurrent, SMALL_AVERAGE, 1e-12);
  });

  it("reads a semicolon file with decimal commas", async () => {
    // 0,5 s steps; 1,5 mA then 0,5 mA: (1,5·0,5 + 0,5·0,5 + 1,5·0,5) mA·s over 1,5 s = 7/6 mA
    const csv = "Zeit (s);Strom (mA)\n0;1,5\n0,5;0,5\n1,0;1,5\n1,5;0,5\n";
    const r = await analyzeTrace(csv);
    expect(r.format).toMatchObject({ delimiter: ";", decimalComma: true });
    expect(r.units).toMatchObject({ current: "mA", currentSource: "header" });
    expectClose(r.averageCurrent, (1.5 * 0.5 + 0.5 * 0.5 + 1.5 * 0.5) / 1.5 / 1000, 1e-12);
    expect(r.maxCurrent).toBeCloseTo(1.5e-3, 15);
  });

  it("reads a tab-separated file with nA", async () => {
    const r = await analyzeTrace(table("Time[s]\tCurrent_nA", "\t", ["0", "0.001", "0.002", "0.004"], SMALL.i.map(String)));
    expect(r.format.delimiter).toBe("\t");
    expect(r.units).toMatchObject({ time: "s", current: "nA" });
    expectClose(r.averageCurrent, 20e-9, 1e-12);
  });

  it("without a header takes units from the options", async () => {
    const r = await analyzeTrace(table(null, ",", SMALL.t.map(String), SMALL.i.map(String)), { timeUnit: "ms", currentUnit: "uA" });
    expect(r.format.header).toBeNull();
    expect(r.rows).toBe(4);
    expect(r.units).toEqual({ time: "ms", current: "uA", timeSource: "option", currentSource: "option", inferred: false });
    expectClose(r.averageCurrent, SMALL_AVERAGE, 1e-12);
  });

  it("without a header or options defaults to seconds and amperes and says so", async () => {
    const r = await analyzeTrace(table(null, ",", SMALL.t.map(String), SMALL.i.map(String)));
    expect(r.units).toEqual({ time: "s", current: "A", timeSource: "default", currentSource: "default", inferred: true });
    expectClose(r.averageCurrent, 20, 1e-12);
    expectClose(r.duration, 4, 1e-12);
  });

  it("a header without units falls back to the options, then to the defaults", async () => {
    const csv = table("time,current", ",", SMALL.t.map(String), SMALL.i.map(String));
    const withOptions = await analyzeTrace(csv, { timeUnit: "ms" });
    expect(withOptions.units).toEqual({ time: "ms", current: "A", timeSource: "option", currentSource: "default", inferred: true });
    expectClose(withOptions.averageCurrent, 20, 1e-12);
  });

  it("the header's unit wins over the options, with a warning", async () => {
    const r = await analyzeTrace(table("time (ms),current (uA)", ",", SMALL.t.map(String), SMALL.i.map(String)), { currentUnit: "mA" });
    expect(r.units.current).toBe("uA");
    expect(r.warnings.join(" ")).toMatch(/header/);
    expectClose(r.averageCurrent, SMALL_AVERAGE, 1e-12);
  });

  it("finds the columns by name in any order and among others", async () => {
    const lines = ["current (uA),voltage (V),time (ms)", ...SMALL.t.map((t, k) => `${SMALL.i[k]},3.3,${t}`)];
    const r = await analyzeTrace(lines.join("\n"));
    expect(r.format).toMatchObject({ timeColumn: 2, currentColumn: 0 });
    expectClose(r.averageCurrent, SMALL_AVERAGE, 1e-12);
  });

  it("handles a byte-order mark and CRLF line ends", async () => {
    const csv = "\uFEFF" + table("time (ms),current (uA)", ",", SMALL.t.map(String), SMALL.i.map(String)).replace(/\n/g, "\r\n") + "\r\n";
    const r = await analyzeTrace(csv);
    expect(r.units).toMatchObject({ time: "ms", current: "uA", timeSource: "header" });
    expect(r.badRows).toBe(0);
    expectClose(r.averageCurrent, SMALL_AVERAGE, 1e-12);
  });
});

describe("bad rows", () => {
  const spec = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 0.01, period: 1, cycles: 4, sampleInterval: 0.001 };

  it("are counted and skipped, and the good rows' results do not change", async () => {
    const clean = squareWaveCsv(spec).trimEnd().split("\n");
    // inserted after these 0-based positions of the clean file (the header is position 0)
    const garbage: [number, string, string][] = [
      [10, "oops,this is text", "time is not a number"],
      [500, "0.4995,", "missing cell"],
      [1200, ",0.02", "missing cell"],
      [2000, "time (s),current (A)", "repeated header"],
      [2990, "1.5,0.02", "time not increasing"],
      [3500, "3.4995,NaN", "current is not a number"],
    ];
    const dirty = [...clean];
    for (let g = garbage.length - 1; g >= 0; g--) dirty.splice(garbage[g][0] + 1, 0, garbage[g][1]);
    dirty.splice(100, 0, ""); // a blank line: skipped, not counted
    const a = await analyzeTrace(clean.join("\n"));
    const b = await analyzeTrace(dirty.join("\n"));

    expect(a.badRows).toBe(0);
    expect(b.badRows).toBe(garbage.length);
    // 1-based line numbers in the dirty file: position p is followed by the inserted line, shifted by the
    // lines inserted before it (the blank line sits at index 100, before all but the first)
    const expectedLines = garbage.map(([p], g) => p + 2 + g + (p + 1 + g >= 100 ? 1 : 0));
    expect(b.badRowExamples).toEqual(garbage.map(([, , reason], g) => ({ line: expectedLines[g], reason })));
    for (const [k, g] of expectedLines.entries()) expect(dirty[g - 1]).toBe(garbage[k][1]);

    const withoutBadRows = (r: typeof a) => Object.fromEntries(Object.entries(r).filter(([k]) => k !== "badRows" && k !== "badRowExamples"));
    expect(withoutBadRows(b)).toEqual(withoutBadRows(a));
    const cf = closedForm(spec);
    expectClose(b.averageCurrent, cf.average, 1e-9);
    expectClose(b.chargePerWake, cf.chargePerWake, 1e-9);
  });

  it("the generator's garbage lines are all caught", async () => {
    const N = 333;
    const dirty = await analyzeTrace(squareWaveCsv({ ...spec, garbageEvery: N }));
    const clean = await analyzeTrace(squareWaveCsv(spec));
    const dataRows = spec.cycles * 1000 + 1;
    expect(dirty.rows).toBe(dataRows);
    expect(dirty.badRows).toBe(Math.floor((dataRows - 1) / N));
    expect(dirty.badRowExamples).toHaveLength(10);
    expect(dirty.averageCurrent).toBe(clean.averageCurrent);
    expect(dirty.chargePerWake).toBe(clean.chargePerWake);
  });

  it("a trace with fewer than two good rows is refused with the bad-row report", async () => {
    const err = await analyzeTrace("time,current\n0,1\nx,y\n").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(TraceError);
    expect((err as TraceError).badRows).toBe(1);
    expect((err as TraceError).badRowExamples).toEqual([{ line: 3, reason: "time is not a number" }]);
    await expect(analyzeTrace("")).rejects.toBeInstanceOf(TraceError);
  });
});

describe("inputs", () => {
  it("reads a Node stream, a web stream, a Buffer, bytes and a string alike, even with µ split between chunks", async () => {
    const csv = squareWaveCsv({ sleepCurrent: 1e-6, activeCurrent: 5e-3, activeTime: 0.002, period: 0.1, cycles: 30, sampleInterval: 0.001, units: { time: "ms", current: "uA" } })
      .replace("current (uA)", "current (µA)");
    const bytes = Buffer.from(csv, "utf8");
    const micro = bytes.indexOf(Buffer.from("µ", "utf8"));
    // cut the stream inside the two-byte µ, then in small pieces
    const pieces = [bytes.subarray(0, micro + 1), bytes.subarray(micro + 1, 40)];
    for (let k = 40; k < bytes.length; k += 777) pieces.push(bytes.subarray(k, k + 777));
    const fromStream = await analyzeTrace(Readable.from(pieces, { objectMode: false }));
    const fromBuffer = await analyzeTrace(bytes);
    const fromString = await analyzeTrace(csv);
    const fromWeb = await analyzeTrace(Readable.toWeb(Readable.from(pieces, { objectMode: false })) as ReadableStream<Uint8Array>);
    const fromBytes = await analyzeTrace(new Uint8Array(bytes));
    expect(fromWeb).toEqual(fromString);
    expect(fromBytes).toEqual(fromString);
    expect(fromStream.units).toMatchObject({ time: "ms", current: "uA", timeSource: "header" });
    expect(fromStream.badRows).toBe(0);
    expect(fromStream).toEqual(fromString);
    expect(fromBuffer).toEqual(fromString);
    expectClose(fromStream.averageCurrent, 0.02 * 5e-3 + 0.98 * 1e-6, 1e-9);
  });

  it("refuses nonsense options", async () => {
    const csv = table(null, ",", SMALL.t.map(String), SMALL.i.map(String));
    await expect(analyzeTrace(csv, { usableFraction: 1.5 })).rejects.toThrow(RangeError);
    await expect(analyzeTrace(csv, { batteryCapacity: -1 })).rejects.toThrow(RangeError);
    await expect(analyzeTrace(csv, { maxPlotPoints: 2 })).rejects.toThrow(RangeError);
  });
});

describe("levels", () => {
  it("a flat noisy trace is not called two-level and has no wakes", async () => {
    const lines = ["time (s),current (uA)"];
    // deterministic noise around 50 µA
    let seed = 12345;
    for (let k = 0; k < 5000; k++) {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      const u = seed / 2147483648 + ((seed * 7) % 1000) / 1000;
      lines.push(`${k * 0.001},${50 + (u - 1)}`);
    }
    const r = await analyzeTrace(lines.join("\n"));
    expect(r.twoLevel).toBe(false);
    expect(r.wakes).toBe(0);
    expect(r.dutyCycle).toBeNull();
    expect(r.activeLevel).toBeNull();
    expect(r.sleepLevel).toBe(r.averageCurrent);
  });

  it("one short spike does not move the sleep/active split", async () => {
    const spec = { sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 0.01, period: 1, cycles: 5, sampleInterval: 0.001 };
    const lines = squareWaveCsv(spec).trimEnd().split("\n");
    // one sample of 500 mA in the middle of a sleep stretch (row 2501 → t = 2.5 s)
    expect(lines[2501].startsWith("2.5,")).toBe(true);
    lines[2501] = "2.5,0.5";
    const r = await analyzeTrace(lines.join("\n"));
    expect(r.maxCurrent).toBe(0.5);
    expect(r.twoLevel).toBe(true);
    expectClose(r.sleepLevel, 2e-6, 1e-9);
    // the spike is a wake of its own: 6 rising crossings
    expect(r.wakes).toBe(6);
    expect(r.plot.i).toContain(0.5);
  });
});
