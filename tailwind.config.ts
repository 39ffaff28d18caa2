import type { Config } from "tailwindcss";

// Shuntwise's own identity: graphite ink on warm paper, a copper accent (the colour of a bare shunt),
// and verdict colours chosen to stay distinct for red-green colour-blind readers (blue / amber / vermilion).
const config: Config = {
  content: ["./app/**/*.{ts,tsx,mdx}", "./components/**/*.{ts,tsx}", "./content/**/*.mdx", "./mdx-components.tsx"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f7f5f0", raised: "#ffffff", sunk: "#eeeae1" },
        ink: { DEFAULT: "#1d232b", soft: "#46505c", faint: "#5d6570" },
        copper: { DEFAULT: "#a4532c", light: "#d9915f", pale: "#f6e6da", dark: "#7a3a1c" },
        trace: { DEFAULT: "#1f5f8b", pale: "#e1edf6" },
        verdict: {
          correct: "#1f6f8b",
          // dark enough for 4.5:1 on its own 10 % tint (the verdict badge), not only on white
          close: "#7f5700",
          mistake: "#8a4fa0",
          wrong: "#b23a1e",
          neutral: "#5c6570",
        },
        caution: { DEFAULT: "#8a5a00", bg: "#fff4d6", edge: "#e0b84a" },
      },
      fontFamily: {
        sans: ["var(--font-figtree)", "system-ui", "sans-serif"],
        mono: ["ui-monospace", "SFMono-Regular", "Menlo", "monospace"],
      },
      borderRadius: { card: "0.6rem" },
    },
  },
};

export default config;
