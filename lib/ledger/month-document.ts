/**
 * Builds the plant-month file (format synledger.plant-month/1) from what the database holds for
 * one site-month. Pure: rows in, JSON out, so the engine, the API export, the PDF and the tests
 * all see exactly the same document.
 */
import { PLANT_MONTH_FORMAT } from "@/lib/balance/schema";

export interface StreamRow {
  id: string;
  key: string;
  kind: string;
  unit: string;
  analysisKey: string | null;
  destination: string | null;
  fate: string | null;
  uncertaintyPct: string | null;
  /** Share of the meter's uncertainty repeating every month until recalibration, %; null: all of it. */
  systematicPct?: string | null;
  /** Last calibration (YYYY-MM-DD): the document carries it so the year knows the calibration periods. */
  calibratedOn?: string | null;
  /** False: no meter measures the flow; the document says so and the balances solve for it. */
  metered?: boolean;
  /** An archived stream no meter measures no longer joins new months. */
  archivedAt?: Date | null;
  indirectFactor: string | null;
  meterTag: string | null;
  sortOrder: number;
}

export interface ReadingRow {
  streamId: string;
  quantity: string;
  unit: string;
  note: string | null;
}

export interface AnalysisRow {
  key: string;
  components: Record<string, string>;
  carbonUncertaintyPct?: string | null;
  cvUncertaintyPct?: string | null;
  note: string | null;
}

export interface MonthDocumentInput {
  siteName: string;
  period: string;
  method: { emissions: string; factor_set: string; gwp: string };
  streams: StreamRow[];
  readings: ReadingRow[];
  analyses: AnalysisRow[];
}

/**
 * JSON value of the plant-month file, numbers as strings. Streams without a reading are left out,
 * except a stream no meter measures: it is always there (`"metered": false`), with an entered
 * figure as its estimate when there is one.
 */
export function monthDocument(input: MonthDocumentInput): Record<string, unknown> {
  const byStream = new Map(input.readings.map((r) => [r.streamId, r]));
  const streams = [...input.streams]
    .sort((a, b) => a.sortOrder - b.sortOrder || a.key.localeCompare(b.key))
    .flatMap((s) => {
      const r = byStream.get(s.id);
      const unmetered = s.metered === false;
      if (!r && (!unmetered || s.archivedAt)) return [];
      const out: Record<string, unknown> = { id: s.key, kind: s.kind };
      if (s.analysisKey) out.analysis = s.analysisKey;
      if (s.fate) out.fate = s.fate;
      if (s.destination) out.destination = s.destination;
      if (r) out.quantity = r.quantity;
      out.unit = r?.unit ?? s.unit;
      if (unmetered) out.metered = false;
      else {
        if (s.uncertaintyPct !== null) out.uncertainty_pct = s.uncertaintyPct;
        if (s.uncertaintyPct !== null && s.systematicPct) out.systematic_pct = s.systematicPct;
        // Only a calibration on or before the month's last day belongs to the month.
        if (s.calibratedOn && s.calibratedOn <= `${input.period}-31`) out.calibrated_on = s.calibratedOn;
      }
      if (s.indirectFactor !== null && s.kind === "electricity-import") out.factor_t_per_MWh = s.indirectFactor;
      if (s.indirectFactor !== null && (s.kind === "steam-import" || s.kind === "steam-export")) out.factor_t_per_GJ = s.indirectFactor;
      if (s.meterTag && !unmetered) out.meter = s.meterTag;
      if (r?.note) out.note = r.note;
      return [out];
    });
  const analyses = Object.fromEntries(
    input.analyses.map((a) => [
      a.key,
      {
        components: a.components,
        ...(a.carbonUncertaintyPct ? { carbon_uncertainty_pct: a.carbonUncertaintyPct } : {}),
        ...(a.cvUncertaintyPct ? { cv_uncertainty_pct: a.cvUncertaintyPct } : {}),
        ...(a.note ? { note: a.note } : {}),
      },
    ]),
  );
  return {
    format: PLANT_MONTH_FORMAT,
    site: input.siteName,
    month: input.period,
    analyses,
    streams,
    method: input.method,
  };
}
