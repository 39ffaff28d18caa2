// The trace plot's text (server-rendered markup: the canvas itself is drawn in the browser) and the number
// formatting it uses.
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { TracePlot } from "@/components/trace";
import { analyzeTrace, currentScale, formatCharge, formatCurrent, formatDuration, squareWaveCsv, timeScale } from "@/lib/trace";

describe("formatting", () => {
  it("picks the unit that shows the number as at least 1", () => {
    expect(currentScale(0.02)).toEqual({ unit: "mA", factor: 1e3 });
    expect(currentScale(2e-6)).toEqual({ unit: "µA", factor: 1e6 });
    expect(currentScale(3)).toEqual({ unit: "A", factor: 1 });
    expect(currentScale(5e-12)).toEqual({ unit: "nA", factor: 1e9 });
    expect(currentScale(0)).toEqual({ unit: "A", factor: 1 });
    expect(timeScale(0.5)).toEqual({ unit: "ms", factor: 1e3 });
    expect(timeScale(20)).toEqual({ unit: "s", factor: 1 });
  });
  it("writes 4 significant figures", () => {
    expect(formatCurrent(202e-6)).toBe("202.0 µA");
    expect(formatCurrent(0.02)).toBe("20.00 mA");
    expect(formatCharge(200e-6)).toBe("200.0 µC");
    expect(formatDuration(871.37 * 3600)).toBe("871.4 h (36.31 days)");
    expect(formatDuration(0.01)).toBe("10.00 ms");
    expect(formatDuration(7200)).toBe("2.000 h");
  });
});

describe("TracePlot", () => {
  it("renders a figure with a caption and a text summary, and traps no keyboard focus", async () => {
    const trace = await analyzeTrace(
      squareWaveCsv({ sleepCurrent: 2e-6, activeCurrent: 20e-3, activeTime: 0.01, period: 1, cycles: 20, sampleInterval: 0.0005 }),
      { batteryCapacity: 220 * 3.6 },
    );
    expect(trace.rows).toBe(40_001);
    const html = renderToStaticMarkup(<TracePlot trace={trace} caption="Your trace" testId="trace" />);
    expect(html).toMatch(/^<figure[^>]*data-testid="trace"/);
    expect(html).toContain("<figcaption");
    expect(html).toContain("Your trace: current against time, 40,001 samples drawn as");
    expect(html).toContain("202.0 µA");
    expect(html).toContain("20.00 mA");
    expect(html).toContain("2.000 µA");
    expect(html).toContain("1.00 %");
    expect(html).toContain("200.0 µC");
    expect(html).toContain("871.4 h (36.31 days)");
    expect(html).toContain('aria-hidden="true"');
    expect(html).not.toContain("tabindex");
    // one focusable control, labelled
    expect(html.match(/<input/g)).toHaveLength(1);
    expect(html).toMatch(/<label for="[^"]+">Logarithmic current axis<\/label>/);
  });

  it("says so when the trace has no clear levels, and disables the log axis for non-positive currents", () => {
    const html = renderToStaticMarkup(
      <TracePlot
        trace={{
          plot: { t: [0, 1, 2], i: [-1e-6, 1e-6, 0] },
          rows: 3,
          badRows: 2,
          duration: 2,
          averageCurrent: 0,
          minCurrent: -1e-6,
          maxCurrent: 1e-6,
          sleepLevel: 0,
          activeLevel: null,
          threshold: null,
          dutyCycle: null,
          wakes: 0,
          period: null,
          chargePerWake: null,
          batteryLife: null,
        }}
      />,
    );
    expect(html).toContain("no clear sleep and active levels");
    expect(html).toContain("2 bad rows skipped");
    expect(html).toContain("disabled");
    expect(html).toContain("needs every current above zero");
  });
});
