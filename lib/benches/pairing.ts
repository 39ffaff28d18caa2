// Pairing the unseated students of a section at random, and naming new benches. Pure, so the Benches
// page runs it in the browser and the tests run it alone.

export interface Seatable {
  userId: string;
}

/** A uniformly random order (Fisher–Yates; Knuth, TAOCP vol. 2, 3.4.2, algorithm P). */
export function shuffled<T>(items: T[], random: () => number = Math.random): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

/**
 * Groups students in pairs at random; with an odd number the last pair becomes a three, so no one works
 * alone (a single student stays alone only when they are the only one).
 */
export function randomPairs<T extends Seatable>(students: T[], random: () => number = Math.random): T[][] {
  const order = shuffled(students, random);
  const groups: T[][] = [];
  for (let i = 0; i + 1 < order.length; i += 2) groups.push([order[i], order[i + 1]]);
  if (order.length % 2 === 1) {
    const last = order[order.length - 1];
    if (groups.length) groups[groups.length - 1].push(last);
    else groups.push([last]);
  }
  return groups;
}

/** The next `count` free names "Bench 01", "Bench 02", … (two digits, more when the numbers need them). */
export function nextBenchNames(taken: Iterable<string>, count: number): string[] {
  const used = new Set([...taken].map((n) => n.toLowerCase()));
  const out: string[] = [];
  for (let n = 1; out.length < count; n++) {
    const name = `Bench ${String(n).padStart(2, "0")}`;
    if (!used.has(name.toLowerCase())) out.push(name);
  }
  return out;
}
