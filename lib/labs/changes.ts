// What changed between two versions of a lab, and whether the change touches grades. The builder (to
// send only what changed and to ask before a regrade) and lib/labs/edit.ts (to decide on the regrade)
// both use these, so the two sides cannot disagree. Pure: no React, no server code.

/** JSON with object keys sorted and undefined members left out: equal values give equal text, whatever order their keys came in. */
export function stableJson(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(stableJson).join(",")}]`;
  if (v && typeof v === "object" && !(v instanceof Date)) {
    return `{${Object.keys(v)
      .filter((k) => (v as Record<string, unknown>)[k] !== undefined)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${stableJson((v as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  }
  return v === undefined ? "undefined" : JSON.stringify(v);
}

/** Equal by value (stored JSON may order keys differently). */
export function sameValue(a: unknown, b: unknown): boolean {
  return stableJson(a) === stableJson(b);
}

/** Two instants given as ISO text, Dates or nothing. */
export function sameInstant(a: string | Date | null | undefined, b: string | Date | null | undefined): boolean {
  if (!a || !b) return !a && !b;
  return new Date(a).getTime() === new Date(b).getTime();
}

const DATE_FIELDS = new Set(["opensAt", "dueAt", "closesAt"]);

/** The fields of `next` that differ from `before`, for a PATCH. */
export function changedFields<T extends object>(before: T, next: T): Partial<T> {
  const out: Partial<T> = {};
  for (const key of Object.keys(next) as (keyof T & string)[]) {
    const a = before[key];
    const b = next[key];
    const same = DATE_FIELDS.has(key) ? sameInstant(a as string | null, b as string | null) : sameValue(a, b);
    if (!same) out[key] = b;
  }
  return out;
}

/** The fields a grade depends on: changing one of them on a published lab with attempts recomputes every attempt. */
export const GRADING_FIELDS = ["templateKey", "spec", "questions", "policy", "latePenaltyPercentPerDay", "lateFloorPercent"] as const;
export type GradingField = (typeof GRADING_FIELDS)[number];

/** Whether a set of changed fields touches grades (the builder asks before saving such a change). */
export function changesGrades(changed: object): boolean {
  return GRADING_FIELDS.some((k) => k in changed);
}

/** The grading fields of a lab, as one comparable text; `normalise` may put each field in its canonical form first. */
export function gradingKey<T extends Record<GradingField, unknown>>(lab: T, normalise: Partial<{ [K in GradingField]: (v: T[K]) => unknown }> = {}): string {
  return stableJson(Object.fromEntries(GRADING_FIELDS.map((k) => [k, normalise[k] ? (normalise[k] as (v: unknown) => unknown)(lab[k]) : lab[k]])));
}
