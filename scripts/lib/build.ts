// Builds the app with `next build` when its sources changed since the last build in that folder.
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { spawn } from "node:child_process";
import { root } from "./config";

// tsconfig.json is left out: next build rewrites it (adding its type folders) on every build.
const SOURCES = ["app", "components", "lib", "content", "db", "public", "proxy.ts", "mdx-components.tsx", "next.config.mjs", "tailwind.config.ts", "postcss.config.mjs", "package-lock.json"];

function* files(p: string): Generator<string> {
  if (!fs.existsSync(p)) return;
  const st = fs.statSync(p);
  if (st.isFile()) {
    yield p;
    return;
  }
  for (const name of fs.readdirSync(p).sort()) yield* files(path.join(p, name));
}

export function sourceHash(): string {
  const h = crypto.createHash("sha256");
  for (const s of SOURCES) {
    for (const f of files(path.join(root, s))) {
      h.update(path.relative(root, f));
      h.update(fs.readFileSync(f));
    }
  }
  return h.digest("hex");
}

// Asynchronous so that the caller keeps handling signals (and can stop the build) while it runs.
export async function buildIfStale(distDir: string, env: NodeJS.ProcessEnv): Promise<void> {
  const stamp = path.join(root, distDir, "shuntwise-source-hash");
  const hash = sourceHash();
  if (fs.existsSync(stamp) && fs.readFileSync(stamp, "utf8") === hash && fs.existsSync(path.join(root, distDir, "BUILD_ID"))) {
    console.log(`Build in ${distDir} is up to date.`);
    return;
  }
  console.log(`Building the app into ${distDir} (next build)…`);
  const child = spawn(process.execPath, [path.join(root, "node_modules/next/dist/bin/next"), "build"], {
    cwd: root,
    stdio: ["ignore", "inherit", "inherit"],
    env: { ...env, SHUNTWISE_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: "1" },
  });
  const status = await new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  if (status !== 0) throw new Error("next build failed; see the messages above.");
  fs.writeFileSync(stamp, hash);
}
