// Entry point of `npm start` and `npm test`. Plain JavaScript on purpose: it must run before any
// dependency is installed. It installs (or refreshes) node_modules from package-lock.json, then hands
// over to the TypeScript script that does the rest.
import { createHash } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { spawn, spawnSync } from "node:child_process";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "..");
const command = process.argv[2];
const scripts = { start: "scripts/start.ts", test: "scripts/test.ts" };
if (!scripts[command]) {
  console.error(`usage: node scripts/bootstrap.mjs ${Object.keys(scripts).join("|")}`);
  process.exit(2);
}

const lock = path.join(root, "package-lock.json");
const stamp = path.join(root, "node_modules", ".shuntwise-lock-hash");
const lockHash = createHash("sha256").update(readFileSync(lock)).digest("hex");
const installed = existsSync(stamp) ? readFileSync(stamp, "utf8").trim() : "";
if (installed !== lockHash) {
  console.log(existsSync(path.join(root, "node_modules")) ? "Dependencies changed: running npm ci…" : "Installing dependencies (npm ci)…");
  const r = spawnSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
  if (r.status !== 0) {
    console.error("npm ci failed; see the messages above.");
    process.exit(r.status ?? 1);
  }
  writeFileSync(stamp, lockHash + "\n");
}

const tsx = path.join(root, "node_modules", "tsx", "dist", "cli.mjs");
const child = spawn(process.execPath, [tsx, scripts[command], ...process.argv.slice(3)], { cwd: root, stdio: "inherit" });
// The child shuts down cleanly on a signal; pass on the ones sent to this process alone (`kill`, npm
// forwarding SIGTERM). Ctrl-C reaches the child directly as well, and it ignores repeats.
for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"]) {
  process.on(signal, () => {
    if (child.exitCode === null) child.kill(signal);
  });
}
child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
