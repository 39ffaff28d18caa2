// The sample traces in public/samples that the upload help and the duty-cycle lesson offer for download:
// the analysis gives the time-weighted average of the closed form Ī = D·I_active + (1 − D)·I_sleep
// (lib/grader/PHYSICS.md §8; any electronics text on duty-cycled loads), worked out by hand below.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeTrace } from "@/lib/trace";

const sample = (name: string) => fs.readFileSync(path.join(import.meta.dirname, "../../../public/samples", name), "utf8");

describe("public sample traces", () => {
  it("duty-cycle-sensor-node.csv: 4 µA asleep, 18 mA for 50 ms every 2 s", async () => {
    const r = await analyzeTrace(sample("duty-cycle-sensor-node.csv"));
    // D = 0.05 / 2 = 0.025; Ī = 0.025 · 18 mA + 0.975 · 4 µA = 0.4539 mA
    expect(r.averageCurrent).toBeCloseTo(0.4539e-3, 9);
    expect(r.dutyCycle).toBeCloseTo(0.025, 6);
    expect(r.badRows).toBe(0);
    // charge per wake Q = I_a · t_a = 18 mA · 50 ms = 0.9 mC
    expect(r.chargePerWake).toBeCloseTo(0.9e-3, 9);
  });

  it("duty-cycle-decimal-comma.csv: decimal commas, µA, a few broken rows skipped", async () => {
    const r = await analyzeTrace(sample("duty-cycle-decimal-comma.csv"));
    // D = 0.02 / 0.5 = 0.04; Ī = 0.04 · 6.5 mA + 0.96 · 12 µA = 0.27152 mA
    expect(r.averageCurrent).toBeCloseTo(0.27152e-3, 9);
    expect(r.badRows).toBeGreaterThan(0);
  });
});
