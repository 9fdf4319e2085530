// Public surface of lib/emissions. Relative imports only: this module runs under tsx and in the browser.
export type { StreamKind, StreamFigures, EmissionsInput, AnalysisFigures, EmissionsMethod, GwpId, Destination, Flag } from "./types";
export { D, dec, K95 } from "./decimal";
export { computeEmissions, EmissionsInputError } from "./compute";
export { citationsFor, type Citation } from "./citations";
export type { EmissionsResult, GasTotal } from "./result";
export type { StreamEmission, BalanceCheck } from "./model";
export type { IntensityFigures, BenchmarkComparison, TheoreticalMinimum } from "./intensity";
export type { TransferRow, TransferSummary } from "./transfers";
export { propagate, assessTiers, type UncertaintyFigures, type UncertaintyComponent, type MeterTier } from "./uncertainty";
export { toEmissionsDocument, decimalString, EMISSIONS_DOCUMENT_FORMAT } from "./document";
export { rollUpYear, type YearMonthEntry, type YearResult } from "./year";
export { GWP_SETS, gwpSet, type GwpSet } from "./gwp";
export { factorSetSchema, parseFactorSet, jsonPath, type FactorSet, type FuelFactors, type CitedValue, type FactorSetIssue } from "./factor-set-schema";
export { FactorSetRegistry, FactorSetError, BUILT_IN_FACTOR_SETS, defaultRegistry } from "./registry";
export { IPCC_2006 } from "./factor-sets/ipcc-2006";
export { US_40CFR98, US_MOLAR_VOLUME_SCF_PER_KMOL } from "./factor-sets/us-40cfr98";
export { EU_MRR } from "./factor-sets/eu-mrr";
export { eqG1FeedstockCo2T } from "./eq-g1";
