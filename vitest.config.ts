import { defineConfig } from "vitest/config";
import path from "node:path";

const root = import.meta.dirname;

// Four tiers, run by scripts/test.ts: unit (pure code), integration (real PostgreSQL, one file at a time), http (route handlers
// over HTTP against the test server),
// browser (playwright-core against a production build). Select one with `--project`.
export default defineConfig({
  resolve: { alias: { "@": root, "server-only": path.join(root, "tests/server-only-stub.ts") } },
  test: {
    projects: [
      {
        resolve: { alias: { "@": root, "server-only": path.join(root, "tests/server-only-stub.ts") } },
        test: { name: "unit", include: ["tests/unit/**/*.test.ts", "tests/unit/**/*.test.tsx"], environment: "node" },
      },
      {
        resolve: { alias: { "@": root, "server-only": path.join(root, "tests/server-only-stub.ts") } },
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
          setupFiles: [path.join(root, "tests/integration/setup.ts")],
        },
      },
      {
        resolve: { alias: { "@": root, "server-only": path.join(root, "tests/server-only-stub.ts") } },
        test: {
          name: "http",
          include: ["tests/http/**/*.test.ts"],
          environment: "node",
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias: { "@": root, "server-only": path.join(root, "tests/server-only-stub.ts") } },
        test: {
          name: "browser",
          include: ["tests/browser/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
