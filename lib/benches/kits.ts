// Kits: what the lab technician puts in each bag, one bag per bench (the circuits of everyone seated there;
// a student at no bench gets a bag of their own), and the totals against the stockroom. Pure.
import { formatQuantity, templates, type Params, type TemplateKey, type VariantSpec } from "@/lib/grader";

export interface KitMember {
  userId: string;
  name: string;
}

export interface KitPart {
  label: string;
  /** ohms */
  value: number;
  tolerancePercent: number | null;
  count: number;
}

export interface Kit {
  /** the bench's name, or null for a student at no bench */
  bench: string | null;
  /** the student, for a kit of one student at no bench */
  student: KitMember | null;
  members: KitMember[];
  parts: KitPart[];
}

export interface StockLine {
  kind: "resistor" | "capacitor";
  value: number;
  tolerancePercent: number;
  quantity: number;
}

export interface KitTotal {
  label: string;
  value: number;
  tolerancePercent: number | null;
  needed: number;
  /** on the shelf at this value and within the tolerance (as tight or tighter) */
  inStock: number;
}

const partKey = (value: number, tol: number | null) => `${value}|${tol ?? ""}`;
const byValue = (a: { value: number; tolerancePercent: number | null }, b: { value: number; tolerancePercent: number | null }) => a.value - b.value || (a.tolerancePercent ?? 0) - (b.tolerancePercent ?? 0);

/** Every resistor of these circuits, counted by value and tolerance. */
function partsOf(templateKey: TemplateKey, spec: VariantSpec, circuits: Params[]): KitPart[] {
  const resistors = templates[templateKey].parameters.filter((p) => p.kind === "resistor");
  const out = new Map<string, KitPart>();
  for (const params of circuits) {
    for (const r of resistors) {
      const value = params[r.key];
      if (typeof value !== "number") continue;
      const tol = spec.parameters[r.key]?.tolerancePercent ?? null;
      const key = partKey(value, tol);
      const part = out.get(key) ?? { label: formatQuantity(value, "ohm"), value, tolerancePercent: tol, count: 0 };
      part.count++;
      out.set(key, part);
    }
  }
  return [...out.values()].sort(byValue);
}

/**
 * The kits in the benches' order, then one per student at no bench; a student without a stored circuit
 * adds nothing to a bag (the bag is short until their circuit is drawn).
 */
export function buildKits(
  templateKey: TemplateKey,
  spec: VariantSpec,
  benches: { name: string; members: KitMember[] }[],
  unseated: KitMember[],
  circuits: Map<string, Params>,
  stock: StockLine[],
): { kits: Kit[]; totals: KitTotal[] } {
  const circuitsOf = (members: KitMember[]) => members.flatMap((m) => (circuits.has(m.userId) ? [circuits.get(m.userId)!] : []));
  const kits: Kit[] = [
    ...benches.filter((b) => b.members.length).map((b) => ({ bench: b.name, student: null, members: b.members, parts: partsOf(templateKey, spec, circuitsOf(b.members)) })),
    ...unseated.map((s) => ({ bench: null, student: s, members: [s], parts: partsOf(templateKey, spec, circuitsOf([s])) })),
  ];
  const totals = new Map<string, KitTotal>();
  for (const kit of kits) {
    for (const p of kit.parts) {
      const key = partKey(p.value, p.tolerancePercent);
      const t = totals.get(key) ?? { label: p.label, value: p.value, tolerancePercent: p.tolerancePercent, needed: 0, inStock: 0 };
      t.needed += p.count;
      totals.set(key, t);
    }
  }
  for (const t of totals.values()) {
    t.inStock = stock
      .filter((s) => s.kind === "resistor" && Math.abs(s.value - t.value) <= 1e-9 * t.value && (t.tolerancePercent === null || s.tolerancePercent <= t.tolerancePercent))
      .reduce((a, s) => a + s.quantity, 0);
  }
  return { kits, totals: [...totals.values()].sort(byValue) };
}
