import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  // The app does not use the React Compiler, so its memoization-preservation check does not apply.
  { rules: { "react-hooks/preserve-manual-memoization": "off" } },
  // Tests read loosely typed JSON answers; `any` is allowed there only.
  { files: ["tests/**"], rules: { "@typescript-eslint/no-explicit-any": "off" } },
  { ignores: ["node_modules/**", ".next*/**", ".data/**", "next-env.d.ts", "tests/.artifacts/**"] },
];

export default config;
