import { z } from "zod";

/**
 * A factor set is data, not code: organisations can add their own (site-specific laboratory
 * factors, a national inventory's factors) as JSON. Every number is a decimal string so no value
 * passes through binary floating point, and every value names the table it comes from.
 */

const DECIMAL_RE = /^-?\d+(\.\d+)?([eE][-+]?\d+)?$/;
const ISO_DATE_RE = /^\d{4}-\d{2}-\d{2}$/;

export const decimalString = z.string().regex(DECIMAL_RE, "must be a decimal number written as a string");
const isoDate = z.string().regex(ISO_DATE_RE, "must be a date YYYY-MM-DD");
/**
 * Provenance of a value. "confirmed": the value was read in the published text of the document
 * and place `source` names (and `checked` says where that text was read); "unconfirmed": it is
 * cited but nobody has yet read it there. A statement lists every unconfirmed value it rests on
 * and its signatory acknowledges each one before signing.
 */
export const provenanceStatus = z.enum(["confirmed", "unconfirmed"]);
export type ProvenanceStatus = z.infer<typeof provenanceStatus>;

/** Where a value comes from: document and table or article, whether it was confirmed there, and how. */
const citation = {
  source: z.string().min(1, "a source naming the document and its table or article is required"),
  status: provenanceStatus,
  /** Where the published text was read when the value was confirmed (required when status is "confirmed"). */
  checked: z.string().min(1).optional(),
  note: z.string().optional(),
};

function checkedWhenConfirmed(v: { status: string; checked?: string }): boolean {
  return v.status !== "confirmed" || (v.checked !== undefined && v.checked.trim() !== "");
}
const checkedMessage = { message: 'a "confirmed" value must say in `checked` where its published text was read', path: ["checked"] };

export const citedValueSchema = z
  .object({
    value: decimalString,
    unit: z.string().min(1),
    /** Expanded relative uncertainty at 95 %, in percent, where the source states one. */
    uncertainty_pct: decimalString.optional(),
    ...citation,
  })
  .refine(checkedWhenConfirmed, checkedMessage);

/** What one unit of activity is: factors are kg of gas per one unit of this activity. */
export const activityBasisSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("energy"), unit: z.enum(["TJ", "GJ", "MMBtu"]), basis: z.enum(["NCV", "GCV"]) }),
  z.object({ kind: z.literal("mass"), unit: z.enum(["t", "kg"]) }),
]);

export const fuelFactorsSchema = z.object({
  label: z.string().min(1),
  activity: activityBasisSchema,
  /** kg CO2 per activity unit; null when the factor can only come from the month's analysis. */
  co2: citedValueSchema.nullable(),
  /** Prefer a factor derived from the month's analysis (carbon content) over `co2`. */
  co2_from_analysis: z.boolean(),
  /** kg CH4 / kg N2O per activity unit; null: the gas lies outside the set's scope. */
  ch4: citedValueSchema.nullable(),
  n2o: citedValueSchema.nullable(),
  oxidation_factor: citedValueSchema,
  /** Reference figures kept with the factor (e.g. kg C/GJ, TJ/Gg) so checks can cite them. */
  carbon_content: citedValueSchema.optional(),
  calorific_value: citedValueSchema.optional(),
  /** Default energy content per volume unit, for volumes metered without an analysis. */
  default_energy_per_volume: citedValueSchema.and(z.object({ volume_unit: z.enum(["scf", "Sm3", "Nm3"]) })).optional(),
});

const ratioSchema = z
  .object({ numerator: decimalString, denominator: decimalString, unit: z.string().min(1), ...citation })
  .refine(checkedWhenConfirmed, checkedMessage)
  .refine((r) => !/^-?0*(\.0*)?([eE].*)?$/.test(r.denominator), { message: "denominator must not be zero", path: ["denominator"] });

const perTonneRowSchema = z.object({
  id: z.string().min(1),
  label: z.string().min(1),
  fuel_requirement_gj_per_t: citedValueSchema.optional(),
  carbon_content_kg_c_per_gj: citedValueSchema.optional(),
  co2_t_per_t: citedValueSchema,
});

const benchmarkSchema = z
  .object({
    id: z.string().min(1),
    label: z.string().min(1),
    /** product-benchmark: a regulatory figure; reference: a literature figure shown for context. */
    kind: z.enum(["product-benchmark", "reference"]),
    value: decimalString,
    unit: z.string().min(1),
    applies_from: isoDate.nullable(),
    applies_to: isoDate.nullable(),
    ...citation,
  })
  .refine(checkedWhenConfirmed, checkedMessage);

const deductionRuleSchema = z
  .object({ deducted: z.boolean(), ...citation })
  .refine(checkedWhenConfirmed, checkedMessage);

const tierSchema = z.object({ tier: z.number().int().min(1).max(4), max_uncertainty_pct: decimalString, ...citation })
  .refine(checkedWhenConfirmed, checkedMessage);

export const factorSetSchema = z
  .object({
    id: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, "lowercase letters, digits and hyphens"),
    version: z.string().min(1),
    name: z.string().min(1),
    description: z.string().optional(),
    effective: z.object({ from: isoDate, to: isoDate.nullable() }),
    stoichiometric_factor: ratioSchema,
    fuels: z.record(z.string(), fuelFactorsSchema),
    /** Analysis id → fuel key, for site-specific fuels; otherwise feed/fuel gas use "natural-gas". */
    fuel_by_analysis: z.record(z.string(), z.string()).optional(),
    default_per_tonne: z.array(perTonneRowSchema),
    default_row: z.string().optional(),
    benchmarks: z.array(benchmarkSchema),
    gwp_default: z.enum(["AR4", "AR5", "AR6"]),
    deduction_rules: z.object({
      urea: deductionRuleSchema, storage: deductionRuleSchema, sale: deductionRuleSchema, other: deductionRuleSchema,
      /** CO2 bound in precipitated calcium carbonate; a set without a rule treats it as "other". */
      pcc: deductionRuleSchema.optional(),
    }),
    activity_tiers: z.array(tierSchema).optional(),
    /**
     * Feedstock CO2 from its standard volume, as 40 CFR 98.73(b)(1) Eq G-1 writes it:
     * 44/12 × Fdstk (scf at the standard conditions) × CC × MW / MVC × 0.001. When present, a
     * feed-gas stream with an analysis is computed so (its volume restated to those conditions);
     * otherwise from its carbon in kmol (the same product with the real-gas molar volume).
     */
    /** The GWP set the rule itself applies in each reporting year (40 CFR 98 Table A-1's history); a month stated with another is flagged. */
    gwp_by_reporting_year: z.array(z.object({
      from_year: z.string().regex(/^\d{4}$/), to_year: z.string().regex(/^\d{4}$/).nullable(), gwp: z.enum(["AR4", "AR5", "AR6"]), ...citation,
    }).refine(checkedWhenConfirmed, checkedMessage)).optional(),
    feedstock_volume_equation: z.object({
      equation: z.string().min(1),
      mvc_scf_per_kmol: citedValueSchema,
      standard_temperature_f: decimalString,
      standard_pressure_psia: decimalString,
      standard_source: z.string().min(1),
    }).optional(),
    /**
     * Default expanded (95 %) relative uncertainty, in %, of a month's gas analysis where the
     * analysis states none: of its carbon content and of its calorific value.
     */
    analysis_uncertainty: z.object({ carbon: citedValueSchema, calorific: citedValueSchema }).optional(),
    grid_electricity: citedValueSchema.optional(),
    steam: citedValueSchema.optional(),
  })
  .superRefine((set, ctx) => {
    if (!set.fuels["natural-gas"]) {
      ctx.addIssue({ code: "custom", path: ["fuels", "natural-gas"], message: "a natural-gas entry is required" });
    }
    for (const [key, fuel] of Object.entries(set.fuels)) {
      if (fuel.co2 === null && !fuel.co2_from_analysis) {
        ctx.addIssue({ code: "custom", path: ["fuels", key, "co2"], message: "co2 may be null only when co2_from_analysis is true" });
      }
    }
    for (const [analysis, fuelKey] of Object.entries(set.fuel_by_analysis ?? {})) {
      if (!set.fuels[fuelKey]) {
        ctx.addIssue({ code: "custom", path: ["fuel_by_analysis", analysis], message: `no fuel "${fuelKey}" in fuels` });
      }
    }
    if (set.default_row !== undefined && !set.default_per_tonne.some((r) => r.id === set.default_row)) {
      ctx.addIssue({ code: "custom", path: ["default_row"], message: `no row "${set.default_row}" in default_per_tonne` });
    }
    if (set.effective.to !== null && set.effective.to < set.effective.from) {
      ctx.addIssue({ code: "custom", path: ["effective", "to"], message: "ends before it starts" });
    }
  });

export type FactorSet = z.infer<typeof factorSetSchema>;
export type FuelFactors = z.infer<typeof fuelFactorsSchema>;
export type CitedValue = z.infer<typeof citedValueSchema>;
export type ActivityBasis = z.infer<typeof activityBasisSchema>;
export type Benchmark = FactorSet["benchmarks"][number];
export type PerTonneRow = FactorSet["default_per_tonne"][number];

export interface FactorSetIssue { path: string; message: string }

/** Render a zod issue path as a JSON path ($.fuels["natural-gas"].co2.value). */
export function jsonPath(path: readonly PropertyKey[]): string {
  let out = "$";
  for (const p of path) {
    if (typeof p === "number") out += `[${p}]`;
    else if (typeof p === "string" && /^[A-Za-z_][A-Za-z0-9_]*$/.test(p)) out += `.${p}`;
    else out += `[${JSON.stringify(String(p))}]`;
  }
  return out;
}

export function parseFactorSet(json: unknown): { ok: true; set: FactorSet } | { ok: false; issues: FactorSetIssue[] } {
  const r = factorSetSchema.safeParse(json);
  if (r.success) return { ok: true, set: r.data };
  return { ok: false, issues: r.error.issues.map((i) => ({ path: jsonPath(i.path), message: i.message })) };
}
