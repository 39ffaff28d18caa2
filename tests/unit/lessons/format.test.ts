import { describe, expect, it } from "vitest";
import { formatAuto, formatTex, formatText } from "@/lib/lessons/format";

describe("lesson number formatting", () => {
  it("shows four significant figures in the chosen unit", () => {
    expect(formatText(3.2673e-3, "mA")).toBe("3.267\u00a0mA");
    expect(formatText(-0.0099, "%", { sig: 4 })).toBe("−0.009900\u00a0%");
    expect(formatText(3.137e6, "h")).toBe("871.4\u00a0h");
  });
  it("trims inputs and prints counts whole", () => {
    expect(formatText(0.1, "mV", { trim: true })).toBe("100\u00a0mV");
    expect(formatText(620, "")).toBe("620");
  });
  it("writes LaTeX units", () => {
    expect(formatTex(2e-6, "µA", { trim: true })).toBe("2\\,\\mu\\mathrm{A}");
    expect(formatTex(1e4, "kΩ", { trim: true })).toBe("10\\,\\mathrm{k}\\Omega");
  });
  it("chooses an engineering prefix", () => {
    expect(formatAuto(202e-6, "A")).toBe("202.0\u00a0µA");
    expect(formatAuto(0.99996e-3, "A")).toBe("1.000\u00a0mA");
  });
});
