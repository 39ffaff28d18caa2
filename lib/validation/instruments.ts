// Instrument profiles of a course: `POST /api/courses/{courseId}/instruments` (a profile, or a copy of a
// built-in one), `PATCH /api/instruments/{instrumentId}` and the course's instruments page. One schema for
// the whole profile; a PATCH is merged onto the stored profile and checked by the same schema.
import { z } from "zod";
import { INSTRUMENT_KINDS, burdenAtFullScale, hysteresisFault, outputAtFullScale, type InstrumentKind, type InstrumentProfile } from "../instruments/profile";
import { LIBRARY } from "../instruments/library";

const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;
const text = (what: string, max: number) =>
  z
    .string({ error: `Give ${what}.` })
    .trim()
    .min(1, `Give ${what}.`)
    .max(max, `Use at most ${max} characters.`)
    .refine((s) => !CONTROL.test(s), "Use letters, digits and spaces (no control characters).");

const positive = (what: string) => z.number({ error: `${what} is a number.` }).finite(`${what} is a finite number.`).positive(`${what} must be above zero.`);
const nonNegative = (what: string) => z.number({ error: `${what} is a number.` }).finite(`${what} is a finite number.`).min(0, `${what} cannot be negative.`);

const resolutionSchema = z.union(
  [
    z.object({ counts: z.number({ error: "counts is a number." }).int("counts is a whole number.").min(2, "At least 2 counts.").max(100_000_000, "At most 100,000,000 counts.") }).strict(),
    z
      .object({
        bits: z.number({ error: "bits is a number." }).int("bits is a whole number.").min(4, "At least 4 bits.").max(32, "At most 32 bits."),
        referenceVolts: positive("The reference voltage").max(100, "At most 100 V."),
      })
      .strict(),
  ],
  { error: "Resolution is { counts } for a display, or { bits, referenceVolts } for a converter." },
);

const accuracySchema = z
  .object({
    percentOfReading: nonNegative("The % of reading").max(100, "At most 100 %."),
    counts: nonNegative("The counts").int("The counts are a whole number.").max(100_000, "At most 100,000 counts.").optional(),
    percentOfRange: nonNegative("The % of range").max(100, "At most 100 %.").optional(),
  })
  .strict();

const rangeSchema = z
  .object({
    key: z
      .string({ error: "Give the range a key." })
      .regex(/^[a-z0-9][a-z0-9-]{0,19}$/, "A key is 1 to 20 lower-case letters, digits or dashes, such as r2m."),
    label: text("the range a name by its full scale, such as 2 mA", 20),
    fullScale: positive("The full scale").max(1000, "At most 1000 A."),
    shuntOhms: positive("The shunt").max(1e12, "At most 1 TΩ.").optional(),
    burdenAtFullScale: nonNegative("The burden").max(100, "At most 100 V.").optional(),
    feedbackOhms: positive("The feedback resistor").max(1e15, "At most 1 PΩ.").optional(),
    resolution: resolutionSchema,
    accuracy: accuracySchema,
    sensitivity: positive("The sensitivity").max(1e15, "At most 10¹⁵ V/A.").optional(),
    filterCutoffHz: positive("The filter cut-off").max(1e9, "At most 1 GHz.").optional(),
    settlingSeconds: nonNegative("The settling time").max(3600, "At most an hour.").optional(),
  })
  .strict();

const autoRangeSchema = z
  .object({
    upAtFractionOfFullScale: positive("The upper threshold").max(1.5, "At most 1.5 of full scale."),
    downAtFractionOfFullScale: nonNegative("The lower threshold").max(1, "At most the full scale."),
    settlingSeconds: nonNegative("The settling time").max(3600, "At most an hour."),
  })
  .strict();

const offsetSchema = z.object({ volts: nonNegative("The offset").max(100, "At most 100 V.") }).strict();

export const instrumentFields = {
  name: text("the instrument a name", 80),
  kind: z.enum(INSTRUMENT_KINDS as [InstrumentKind, ...InstrumentKind[]], { error: `kind is one of ${INSTRUMENT_KINDS.join(", ")}.` }),
  ranges: z.array(rangeSchema, { error: "ranges is a list of ranges." }).min(1, "Give at least one range.").max(16, "At most 16 ranges."),
  autoRange: autoRangeSchema.optional(),
  offset: offsetSchema.optional(),
  description: z
    .string({ error: "The description is text." })
    .trim()
    .max(300, "Use at most 300 characters.")
    .refine((s) => !/[\u0000-\u0009\u000b-\u001f\u007f-\u009f]/.test(s), "No control characters.")
    .optional(),
};

/** Whole-profile rules, with the path of the field at fault. */
function checkProfile(p: z.infer<z.ZodObject<typeof instrumentFields>>, ctx: z.RefinementCtx): void {
  const keys = new Map<string, number>();
  p.ranges.forEach((r, i) => {
    if (keys.has(r.key)) ctx.addIssue({ code: "custom", path: ["ranges", i, "key"], message: `"${r.key}" is already the key of range ${keys.get(r.key)! + 1}.` });
    else keys.set(r.key, i);
    if (i > 0 && !(r.fullScale > p.ranges[i - 1].fullScale))
      ctx.addIssue({
        code: "custom",
        path: ["ranges", i, "fullScale"],
        message: `Ranges overlap: list them from the smallest full scale up, each above the one before (${p.ranges[i - 1].label}).`,
      });
    if (p.kind === "sampling-meter" && r.sensitivity === undefined) ctx.addIssue({ code: "custom", path: ["ranges", i, "sensitivity"], message: "A sampling meter's range needs its output sensitivity (V/A)." });
    if (p.kind === "sampling-meter" && r.shuntOhms === undefined) ctx.addIssue({ code: "custom", path: ["ranges", i, "shuntOhms"], message: "A sampling meter's range needs its shunt (Ω)." });
    if (p.kind === "multimeter" && r.shuntOhms === undefined && r.burdenAtFullScale === undefined)
      ctx.addIssue({ code: "custom", path: ["ranges", i, "burdenAtFullScale"], message: "Give the shunt or the burden voltage at full scale." });
    if (p.kind === "feedback-ammeter" && r.feedbackOhms === undefined) ctx.addIssue({ code: "custom", path: ["ranges", i, "feedbackOhms"], message: "A feedback ammeter's range needs its feedback resistor (Ω)." });
    const out = outputAtFullScale(r);
    const burden = burdenAtFullScale(r);
    if (out !== undefined && burden > out)
      ctx.addIssue({
        code: "custom",
        path: ["ranges", i, r.burdenAtFullScale !== undefined ? "burdenAtFullScale" : "shuntOhms"],
        message: `The burden at full scale (${burden.toPrecision(3)} V) exceeds the range's full-scale output (${out.toPrecision(3)} V).`,
      });
  });
  if (p.autoRange) {
    const a = p.autoRange;
    if (!(a.downAtFractionOfFullScale < a.upAtFractionOfFullScale))
      ctx.addIssue({ code: "custom", path: ["autoRange", "downAtFractionOfFullScale"], message: "The lower threshold must sit below the upper one." });
    else {
      const k = hysteresisFault(p as InstrumentProfile);
      if (k > 0)
        ctx.addIssue({
          code: "custom",
          path: ["autoRange", "downAtFractionOfFullScale"],
          message: `No hysteresis between ${p.ranges[k - 1].label} and ${p.ranges[k].label}: after switching down the reading would be above the upper threshold.`,
        });
    }
  }
  if (p.offset) {
    if (p.kind !== "sampling-meter") ctx.addIssue({ code: "custom", path: ["offset"], message: "Only a sampling meter has an offset for currents both ways." });
    else
      p.ranges.forEach((r, i) => {
        const out = outputAtFullScale(r);
        if (out !== undefined && !(p.offset!.volts < out))
          ctx.addIssue({ code: "custom", path: ["offset", "volts"], message: `The offset must lie below the ${r.label} range's full-scale output (${out.toPrecision(3)} V).` });
        void i;
      });
  }
}

export const instrumentProfileSchema = z.object(instrumentFields).strict().superRefine(checkProfile);
export type InstrumentProfileInput = z.input<typeof instrumentProfileSchema>;

const LIBRARY_KEYS = LIBRARY.map((i) => i.libraryKey) as [string, ...string[]];

const copySchema = z
  .object({ copyOf: z.enum(LIBRARY_KEYS, { error: `copyOf is one of ${LIBRARY_KEYS.join(", ")}.` }), name: instrumentFields.name.optional() })
  .strict();

/**
 * `POST /api/courses/{courseId}/instruments`: a whole profile, or `{ copyOf: libraryKey }` (optionally with a
 * new name). A body with `copyOf` is read as a copy, any other as a profile, so errors name the profile's fields.
 */
export const instrumentCreateSchema = z.unknown().transform((v, ctx): { copyOf: string; name?: string } | z.output<typeof instrumentProfileSchema> => {
  const isCopy = typeof v === "object" && v !== null && !Array.isArray(v) && "copyOf" in v;
  const r = isCopy ? copySchema.safeParse(v) : instrumentProfileSchema.safeParse(v);
  if (r.success) return r.data;
  for (const issue of r.error.issues) ctx.addIssue({ code: "custom", path: issue.path as (string | number)[], message: issue.message });
  return z.NEVER;
});
export type InstrumentCreate = z.output<typeof instrumentCreateSchema>;

/** `PATCH /api/instruments/{instrumentId}`: any of the profile's fields; the merged profile must pass instrumentProfileSchema. */
export const instrumentPatchSchema = z
  .object({
    name: instrumentFields.name.optional(),
    kind: instrumentFields.kind.optional(),
    ranges: instrumentFields.ranges.optional(),
    autoRange: autoRangeSchema.nullable().optional(),
    offset: offsetSchema.nullable().optional(),
    description: instrumentFields.description.nullable().optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, "Send at least one field to change.");
export type InstrumentPatch = z.output<typeof instrumentPatchSchema>;

/** The stored profile with a PATCH applied (null removes autoRange, offset or description). */
export function applyPatch(stored: InstrumentProfile, patch: InstrumentPatch): unknown {
  const next: Record<string, unknown> = { ...stored };
  for (const [k, v] of Object.entries(patch)) {
    if (v === null) delete next[k];
    else if (v !== undefined) next[k] = v;
  }
  return next;
}
