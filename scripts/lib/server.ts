// Starts the app's production server (scripts/serve.mjs: Next.js behind the wrapper that records each
// request's client address) as one child process, and waits until it answers.
import { type ChildProcess, spawn } from "node:child_process";
import net from "node:net";
import path from "node:path";
import { root } from "./config";

export function portInUse(port: number, host = "127.0.0.1"): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host });
    socket.once("connect", () => {
      socket.destroy();
      resolve(true);
    });
    socket.once("error", () => resolve(false));
  });
}

/** `quiet` drops the server's standard output; `pipeErrors` hands its standard error to the caller (`child.stderr`). */
export function startNext(opts: { distDir: string; port: number; host: string; env: NodeJS.ProcessEnv; quiet?: boolean; pipeErrors?: boolean }): ChildProcess {
  return spawn(
    process.execPath,
    [path.join(root, "scripts/serve.mjs"), "-H", opts.host, "-p", String(opts.port)],
    {
      cwd: root,
      env: { ...opts.env, SHUNTWISE_DIST_DIR: opts.distDir, NEXT_TELEMETRY_DISABLED: "1" },
      stdio: ["ignore", opts.quiet ? "ignore" : "inherit", opts.pipeErrors ? "pipe" : "inherit"],
    },
  );
}

export async function waitForHttp(url: string, child: ChildProcess, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`the server exited with code ${child.exitCode}`);
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
}
