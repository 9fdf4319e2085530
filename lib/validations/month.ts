import { z } from "zod";
import { COMPONENTS } from "@/lib/balance/components";
import { UNITS } from "@/lib/balance/units";

const DECIMAL = /^\d+(\.\d+)?$/;

/** A non-negative decimal written as text; commas or spaces as thousands separators are refused, not guessed. */
export const decimalText = (label: string) =>
  z
    .string({ error: `${label} is required` })
    .trim()
    .min(1, `${label} is required`)
    .regex(DECIMAL, `${label} must be a non-negative number with a dot for decimals (e.g. 1250.5)`);

export const readingInputSchema = z.strictObject({
  stream: z.string().min(1, "stream is required"),
  quantity: decimalText("quantity"),
  unit: z.enum(UNITS, { error: (i) => `unknown unit ${JSON.stringify(i.input)} (one of: ${UNITS.join(", ")})` }),
  source: z.enum(["meter", "estimate", "invoice"]).default("meter"),
  note: z.string().trim().max(1000, "note is longer than 1000 characters").optional(),
});
export type ReadingInput = z.input<typeof readingInputSchema>;

export const analysisInputSchema = z.strictObject({
  key: z
    .string()
    .trim()
    .min(1, "analysis name is required")
    .max(80)
    .regex(/^[A-Za-z0-9][A-Za-z0-9 ._-]*$/, "analysis name may hold letters, digits, space, dot, dash and underscore"),
  components: z
    .record(z.string(), decimalText("mol %"))
    .superRefine((comps, ctx) => {
      for (const c of Object.keys(comps)) {
        if (!(COMPONENTS as readonly string[]).includes(c)) {
          ctx.addIssue({ code: "custom", path: [c], message: `unknown component ${c} (one of: ${COMPONENTS.join(", ")})` });
        }
      }
    }),
  sampledOn: z.iso.date({ error: "sampled on must be a date YYYY-MM-DD" }).optional(),
  laboratory: z.string().trim().max(200).optional(),
  note: z.string().trim().max(1000).optional(),
});
export type AnalysisInput = z.input<typeof analysisInputSchema>;

export const PERIOD = /^\d{4}-(0[1-9]|1[0-2])$/;

/** What a form save, an API PUT or an import commit sends for one site-month. */
export const monthFiguresSchema = z.strictObject({
  /** The version the editor started from; 0 for a month nobody has started. */
  expectedVersion: z.number().int().min(0),
  readings: z.array(readingInputSchema).max(500).default([]),
  /** Stream keys whose reading is to be removed. */
  removeReadings: z.array(z.string()).max(500).default([]),
  analyses: z.array(analysisInputSchema).max(50).default([]),
  balanceNote: z.string().trim().max(4000).optional(),
});
export type MonthFiguresInput = z.input<typeof monthFiguresSchema>;
