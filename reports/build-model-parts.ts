/**
 * Pieces of the statement display models shared by the monthly and annual builders and the
 * review screen: method and sources, intensities against benchmarks, uncertainty, flags.
 * Input is the engine's result document (decimal strings); output is display strings with units.
 */
import type { ResultDocument } from "@/lib/balance/result";
import { DASH, compare, exact, fixed, percentOver, utcStamp } from "./format";
import type { FlagRow, IntensityRow, Mark, MethodSection, RevisionRow, UncertaintyRow } from "./model";

export const METHOD_LABELS: Record<string, string> = {
  "carbon-mass-balance": "Carbon mass balance (feed and fuel carbon in; exported, vented and emitted carbon out)",
  "fuel-calculation": "Fuel-by-fuel calculation (activity × emission factor × oxidation factor)",
  measured: "Measured emissions (continuous stack monitoring)",
  "default-factor": "Default-factor screening estimate",
};

export const KIND_LABELS: Record<string, string> = {
  "feed-gas": "feed gas",
  "fuel-gas": "fuel gas",
  "purge-gas": "purge gas",
  "process-air": "process air",
  ammonia: "ammonia",
  "co2-export": "CO2 export",
  "co2-vent": "CO2 vent",
  "stack-co2": "stack CO2",
  "electricity-import": "electricity import",
  "steam-import": "steam import",
  "steam-export": "steam export",
};

const FROM_MEMORY = " (from memory: check against the source)";

export function methodSection(doc: ResultDocument): MethodSection {
  const m = doc.method;
  const fs = m.factor_set;
  const notes: string[] = [];
  if (m.screening_estimate) notes.push("This is a screening estimate from default factors, not a measurement-based figure.");
  if (m.any_from_memory)
    notes.push("Values marked “from memory” were written down from the cited source without the text at hand; check them before relying on the statement.");
  return {
    method: METHOD_LABELS[m.emissions] ?? m.emissions,
    factorSet: `${fs.name} (set ${fs.id}, version ${fs.version}${fs.built_in ? ", built in" : ""})`,
    gwpSet: `${m.gwp.id}, 100-year: CH4 ${m.gwp.ch4}, N2O ${m.gwp.n2o} (${m.gwp.source}${m.gwp.from_memory ? FROM_MEMORY : ""})`,
    sources: m.sources.map((s) => ({
      item: s.label,
      value: { value: s.value ?? DASH, unit: s.unit ?? "" },
      source: `${s.source}${s.from_memory ? FROM_MEMORY : ""}`,
    })),
    notes,
  };
}

const MEASURE_LABELS: Record<string, { label: string; unit: string }> = {
  co2_t_per_t_nh3: { label: "Direct CO2 per tonne NH3", unit: "t CO2/t NH3" },
  co2e_t_per_t_nh3: { label: "Direct CO2e per tonne NH3", unit: "t CO2e/t NH3" },
  net_co2e_t_per_t_nh3: { label: "Net CO2e per tonne NH3 (after deductions)", unit: "t CO2e/t NH3" },
  co2e_incl_indirect_t_per_t_nh3: { label: "CO2e per tonne NH3 with imported electricity and steam", unit: "t CO2e/t NH3" },
  gj_lhv_per_t_nh3: { label: "Energy per tonne NH3 (net calorific value)", unit: "GJ/t NH3" },
};

/** Every intensity the engine gives; each benchmark the factor set names becomes its own row. */
export function intensityRows(doc: ResultDocument): IntensityRow[] {
  const rows: IntensityRow[] = [];
  const intensity = doc.intensity as Record<string, string | boolean | null>;
  for (const [key, meta] of Object.entries(MEASURE_LABELS)) {
    const v = intensity[key];
    const value = typeof v === "string" ? v : null;
    const places = key.startsWith("gj") ? 2 : 3;
    const marks = doc.benchmarks.filter((b) => b.compared_with === key);
    if (marks.length === 0) {
      rows.push({
        measure: meta.label,
        value: { value: fixed(value, places), unit: meta.unit },
        benchmark: { value: DASH, unit: meta.unit },
        benchmarkSource: "no benchmark in the factor set",
        mark: "info",
        position: "For information",
      });
      continue;
    }
    for (const b of marks) {
      const above = value !== null && b.value !== null && compare(value, b.value) > 0;
      const pct = value !== null && b.value !== null ? percentOver(value, b.value) : DASH;
      rows.push({
        measure: `${meta.label}, against ${b.label}`,
        value: { value: fixed(value, places), unit: b.unit },
        benchmark: { value: fixed(b.value, places), unit: b.unit },
        benchmarkSource: `${b.source}${b.from_memory ? " (from memory)" : ""}`,
        mark: above ? "attention" : "ok",
        position: value === null ? "No value this period" : above ? `Above by ${pct} %` : `At or below, by ${pct} %`,
      });
    }
  }
  return rows;
}

type UncertaintyJson = ResultDocument["uncertainty"]["co2"];

export function uncertaintyRow(figure: string, u: UncertaintyJson): UncertaintyRow {
  const meters = u.meter_components.map((c) => c.key).join(", ") || "none";
  const factors = u.factor_components.map((c) => c.key).join(", ");
  const missing = u.meters_without_uncertainty.length ? `; no stated uncertainty: ${u.meters_without_uncertainty.join(", ")}` : "";
  return {
    figure,
    value: { value: fixed(u.value_t, 1), unit: "t CO2" },
    expanded: `± ${fixed(u.u95_pct, 2)} % (± ${fixed(u.u95_t, 1)} t)`,
    note: `${u.confidence_pct} % confidence, k = ${u.coverage_factor}; meters: ${meters}${factors ? `; factors: ${factors}` : ""}${missing}`,
  };
}

const SEVERITY_MARK: Record<string, Mark> = { error: "fail", warning: "attention", info: "info" };

export interface WrittenNote {
  text: string;
  by: string;
}

/** Flags with the written explanation that answers them (the engineer's balance note answers closure flags). */
/** A flag's written explanation, by `code|stream` (stream "" for month-wide flags). */
export type FlagNotes = ReadonlyMap<string, { text: string; by: string }>;

export function flagRows(flags: ResultDocument["flags"], balanceNote: WrittenNote | null, notes: FlagNotes = new Map()): FlagRow[] {
  return flags.map((f) => {
    const own = notes.get(`${f.code}|${f.stream ?? ""}`);
    const answered = !own && balanceNote && /closure-out-of-tolerance$/.test(f.code);
    return {
      mark: SEVERITY_MARK[f.severity] ?? "info",
      code: f.code,
      stream: f.stream ?? "",
      message: f.stream ? `${f.message} (stream ${f.stream})` : f.message,
      explanation: own ? own.text : answered ? balanceNote.text : "",
      explainedBy: own ? own.by : answered ? balanceNote.by : "",
    };
  });
}

export interface RevisionFact {
  revision: number;
  signedAt: Date | null;
  signer: string | null;
  reason: string;
}

export function revisionRows(facts: RevisionFact[]): RevisionRow[] {
  return facts.map((r) => ({
    revision: String(r.revision),
    signedAt: r.signedAt ? utcStamp(r.signedAt) : "not signed",
    signer: r.signer ?? DASH,
    reason: r.reason,
  }));
}

export const meteringLabel = (ref: string) =>
  ref === "60F" ? "60 °F, 14.696 psia (scf)" : ref === "0C" ? "0 °C, 101.325 kPa (Nm3)" : "15 °C, 101.325 kPa (Sm3)";

export { exact };
