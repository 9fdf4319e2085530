/**
 * What a statement PDF shows, already formatted. The templates only lay these strings out:
 * every number arrives rounded and as text, from the same engine results the screens use, so
 * the PDF cannot disagree with the app. A quantity always travels with its unit.
 */

/** A figure as printed: "12 345.6" with "t CO2e". `value` may be "—" when not applicable. */
export interface Qty {
  value: string;
  unit: string;
}

/** Status is text plus a drawn mark, never colour alone. */
export type Mark = "ok" | "attention" | "fail" | "info";

/** The installation a statement is issued for, as entered in site settings and frozen with the revision. */
export interface InstallationFacts {
  operator: string;
  identifiers: { scheme: string; identifier: string }[];
  address: string;
  competentAuthority: string;
  /** "MP-EW-2021-03, version 4". */
  monitoringPlan: string;
  /** "Name, e-mail, telephone". */
  contact: string;
}

export interface StatementHeader {
  organisation: string;
  /** Null when the record was frozen before installation identities were kept. */
  installation: InstallationFacts | null;
  siteName: string;
  siteCode: string;
  /** "2026-03" or "2026". */
  period: string;
  /** "March 2026" or "Calendar year 2026". */
  periodLabel: string;
  revision: string;
  /** The statement id printed on every page and named in the signature. */
  statementRef: string;
  /** e.g. "15 °C, 101.325 kPa (Sm³)". */
  meteringReference: string;
  preparedBy: string;
  preparedAt: string;
}

/** Whether a cited value was read in its published source, or is the site's own figure. */
export type Provenance = "confirmed" | "unconfirmed" | "site";

export interface SourceRow {
  item: string;
  value: Qty;
  /** Document and table or article. */
  source: string;
  status: Provenance;
  /** "confirmed", "unconfirmed", "site's own figure". */
  statusText: string;
}

export interface MethodSection {
  method: string;
  factorSet: string;
  gwpSet: string;
  /** The GWP set without its source, for page 1: "AR5 (100-year): CH4 28, N2O 265; unconfirmed". */
  gwpShort: string;
  /** "net calorific value (NCV, lower heating value)" or "gross calorific value (GCV, higher heating value)". */
  energyBasis: string;
  /** Every factor or rule the figures rest on, with where it comes from and whether that was confirmed. */
  sources: SourceRow[];
  notes: string[];
}

/** A cited value not yet read in its published source: listed, and acknowledged by the signatory. */
export interface UnconfirmedRow {
  key: string;
  item: string;
  value: string;
  source: string;
}

/** Page 1: what the signatory answers for, in one place. */
export interface SummaryFacts {
  co2e: { gross: Qty; deducted: Qty; net: Qty };
  /** "± 1.84 % (± 1 317.2 t)", expanded at 95 %. */
  uncertainty: string;
  uncertaintyNote: string;
  gases: GasRow[];
  ammonia: Qty;
  closures: { element: string; closure: Qty; tolerance: Qty; mark: Mark; status: string }[];
  /** Warnings and errors of the period, with their written explanations. */
  openFlags: FlagRow[];
}

export interface GasAnalysisRow {
  analysis: string;
  /** Streams the analysis gives the composition of. */
  usedBy: string;
  sampledOn: string;
  laboratory: string;
  /** "CH4 92.40, C2H6 4.10, … mol %". */
  composition: string;
  molarMass: Qty;
  gcv: Qty;
  ncv: Qty;
  carbon: Qty;
}

export interface TransferRow {
  stream: string;
  destination: string;
  co2: Qty;
  treatment: string;
  rule: string;
}

/** Codes and identifiers kept out of the body text: for machines and for cross-reference. */
export interface AppendixRow {
  item: string;
  value: string;
}

export interface InputRow {
  stream: string;
  kind: string;
  quantity: Qty;
  /** "meter FT-101", "invoice", "estimate: …". */
  dataSource: string;
  uncertainty: string;
  /** "tier 3 (EU MRR thresholds)", "below tier 1", "—". */
  tier: string;
  /** "2025-11-04 (due 2026-11-04)", "2025-01-30, OVERDUE since 2026-01-30", "—". */
  calibration: string;
  overdue: boolean;
}

export interface BalanceRow {
  element: string;
  inflow: Qty;
  outflow: Qty;
  closure: Qty;
  tolerance: Qty;
  mark: Mark;
  status: string;
}

export interface EmissionSourceRow {
  source: string;
  basis: string;
  co2: string;
  ch4: string;
  n2o: string;
  co2e: string;
}

export interface GasRow {
  gas: string;
  mass: Qty;
  gwp: string;
  co2e: Qty;
}

export interface IntensityRow {
  measure: string;
  value: Qty;
  benchmark: Qty;
  benchmarkSource: string;
  mark: Mark;
  position: string;
}

export interface UncertaintyRow {
  figure: string;
  value: Qty;
  /** "± 2.1 % (95 % confidence)". */
  expanded: string;
  note: string;
}

export interface FlagRow {
  mark: Mark;
  code: string;
  /** The stream the flag is about, "" when month-wide. */
  stream: string;
  message: string;
  /** The engineer's or officer's written explanation; "" shows "no explanation recorded". */
  explanation: string;
  explainedBy: string;
}

export interface RevisionRow {
  revision: string;
  signedAt: string;
  signer: string;
  reason: string;
}

export interface SignOff {
  signer: string;
  role: string;
  date: string;
  revision: string;
  certificateSubject: string;
  certificateFingerprint: string;
  /** Where a reader can check a copy: the public page of this statement, APP_URL/verify/REF. */
  verifyAt: string;
  /** The signatory's declaration, in our own words, printed above the signature. */
  declaration: string[];
}

/** The frozen record a statement was rendered from, and the files it carries. */
export interface EvidenceFacts {
  documentSha256: string;
  resultSha256: string;
  engineVersion: string;
  frozenAt: string;
  /** Names of the files embedded in the PDF, with what each is. */
  files: { name: string; what: string }[];
}

export interface MonthlyStatementModel {
  header: StatementHeader;
  summary: SummaryFacts;
  method: MethodSection;
  unconfirmed: UnconfirmedRow[];
  inputs: InputRow[];
  gasAnalyses: GasAnalysisRow[];
  /** Reference conditions of the volumetric calorific values, e.g. "15 °C, 101.325 kPa (ISO 6976)". */
  analysesBasis: string;
  balances: BalanceRow[];
  /** Reconciliation outcome lines, e.g. "Global test: χ² = 3.1 < 7.8, passed". */
  reconciliation: string[];
  emissionsBySource: EmissionSourceRow[];
  /** Unit of the by-source table's columns, e.g. "t". */
  emissionsUnit: string;
  emissionsByGas: GasRow[];
  co2: { gross: Qty; deducted: Qty; net: Qty; deductionNote: string };
  transfers: TransferRow[];
  intensities: IntensityRow[];
  uncertainty: UncertaintyRow[];
  flags: FlagRow[];
  revisions: RevisionRow[];
  cautions: string[];
  /** Null in the preview of a month not yet sent for review. */
  evidence: EvidenceFacts | null;
  appendix: AppendixRow[];
  signOff: SignOff;
}

export interface AnnualMonthRow {
  month: string;
  revision: string;
  ammonia: string;
  grossCo2: string;
  deducted: string;
  netCo2: string;
  co2e: string;
  intensity: string;
  status: string;
}

/** A monthly statement the annual statement is built from. */
export interface AnnualSourceRow {
  month: string;
  revision: string;
  statementRef: string;
  /** SHA-256 of the month's frozen result document. */
  resultSha256: string;
}

export interface AnnualStatementModel {
  header: StatementHeader;
  /** The signed monthly statements (and their frozen records) the year adds up. */
  sources: AnnualSourceRow[];
  method: MethodSection;
  /** Units of the twelve-month table's columns, printed in its header. */
  units: { ammonia: string; co2: string; co2e: string; intensity: string };
  months: AnnualMonthRow[];
  totals: Omit<AnnualMonthRow, "month" | "revision" | "status">;
  emissionsByGas: GasRow[];
  intensities: IntensityRow[];
  uncertainty: UncertaintyRow[];
  flags: FlagRow[];
  revisions: RevisionRow[];
  cautions: string[];
  /** How many cited values the signatory acknowledged as unconfirmed. */
  unconfirmedCount: number;
  signOff: SignOff;
  /** EU trading-system monitoring check and CBAM embedded emissions of the year (issue 14); absent on statements signed before. */
  euEts?: EuEtsSection | null;
}

export interface EuEtsSection {
  facts: [string, string][];
  streams: { id: string; cls: string; co2e: string; share: string; uncertainty: string; tier: string; factors: string }[];
  shortfalls: string[];
  cbam: [string, string][];
  notes: string[];
  /** The annual emissions report content per source stream, and the transfers. */
  report?: { streams: { id: string; activity: string; ncv: string; ef: string; oxidation: string; tiers: string; co2e: string }[]; transfers: string[]; gaps: string[] };
}

/** The product's standing cautions (BRIEF.md), printed on every statement. */
export const STATEMENT_CAUTIONS: readonly string[] = [
  "The figures in this statement are only as good as the meters and analyses behind them.",
  "Check them against the regulations that apply to the site, and have them verified where those rules require an accredited verifier.",
  "This statement does not replace licensed engineering judgement or local codes.",
  "Ammonia, hydrogen and high-pressure synthesis are hazardous. Synledger computes balances and reports; it never gives operating instructions.",
];
