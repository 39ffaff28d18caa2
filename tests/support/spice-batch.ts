// A small driver for ngspice (Debian's /usr/bin/ngspice) in batch mode: write a netlist, run it, read the
// `name = value` lines its control block prints. Used by the simulated bench's checks against a circuit
// simulator; each run is one short process that ends by itself (a timeout kills it).
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

export const NGSPICE = "/usr/bin/ngspice";

/**
 * Runs a netlist (with its own .control block) and returns every `name = number` it printed (names in lower
 * case, `print all`'s branch currents such as `v1#branch` included). `timeoutMs` for long batches.
 */
export function runNgspice(netlist: string, timeoutMs = 60_000): Record<string, number> {
  const dir = mkdtempSync(path.join(tmpdir(), "shuntwise-spice-"));
  try {
    const file = path.join(dir, "circuit.cir");
    writeFileSync(file, netlist);
    // batch mode exits 1 when the netlist has only a .control block ("no simulations run"), so the printed
    // values decide: none at all is a failure, shown with what ngspice said
    const run = spawnSync(NGSPICE, ["-b", file], { encoding: "utf8", timeout: timeoutMs, stdio: ["ignore", "pipe", "pipe"] });
    const values: Record<string, number> = {};
    for (const line of (run.stdout ?? "").split("\n")) {
      const m = /^\s*([a-z_][\w.#]*)\s*=\s*([-+0-9.eE]+)\s*$/i.exec(line);
      if (m) values[m[1].toLowerCase()] = Number(m[2]);
    }
    if (Object.keys(values).length === 0) throw new Error(`ngspice printed no values (exit ${run.status}): ${run.error?.message ?? ""}\n${run.stdout}\n${run.stderr}`);
    return values;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
