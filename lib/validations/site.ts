import { z } from "zod";
import { BUILT_IN_FACTOR_SETS } from "@/lib/emissions/registry";
import { Dec } from "@/lib/balance/decimal";
import { EMISSION_METHODS, GWP_SETS } from "@/lib/balance/types";

/** The three metering references a site may declare (db enum metering_reference). */
export const METERING_REFERENCES = ["15C", "0C", "60F"] as const;
export const METERING_REFERENCE_LABELS: Record<(typeof METERING_REFERENCES)[number], string> = {
  "15C": "15 °C, 101.325 kPa (Sm3)",
  "0C": "0 °C, 101.325 kPa (Nm3)",
  "60F": "60 °F, 14.696 psia (scf)",
};

export const EMISSIONS_METHOD_LABELS: Record<(typeof EMISSION_METHODS)[number], string> = {
  "carbon-mass-balance": "Carbon mass balance",
  "fuel-calculation": "Fuel-by-fuel calculation",
  measured: "Measured (stack and vent monitors)",
  "default-factor": "Default-factor screening",
};

/** Factor sets a site may choose: the built-in ones (an organisation's own sets are not stored yet). */
export const FACTOR_SET_OPTIONS = BUILT_IN_FACTOR_SETS.map((s) => ({ id: s.id, name: s.name }));

const POSITIVE_DECIMAL = /^\d+(\.\d+)?$/;

/**
 * One site as the set-up form, the server actions and the tests see it. Numbers stay text:
 * the tolerance goes to a numeric column unchanged, so what was typed is what is stored.
 */
export const siteSchema = z.strictObject({
  name: z.string().trim().min(1, "Enter the site's name.").max(120, "Keep the name under 120 characters."),
  code: z
    .string()
    .trim()
    .toLowerCase()
    .min(2, "The code needs at least 2 characters.")
    .max(32, "Keep the code under 32 characters.")
    .regex(/^[a-z0-9][a-z0-9-]*$/, "Use lower-case letters, digits and dashes (it appears in links and file names)."),
  meteringReference: z.enum(METERING_REFERENCES, { error: "Choose the metering reference." }),
  closureTolerancePct: z
    .string()
    .trim()
    .regex(POSITIVE_DECIMAL, "Enter a percentage with a dot for decimals, e.g. 2 or 1.5.")
    .refine((v) => !POSITIVE_DECIMAL.test(v) || new Dec(v).gt(0), "The tolerance must be more than 0 %.")
    // Beyond 50 % a "closed" balance no longer tells anything about the meters.
    .refine((v) => !POSITIVE_DECIMAL.test(v) || new Dec(v).lte(50), "Keep the tolerance at 50 % or less."),
  factorSet: z.string().refine((v) => FACTOR_SET_OPTIONS.some((f) => f.id === v), "Choose one of the listed factor sets."),
  emissionsMethod: z.enum(EMISSION_METHODS, { error: "Choose the emissions method." }),
  gwp: z.enum(GWP_SETS, { error: "Choose the GWP set." }),
});
export type SiteInput = z.input<typeof siteSchema>;
export type SiteValues = z.output<typeof siteSchema>;

export const SITE_DEFAULTS: SiteInput = {
  name: "",
  code: "",
  meteringReference: "15C",
  closureTolerancePct: "2",
  factorSet: "ipcc-2006",
  emissionsMethod: "carbon-mass-balance",
  gwp: "AR5",
};
