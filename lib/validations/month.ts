import { z } from "zod";
import { COMPONENTS } from "@/lib/balance/components";
import { LIMITS } from "@/lib/balance/limits";
import { UNITS } from "@/lib/balance/units";

const DECIMAL = /^\d+(\.\d+)?$/;

/** Messages read as sentences: "Quantity must be…", whatever the label's case. */
const cap = (label: string) => label.charAt(0).toUpperCase() + label.slice(1);

/** Text people type: within a length, and whole Unicode (a lone surrogate cannot be stored or printed). */
export const typedText = (label: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, `${cap(label)} is longer than ${max} characters`)
    .refine((s) => s.isWellFormed(), `${cap(label)} holds a broken character (a lone UTF-16 surrogate); retype it`);

/** A non-negative decimal written as text; commas or spaces as thousands separators are refused, not guessed. */
export const decimalText = (label: string) =>
  z
    .string({ error: `${cap(label)} is required` })
    .trim()
    .min(1, `${cap(label)} is required`)
    .max(LIMITS.numberChars, `${cap(label)} is longer than ${LIMITS.numberChars} characters`)
    .regex(DECIMAL, `${cap(label)} must be a non-negative number with a dot for decimals (e.g. 1250.5)`);

export const readingInputSchema = z.strictObject({
  stream: z.string().min(1, "stream is required").max(LIMITS.nameChars, `stream is longer than ${LIMITS.nameChars} characters`),
  quantity: decimalText("quantity"),
  unit: z.enum(UNITS, { error: (i) => `unknown unit ${JSON.stringify(i.input)} (one of: ${UNITS.join(", ")})` }),
  source: z.enum(["meter", "estimate", "invoice"]).default("meter"),
  note: typedText("note", LIMITS.noteChars).optional(),
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
  laboratory: typedText("laboratory", LIMITS.nameChars).optional(),
  /** Expanded (95 %) relative uncertainty of the carbon content, %, as the laboratory states it. */
  // Absent: unchanged; "": cleared (the set's default applies again).
  carbonUncertaintyPct: z.union([z.literal(""), decimalText("carbon content uncertainty").refine((v) => Number(v) <= 100, "carbon content uncertainty must be at most 100 (%)")]).optional(),
  /** Likewise of the calorific value. */
  cvUncertaintyPct: z.union([z.literal(""), decimalText("calorific value uncertainty").refine((v) => Number(v) <= 100, "calorific value uncertainty must be at most 100 (%)")]).optional(),
  note: typedText("note", LIMITS.noteChars).optional(),
});
export type AnalysisInput = z.input<typeof analysisInputSchema>;

export const PERIOD = /^\d{4}-(0[1-9]|1[0-2])$/;

/** What a form save, an API PUT or an import commit sends for one site-month. */
export const monthFiguresSchema = z.strictObject({
  /** The version the editor started from; 0 for a month nobody has started. */
  expectedVersion: z.number().int().min(0),
  readings: z.array(readingInputSchema).max(LIMITS.streams, `more than ${LIMITS.streams} readings in one month`).default([]),
  /** Stream keys whose reading is to be removed. */
  removeReadings: z.array(z.string().max(LIMITS.nameChars)).max(LIMITS.streams, `more than ${LIMITS.streams} streams to clear in one month`).default([]),
  analyses: z.array(analysisInputSchema).max(LIMITS.analyses, `more than ${LIMITS.analyses} analyses in one month`).default([]),
  balanceNote: typedText("balance note", LIMITS.noteChars).optional(),
});
export type MonthFiguresInput = z.input<typeof monthFiguresSchema>;
