import type { StreamKind } from "@/lib/balance/types";

/** What the validator needs to know of the site: its streams, by key and meter tag. */
export interface ImportStream {
  key: string;
  name: string;
  kind: StreamKind;
  unit: string;
  meterTag: string | null;
  analysisKey: string | null;
  archived: boolean;
}

export interface ImportSite {
  name: string;
  streams: ImportStream[];
}

/** One problem, named as the engineer will find it in the file: row as a spreadsheet numbers it, column by its header. */
export interface ImportIssue {
  row: number;
  column: string | null;
  reason: string;
}

/** Not an error, but worth a look before committing (e.g. a month with days missing). */
export interface ImportWarning {
  month: string;
  subject: string;
  message: string;
}

export interface MonthReading {
  stream: string;
  /** The month's total as a plain decimal string: the exact sum of the file's values. */
  quantity: string;
  unit: string;
  /** How many values (days) were summed. */
  values: number;
  firstRow: number;
}

export interface MonthAnalysis {
  key: string;
  components: Record<string, string>;
  sampledOn: string | null;
  row: number;
}

export interface MonthPlan {
  month: string;
  readings: MonthReading[];
  analyses: MonthAnalysis[];
  /** Daily files: the latest day with a value (what the month's figures cover); null for monthly files. */
  lastDay: string | null;
}

export interface ValidationResult {
  issues: ImportIssue[];
  warnings: ImportWarning[];
  months: MonthPlan[];
  rowCount: number;
  valueCount: number;
}
