import { z } from "zod";
import { EMISSION_METHODS, GWP_SETS } from "@/lib/balance/types";
import { FACTOR_SET_OPTIONS } from "./site";

/** A month's method choice, as the review page's form and PUT …/months/{month}/method send it. */
export const monthMethodSchema = z.strictObject({
  emissions: z.enum(EMISSION_METHODS, { error: `choose one of: ${EMISSION_METHODS.join(", ")}` }),
  factor_set: z.string().refine((v) => FACTOR_SET_OPTIONS.some((f) => f.id === v), `choose one of: ${FACTOR_SET_OPTIONS.map((f) => f.id).join(", ")}`),
  gwp: z.enum(GWP_SETS, { error: `choose one of: ${GWP_SETS.join(", ")}` }),
  /** The month version the chooser saw; 0 for a month nobody has started. */
  expectedVersion: z.number({ error: "expectedVersion is required: the month version you started from" }).int().min(0),
});
export type MonthMethodInput = z.infer<typeof monthMethodSchema>;
