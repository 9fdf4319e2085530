import type { FactorSet } from "../factor-set-schema";

/**
 * Default uncertainty of a month's gas analysis where the analysis states none, shared by the
 * built-in sets. Unconfirmed: no regulation or standard we could read gives one figure for it;
 * these are our conservative reading of common practice for a laboratory gas chromatograph
 * analysis of pipeline gas (composition to ISO 6974, properties by ISO 6976), common practice,
 * no source. A site that has its laboratory's figure enters it with the analysis.
 */
export const ANALYSIS_DEFAULT_UNCERTAINTY: NonNullable<FactorSet["analysis_uncertainty"]> = {
  carbon: { value: "1.0", unit: "% (95 %)", status: "unconfirmed",
    source: "Synledger default for the carbon content of a laboratory gas analysis (common practice, no source)" },
  calorific: { value: "0.5", unit: "% (95 %)", status: "unconfirmed",
    source: "Synledger default for the calorific value of a laboratory gas analysis (common practice, no source)" },
};
