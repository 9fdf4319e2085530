/**
 * Pieces of the statement display models shared by the monthly and annual builders and the
 * review screen: method and sources, intensities against benchmarks, uncertainty, flags.
 * Input is the engine's result document (decimal strings); output is display strings with units.
 */
import { Decimal } from "decimal.js";
import type { ResultDocument } from "@/lib/balance/result";
import { DASH, compare, exact, fixed, percentOver, times, utcStamp } from "./format";
import type { FlagRow, IntensityRow, Mark, MethodSection, Provenance, RevisionRow, UncertaintyRow, UnconfirmedRow } from "./model";

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

const PROVENANCE_TEXT: Record<Provenance, string> = {
  confirmed: "confirmed",
  unconfirmed: "unconfirmed",
  site: "site's own figure",
};

/** A cited value's provenance; records frozen before provenance was kept say neither, and count as unconfirmed. */
export function provenanceOf(v: { status?: string }): Provenance {
  return v.status === "confirmed" || v.status === "site" ? v.status : "unconfirmed";
}

type Sources = ResultDocument["method"]["sources"];

/** The calorific basis in words; older records carry none and were computed on NCV. */
export function energyBasisOf(doc: ResultDocument): "NCV" | "GCV" {
  return (doc.method as { energy_basis?: "NCV" | "GCV" }).energy_basis === "GCV" ? "GCV" : "NCV";
}
export const ENERGY_BASIS_TEXT = {
  NCV: "net calorific value (NCV, lower heating value)",
  GCV: "gross calorific value (GCV, higher heating value)",
} as const;

/** Stream ids in a source's label become the stream's name ("power: …" → "Imported electricity: …"). */
function sourceItem(s: Sources[number], streamName: (id: string) => string): string {
  const stream = (s as { stream?: string }).stream;
  return stream ? `${streamName(stream)}: ${s.label}` : s.label;
}

export function methodSection(doc: ResultDocument, streamName: (id: string) => string = (id) => id): MethodSection {
  const m = doc.method;
  const fs = m.factor_set;
  const notes: string[] = [];
  if (m.screening_estimate) notes.push("This is a screening estimate from default factors, not a measurement-based figure.");
  const unconfirmed = unconfirmedRows(doc, streamName);
  if (unconfirmed.length)
    notes.push(
      `${unconfirmed.length} cited ${unconfirmed.length === 1 ? "value has" : "values have"} not yet been read in the published text of ${unconfirmed.length === 1 ? "its" : "their"} source and ${unconfirmed.length === 1 ? "is" : "are"} marked unconfirmed; the signatory acknowledged each before signing.`,
    );
  const restated = (doc.emissions_by_stream ?? []).filter((r) => r.basis.includes("Eq G-1") && r.basis.includes("restated to"));
  if (restated.length)
    notes.push(
      `Feedstock volumes were restated to 68 °F and 14.7 psia for 40 CFR 98.73(b)(1) Eq G-1 (MVC 849.5 scf per kg-mole): ${restated.map((r) => streamName(r.id)).join(", ")}; the volumes entered are at their own metering reference.`,
    );
  const gwpStatus = provenanceOf(m.gwp);
  return {
    method: METHOD_LABELS[m.emissions] ?? m.emissions,
    factorSet: `${fs.name}, version ${fs.version}${fs.built_in ? " (built into Synledger)" : " (the organisation's own set)"}`,
    gwpSet: `${m.gwp.id}, 100-year: CH4 ${m.gwp.ch4}, N2O ${m.gwp.n2o} (${m.gwp.source}; ${PROVENANCE_TEXT[gwpStatus]})`,
    gwpShort: `${m.gwp.id} (100-year): CH4 ${m.gwp.ch4}, N2O ${m.gwp.n2o}; ${PROVENANCE_TEXT[gwpStatus]}`,
    energyBasis: ENERGY_BASIS_TEXT[energyBasisOf(doc)],
    sources: m.sources.map((s) => {
      const status = provenanceOf(s);
      return { item: sourceItem(s, streamName), value: { value: s.value ?? DASH, unit: s.unit ?? "" }, source: s.source, status, statusText: PROVENANCE_TEXT[status] };
    }),
    notes,
  };
}

/** Every cited value of the month not confirmed in its published source, benchmarks included. */
export function unconfirmedRows(doc: ResultDocument, streamName: (id: string) => string = (id) => id): UnconfirmedRow[] {
  const rows: UnconfirmedRow[] = doc.method.sources
    .filter((s) => provenanceOf(s) === "unconfirmed")
    .map((s) => ({ key: s.key, item: sourceItem(s, streamName), value: s.value ? `${s.value}${s.unit ? ` ${s.unit}` : ""}` : DASH, source: s.source }));
  for (const b of doc.benchmarks) {
    if (provenanceOf(b) === "unconfirmed") rows.push({ key: `benchmark.${b.id}`, item: b.label, value: `${b.value ?? DASH} ${b.unit}`, source: b.source });
  }
  return rows;
}

const MEASURE_LABELS: Record<string, { label: string; unit: string }> = {
  co2_t_per_t_nh3: { label: "Direct CO2 per tonne NH3", unit: "t CO2/t NH3" },
  co2e_t_per_t_nh3: { label: "Direct CO2e per tonne NH3", unit: "t CO2e/t NH3" },
  net_co2e_t_per_t_nh3: { label: "Net CO2e per tonne NH3 (after deductions)", unit: "t CO2e/t NH3" },
  co2e_incl_indirect_t_per_t_nh3: { label: "CO2e per tonne NH3 with imported electricity and steam", unit: "t CO2e/t NH3" },
};

/** 1 GJ in MMBtu: 1 / 1.05505585262 (International Table Btu, 1055.05585262 J exactly). */
const GJ_TO_MMBTU = "0.947817120313317";

/**
 * Every intensity the engine gives; each benchmark the factor set names becomes its own row, and
 * a set without benchmarks says so. Energy follows the set's calorific basis; US sites also see MMBtu.
 */
export function intensityRows(doc: ResultDocument, opts: { usUnits?: boolean } = {}): IntensityRow[] {
  const rows: IntensityRow[] = [];
  const intensity = doc.intensity as Record<string, string | boolean | null>;
  const noBenchmark = doc.benchmarks.length === 0 ? "the factor set has no benchmark for this period" : "no benchmark for this measure in the factor set";
  for (const [key, meta] of Object.entries(MEASURE_LABELS)) {
    const v = intensity[key];
    const value = typeof v === "string" ? v : null;
    const marks = doc.benchmarks.filter((b) => b.compared_with === key);
    if (marks.length === 0) {
      rows.push({ measure: meta.label, value: { value: fixed(value, 3), unit: meta.unit }, benchmark: { value: DASH, unit: meta.unit }, benchmarkSource: noBenchmark, mark: "info", position: "For information" });
      continue;
    }
    for (const b of marks) {
      const above = value !== null && b.value !== null && compare(value, b.value) > 0;
      const pct = value !== null && b.value !== null ? percentOver(value, b.value) : DASH;
      rows.push({
        measure: `${meta.label}, against ${b.label}`,
        value: { value: fixed(value, 3), unit: b.unit },
        benchmark: { value: fixed(b.value, 3), unit: b.unit },
        benchmarkSource: `${b.source}${provenanceOf(b) === "unconfirmed" ? " (unconfirmed)" : ""}`,
        mark: above ? "attention" : "ok",
        position: value === null ? "No value this period" : above ? `Above by ${pct} %` : `At or below, by ${pct} %`,
      });
    }
  }
  const basis = energyBasisOf(doc);
  const gj = (basis === "GCV" ? intensity.gj_hhv_per_t_nh3 : intensity.gj_lhv_per_t_nh3) as string | null | undefined;
  const basisWord = basis === "GCV" ? "gross calorific value, HHV" : "net calorific value, LHV";
  const energyValue = opts.usUnits && typeof gj === "string" ? { value: fixed(times(gj, GJ_TO_MMBTU), 2), unit: `MMBtu ${basis === "GCV" ? "HHV" : "LHV"}/t NH3` } : { value: fixed(gj ?? null, 2), unit: `GJ ${basis}/t NH3` };
  rows.push({
    measure: `Energy (feed and fuel) per tonne NH3 (${basisWord})${opts.usUnits && typeof gj === "string" ? `; ${fixed(gj, 2)} GJ/t` : ""}`,
    value: energyValue,
    benchmark: { value: DASH, unit: energyValue.unit },
    benchmarkSource: noBenchmark,
    mark: "info",
    position: "For information",
  });
  return rows;
}

type UncertaintyJson = ResultDocument["uncertainty"]["co2"];

/**
 * One figure's uncertainty with its parts at 95 % (the parts add in quadrature to the total).
 * Documents frozen before the analysis part and the meter split existed print what they carry.
 */
export function uncertaintyRow(figure: string, u: UncertaintyJson, streamName: (id: string) => string = (id) => id, unit = "t CO2"): UncertaintyRow {
  const k = new Decimal(u.coverage_factor ?? "1.96");
  const at95 = (std: string | null | undefined) => (std === null || std === undefined ? null : fixed(new Decimal(std).times(k).toString(), 1));
  const p = u as Partial<UncertaintyJson>;
  const meters = u.meter_components.map((c) => streamName(c.key)).join(", ") || "none";
  const factors = u.factor_components.map((c) => c.key).join(", ");
  const analyses = (p.analysis_components ?? []).map((c) => c.key).join(", ");
  const missing = u.meters_without_uncertainty.length ? `; no stated uncertainty: ${u.meters_without_uncertainty.map(streamName).join(", ")}` : "";
  const split = p.meter_systematic_u_std_t !== undefined ? ` (repeating ± ${at95(p.meter_systematic_u_std_t)} t, random ± ${at95(p.meter_random_u_std_t)} t)` : "";
  const parts = [
    `meters ± ${at95(u.meter_u_std_t)} t${split}: ${meters}`,
    ...(p.analysis_u_std_t !== undefined ? [`gas analyses ± ${at95(p.analysis_u_std_t)} t${analyses ? `: ${analyses}` : ""}`] : []),
    `factors ± ${at95(u.factor_u_std_t)} t${factors ? `: ${factors}` : ""}`,
  ];
  return {
    figure,
    value: { value: fixed(u.value_t, 1), unit },
    expanded: `± ${fixed(u.u95_pct, 2)} % (± ${fixed(u.u95_t, 1)} t)`,
    note: `${u.confidence_pct} % confidence, k = ${u.coverage_factor}; parts at 95 %, adding in quadrature: ${parts.join("; ")}${missing}`,
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

export function flagRows(flags: ResultDocument["flags"], balanceNote: WrittenNote | null, notes: FlagNotes = new Map(), streamName: (id: string) => string = (id) => id): FlagRow[] {
  return flags.map((f) => {
    const own = notes.get(`${f.code}|${f.stream ?? ""}`);
    const answered = !own && balanceNote && /closure-out-of-tolerance$/.test(f.code);
    return {
      mark: SEVERITY_MARK[f.severity] ?? "info",
      code: f.code,
      stream: f.stream ?? "",
      // Engine messages name a stream by its id; the statement names it.
      message: !f.stream ? f.message : f.message.includes(`(stream ${f.stream})`) ? f.message.split(`(stream ${f.stream})`).join(`(${streamName(f.stream)})`) : `${f.message} (${streamName(f.stream)})`,
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
