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

export interface StatementHeader {
  organisation: string;
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

export interface MethodSection {
  method: string;
  factorSet: string;
  gwpSet: string;
  /** Each factor or rule with where it comes from (standard and table). */
  sources: { item: string; value: Qty; source: string }[];
  notes: string[];
}

export interface InputRow {
  stream: string;
  kind: string;
  quantity: Qty;
  /** "meter FT-101 (calibrated 2025-11-04)", "invoice", "estimate: …". */
  dataSource: string;
  uncertainty: string;
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
  /** Where a reader can check a copy, e.g. "https://ledger.example/verify". */
  verifyAt: string;
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
  method: MethodSection;
  inputs: InputRow[];
  balances: BalanceRow[];
  /** Reconciliation outcome lines, e.g. "Global test: χ² = 3.1 < 7.8, passed". */
  reconciliation: string[];
  emissionsBySource: EmissionSourceRow[];
  /** Unit of the by-source table's columns, e.g. "t". */
  emissionsUnit: string;
  emissionsByGas: GasRow[];
  co2: { gross: Qty; deducted: Qty; net: Qty; deductionNote: string };
  intensities: IntensityRow[];
  uncertainty: UncertaintyRow[];
  flags: FlagRow[];
  revisions: RevisionRow[];
  cautions: string[];
  /** Null in the preview of a month not yet sent for review. */
  evidence: EvidenceFacts | null;
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
  signOff: SignOff;
}

/** The product's standing cautions (BRIEF.md), printed on every statement. */
export const STATEMENT_CAUTIONS: readonly string[] = [
  "The figures in this statement are only as good as the meters and analyses behind them.",
  "Check them against the regulations that apply to the site, and have them verified where those rules require an accredited verifier.",
  "This statement does not replace licensed engineering judgement or local codes.",
  "Ammonia, hydrogen and high-pressure synthesis are hazardous. Synledger computes balances and reports; it never gives operating instructions.",
];
