// Keeping track of what a test run starts, so that it can stop all of it: the run sets a unique
// SHUNTWISE_RUN_ID in its own environment, every process it starts inherits it (the app server, vitest
// and its workers, the browsers the tests launch, the PostgreSQL cluster, anything a test spawns), and
// at the end the run reads /proc/<pid>/environ to find and stop whatever still carries it, including
// grandchildren that outlived their parent. Free ports are picked here too.
import fs from "node:fs";
import net from "node:net";

export const RUN_ID_VAR = "SHUNTWISE_RUN_ID";

/** Process ids (other than this one) whose environment carries `RUN_ID_VAR=runId`. Linux only. */
export function processesOfRun(runId: string): number[] {
  if (!fs.existsSync("/proc/self/environ")) return [];
  const entry = `${RUN_ID_VAR}=${runId}`;
  const found: number[] = [];
  for (const name of fs.readdirSync("/proc")) {
    const pid = Number(name);
    if (!Number.isInteger(pid) || pid === process.pid) continue;
    try {
      const env = fs.readFileSync(`/proc/${pid}/environ`, "latin1");
      if (env.split("\0").includes(entry)) found.push(pid);
    } catch {
      // gone meanwhile, or not ours to read
    }
  }
  return found;
}

export function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    // a zombie still answers kill(0); it is not running any more
    const stat = fs.existsSync(`/proc/${pid}/stat`) ? fs.readFileSync(`/proc/${pid}/stat`, "utf8") : "";
    return !/^\d+ \(.*\) Z /.test(stat);
  } catch {
    return false;
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** SIGTERM, then SIGKILL for whatever is still there after `graceMs`. */
export async function stopPids(pids: number[], graceMs = 5000): Promise<void> {
  for (const pid of pids) {
    try {
      process.kill(pid, "SIGTERM");
    } catch {
      // already gone
    }
  }
  const until = Date.now() + graceMs;
  while (pids.some(alive) && Date.now() < until) await sleep(100);
  for (const pid of pids.filter(alive)) {
    try {
      process.kill(pid, "SIGKILL");
    } catch {
      // already gone
    }
  }
}

/** Stops every process of the run that is still running; returns how many there were. */
export async function sweepRun(runId: string, graceMs = 5000): Promise<number> {
  const pids = processesOfRun(runId);
  if (pids.length) await stopPids(pids, graceMs);
  // a process may have started another one while being stopped
  const late = processesOfRun(runId);
  if (late.length) await stopPids(late, 1000);
  return pids.length + late.length;
}

/** True when nothing can listen on host:port (another server holds it). */
export function portTaken(port: number, host = "127.0.0.1"): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once("error", () => resolve(true));
    server.listen({ port, host, exclusive: true }, () => server.close(() => resolve(false)));
  });
}

/** `preferred` when it is free, otherwise a free port the system hands out. */
export async function freePort(preferred: number, host = "127.0.0.1", avoid: number[] = []): Promise<number> {
  if (!avoid.includes(preferred) && !(await portTaken(preferred, host))) return preferred;
  for (;;) {
    const port = await new Promise<number>((resolve, reject) => {
      const server = net.createServer();
      server.once("error", reject);
      server.listen({ port: 0, host, exclusive: true }, () => {
        const addr = server.address();
        server.close(() => resolve(typeof addr === "object" && addr ? addr.port : 0));
      });
    });
    if (port && !avoid.includes(port)) return port;
  }
}
