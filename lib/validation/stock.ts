// The stockroom of a course: `PUT /api/courses/{courseId}/stock`.
import { z } from "zod";

export const stockSchema = z
  .object({
    items: z
      .array(
        z.object({
          kind: z.enum(["resistor", "capacitor"], { error: "A part is a resistor or a capacitor." }),
          /** SI: ohms or farads */
          value: z.number({ error: "Give the value in ohms or farads, as a number." }).positive("A value is greater than zero.").max(1e12, "Use at most 1 TΩ."),
          tolerancePercent: z.number({ error: "Give the tolerance in percent." }).positive("A tolerance is greater than zero.").max(50, "Use a tolerance of at most 50 %."),
          quantity: z.number({ error: "Give how many are on the shelf." }).int("A quantity is a whole number.").min(0, "A quantity cannot be negative.").max(1_000_000, "At most 1,000,000."),
        }),
        { error: "items is a list of parts." },
      )
      .max(2000, "At most 2,000 lines of stock."),
  })
  .superRefine((v, ctx) => {
    const seen = new Map<string, number>();
    v.items.forEach((i, n) => {
      const key = `${i.kind}|${i.value}|${i.tolerancePercent}`;
      if (seen.has(key)) ctx.addIssue({ code: "custom", path: ["items", n, "value"], message: `The same part is on line ${seen.get(key)! + 1}; add the quantities together.` });
      else seen.set(key, n);
    });
  });
export type StockInput = z.input<typeof stockSchema>;
