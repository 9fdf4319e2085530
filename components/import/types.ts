import type { ImportMappingInput } from "@/lib/import/mapping";

/** What the page hands the wizard about the site: no database rows, only what the forms need. */
export interface WizardStream {
  key: string;
  name: string;
  kind: string;
  unit: string;
  meterTag: string | null;
  analysisKey: string | null;
  units: readonly string[];
}

export interface SavedMapping {
  name: string;
  mapping: ImportMappingInput;
}

export interface FileSample {
  file: File;
  delimiter: string;
  headers: string[];
  rows: string[][];
}
