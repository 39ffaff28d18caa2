// `npm test` leaves nothing running: a second, nested test run (as a second checkout would start it,
// with this run's ports all taken) runs a tiny fixture suite. One run ends with a failing test, the other
// is stopped with SIGTERM while a test hangs; both must end with the summary line, having stopped the app
// server, the test PostgreSQL they started and a process a test left behind, on ports of their own.
import { type ChildProcess, spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, test } from "vitest";
import { alive, portTaken, processesOfRun } from "@/scripts/lib/processes";

const root = path.resolve(import.meta.dirname, "../..");
const ourAppPort = Number(new URL(process.env.SHUNTWISE_TEST_URL ?? "http://127.0.0.1:3100").port);
const ourPgPort = Number(new URL(process.env.DATABASE_URL!).port);

interface Run {
  child: ChildProcess;
  out: string;
  dataDir: string;
  output: () => string;
  exit: Promise<number | null>;
}

const runs: Run[] = [];

function startRun(filter: string): Run {
  const base = fs.mkdtempSync(path.join(os.tmpdir(), "shuntwise-nested-"));
  fs.chmodSync(base, 0o755); // when run as root, PostgreSQL runs as its own user and must reach the folder
  const out = path.join(base, "out");
  fs.mkdirSync(out);
  const env: NodeJS.ProcessEnv = { ...process.env, SHUNTWISE_DATA_DIR: path.join(base, "data"), RUNNER_FIXTURE_OUT: out };
  // a fresh checkout's environment: none of this run's service addresses (its ports stay as they are: taken)
  for (const key of Object.keys(env)) {
    if (/^(S3_|SMTP_|MAIL_|NEXTAUTH_|DATABASE_URL|E2E_DATABASE_URL|APP_URL|SHUNTWISE_TEST_URL|SHUNTWISE_MAIL_DIR|NODE_ENV|VITEST)/.test(key)) delete env[key];
  }
  env.SHUNTWISE_TEST_APP_PORT = String(ourAppPort);
  env.SHUNTWISE_TEST_PG_PORT = String(ourPgPort);
  let text = "";
  const child = spawn(process.execPath, ["scripts/bootstrap.mjs", "test", "--config", "tests/fixtures/runner/vitest.config.ts", filter], {
    cwd: root,
    env,
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.on("data", (d) => (text += d));
  child.stderr!.on("data", (d) => (text += d));
  const exit = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  const run = { child, out, dataDir: base, output: () => text, exit };
  runs.push(run);
  return run;
}

function lastLine(text: string): string {
  return text.trim().split("\n").at(-1)!.trim();
}

function portsOf(text: string) {
  const pgPort = Number(/Test PostgreSQL on 127\.0\.0\.1:(\d+)/.exec(text)?.[1]);
  const appPort = Number(/App under test on http:\/\/127\.0\.0\.1:(\d+)/.exec(text)?.[1]);
  return { pgPort, appPort };
}

async function waitForFile(file: string, run: Run, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!fs.existsSync(file)) {
    if (run.child.exitCode !== null) throw new Error(`the nested run ended early:\n${run.output()}`);
    if (Date.now() > until) throw new Error(`no ${file} after ${timeoutMs} ms:\n${run.output()}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function expectNothingLeft(run: Run, tag: string) {
  const text = run.output();
  const { pgPort, appPort } = portsOf(text);
  // the defaults were taken by this very test run, so the nested run picked others
  expect(pgPort).toBeGreaterThan(0);
  expect(appPort).toBeGreaterThan(0);
  expect(pgPort).not.toBe(ourPgPort);
  expect(appPort).not.toBe(ourAppPort);
  // and it let go of them: its PostgreSQL and app server are stopped
  expect(await portTaken(pgPort)).toBe(false);
  expect(await portTaken(appPort)).toBe(false);
  const left = JSON.parse(fs.readFileSync(path.join(run.out, `${tag}.json`), "utf8")) as { sleeper: number; runId: string };
  expect(alive(left.sleeper)).toBe(false);
  expect(processesOfRun(left.runId)).toEqual([]);
}

afterAll(async () => {
  for (const run of runs) {
    if (run.child.exitCode === null) run.child.kill("SIGKILL");
    fs.rmSync(run.dataDir, { recursive: true, force: true });
  }
});

describe("npm test beside another test run", () => {
  test("a run with a failing test and one stopped by SIGTERM both stop all they started", { timeout: 300_000 }, async () => {
    // both at once: two checkouts testing side by side
    const finishing = startRun("finishes");
    const hanging = startRun("hangs");

    await waitForFile(path.join(hanging.out, "hangs.json"), hanging, 240_000);
    hanging.child.kill("SIGTERM"); // to the top process only, as `kill PID` does
    const [finishCode, hangCode] = await Promise.all([finishing.exit, hanging.exit]);

    expect(finishCode).toBe(1);
    expect(lastLine(finishing.output())).toBe("summary: 2 passed, 1 failed, 0 skipped");
    await expectNothingLeft(finishing, "finishes");

    expect(hangCode).not.toBe(0);
    expect(hanging.output()).toContain("Interrupted (SIGTERM)");
    expect(lastLine(hanging.output())).toBe("summary: 0 passed, 1 failed, 0 skipped");
    await expectNothingLeft(hanging, "hangs");
  });
});
