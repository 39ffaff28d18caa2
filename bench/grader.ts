// Benchmark: graded attempts per second for 10-question attempts over all templates, with readings typed
// as strings with units. Baseline in the same run: bare compute() calls per second.
// Run: npx tsx bench/grader.ts  (npm run bench:grader)
import {
  TEMPLATE_KEYS,
  componentTolerancesFromSpec,
  defaultVariantSpec,
  drawVariant,
  formatQuantity,
  gradeAttempt,
  templates,
  type GradeInput,
  type Question,
} from "../lib/grader/index";
import { cpus, loadavg } from "node:os";

const ATTEMPTS = 1400;
const SECONDS = 2;

function buildAttempts(): GradeInput[] {
  const out: GradeInput[] = [];
  for (let i = 0; i < ATTEMPTS; i++) {
    const key = TEMPLATE_KEYS[i % TEMPLATE_KEYS.length];
    const t = templates[key];
    const spec = defaultVariantSpec(key);
    const params = drawVariant(spec, `bench-${i}`);
    const values = t.compute(params);
    const questions: Question[] = [];
    const readings: string[] = [];
    for (let j = 0; j < 10; j++) {
      const q = t.quantities[j % t.quantities.length];
      questions.push({ quantity: q.key, kind: j % 2 === 0 ? "prediction" : "bench", points: 1 });
      if (q.kind === "category") {
        readings.push(j % 3 === 0 ? "µA" : String(values[q.key]));
        continue;
      }
      const v = values[q.key] as number;
      // a spread of answers: right, slightly off, a prefix slip, far off, missing
      const kind = (i + j) % 5;
      const typed = kind === 0 ? v : kind === 1 ? v * 1.004 : kind === 2 ? v * 1000 : kind === 3 ? v * 1.7 : NaN;
      readings.push(Number.isNaN(typed) ? "" : formatQuantity(typed, q.unit));
    }
    out.push({ template: key, params, questions, readings, policy: { componentTolerances: componentTolerancesFromSpec(spec), instrumentAccuracyPercent: 0.5 } });
  }
  return out;
}

interface Rate {
  /** per second of wall-clock time */
  wall: number;
  /** per second of this process's CPU time (less sensitive to other work on a shared machine) */
  cpu: number;
}

function rate(fn: (i: number) => void, seconds: number): Rate {
  let n = 0;
  const start = performance.now();
  const cpu0 = process.cpuUsage();
  const end = start + seconds * 1000;
  while (performance.now() < end) {
    for (let k = 0; k < 200; k++) fn(n++);
  }
  const wall = (performance.now() - start) / 1000;
  const used = process.cpuUsage(cpu0);
  return { wall: n / wall, cpu: n / ((used.user + used.system) / 1e6) };
}

const attempts = buildAttempts();
let sink = 0;
// warm up
for (let i = 0; i < 3000; i++) sink += gradeAttempt(attempts[i % attempts.length]).score;

const computeRate = rate((i) => {
  const a = attempts[i % attempts.length];
  const v = templates[a.template as keyof typeof templates].compute(a.params);
  sink += typeof v === "object" ? 1 : 0;
}, SECONDS);
const gradeRate = rate((i) => {
  sink += gradeAttempt(attempts[i % attempts.length]).score;
}, SECONDS);

const r = (x: number) => Math.round(x);
console.log(`grader benchmark: ${ATTEMPTS} distinct attempts, 10 questions each, ${TEMPLATE_KEYS.length} templates, typed readings`);
console.log(`load average at the end (1 min, ${cpus().length} cores): ${loadavg()[0].toFixed(2)}`);
console.log(`baseline compute() calls per second: ${r(computeRate.wall)} (per CPU second: ${r(computeRate.cpu)})`);
console.log(`graded attempts per second: ${r(gradeRate.wall)} (per CPU second: ${r(gradeRate.cpu)})`);
console.log(`questions graded per second: ${r(gradeRate.wall * 10)}`);
console.log(`ratio compute calls / graded attempts: ${(computeRate.wall / gradeRate.wall).toFixed(1)}`);
console.log(`goal 10000 attempts per second: ${gradeRate.wall >= 10000 ? "met" : gradeRate.cpu >= 10000 ? "met per CPU second (the machine is busy)" : "not met"}`);
if (sink === -1) console.log("");
