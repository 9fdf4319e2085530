/**
 * Engine result + site + month facts → MonthlyStatementModel. Pure: the signing service calls it
 * inside the signing transaction and the review page calls it for the screen, so what the
 * signatory reads before signing is, string for string, what the PDF prints.
 */
import type { ResultDocument } from "@/lib/balance/result";
import {
  KIND_LABELS,
  flagRows,
  type FlagNotes,
  intensityRows,
  meteringLabel,
  methodSection,
  revisionRows,
  uncertaintyRow,
  unconfirmedRows,
  type RevisionFact,
  type WrittenNote,
} from "./build-model-parts";
import { calibrationDueOn } from "@/lib/ledger/calibration";
import { lastDayOf } from "@/lib/period";
import type { InstallationIdentity } from "@/lib/validations/installation";
import { DASH, absWithin, btuPerLb, exact, fixed, minus, monthLabel, ratioPct, signed, small, times, utcStamp } from "./format";
import {
  STATEMENT_CAUTIONS,
  type AppendixRow,
  type BalanceRow,
  type EvidenceFacts,
  type FlagRow,
  type GasAnalysisRow,
  type InputRow,
  type InstallationFacts,
  type MonthlyStatementModel,
  type TransferRow,
} from "./model";

export interface StreamFacts {
  key: string;
  name: string;
  kind: string;
  meterTag: string | null;
  calibratedOn: string | null;
  /** How the month's figure was obtained: meter, estimate, invoice. */
  source: string | null;
  note: string | null;
  /** The meter's stated uncertainty, % (site configuration), when the engine's tiers do not list it. */
  uncertaintyPct?: string | null;
  /** The site's calibration interval for the meter, months (null: none set). */
  calibrationIntervalMonths?: number | null;
}

export interface MonthlyModelInput {
  organisation: string;
  site: {
    name: string;
    code: string;
    meteringReference: string;
    closureTolerancePct: string;
    /** As frozen with the revision; null or absent in records frozen before identities were kept. */
    installation?: InstallationIdentity | null;
  };
  period: string;
  revision: number;
  statementRef: string;
  result: ResultDocument;
  /** The plant-month document the result was computed from (compositions of the analyses). */
  document?: Record<string, unknown> | null;
  /** Sampling date and laboratory of each analysis, by key. */
  analyses?: { key: string; sampledOn: string | null; laboratory: string | null }[];
  streams: StreamFacts[];
  balanceNote: WrittenNote | null;
  preparedBy: string;
  preparedAt: Date | null;
  /** Earlier revisions and this one, oldest first. */
  revisions: RevisionFact[];
  /** The frozen record (snapshot) the statement is rendered from; null before the month is sent. */
  evidence: EvidenceFacts | null;
  /** Written explanations of the flags, by `code|stream`. */
  flagNotes?: FlagNotes;
  signOff: {
    signer: string;
    role: string;
    signedAt: Date | null;
    certificateSubject: string;
    certificateFingerprint: string;
    verifyAt: string;
  };
}

/** "carbon 14428.86277 t × 44/12" → "carbon 14 428.9 t × 44/12": figures with more than four decimals, to one. */
function roundBasis(basis: string): string {
  return basis.replace(/\d+\.\d{5,}/g, (n) => fixed(n, 1));
}

function dataSource(s: StreamFacts | undefined): string {
  if (!s) return DASH;
  const how = s.source === "invoice" ? "invoice" : s.source === "estimate" ? "estimate" : "meter";
  const tag = s.meterTag ? ` ${s.meterTag}` : "";
  return `${how}${how === "meter" ? tag : ""}${s.note ? `: ${s.note}` : ""}`;
}

/** Last calibration, when the next is due, and whether it was overdue at the month's end. */
function calibration(s: StreamFacts | undefined, monthEnd: string): { text: string; overdue: boolean } {
  if (!s || !s.calibratedOn || (s.source && s.source !== "meter")) return { text: DASH, overdue: false };
  const due = s.calibrationIntervalMonths ? calibrationDueOn(s.calibratedOn, s.calibrationIntervalMonths) : null;
  if (!due) return { text: `${s.calibratedOn} (no interval set)`, overdue: false };
  if (due < monthEnd) return { text: `${s.calibratedOn}: OVERDUE since ${due}`, overdue: true };
  return { text: `${s.calibratedOn} (next due ${due})`, overdue: false };
}

function tierOf(doc: ResultDocument, streamId: string): string {
  const t = doc.activity_tiers.find((x) => x.stream === streamId);
  if (!t || t.tier === null) return DASH;
  return t.tier === 0 ? "below tier 1" : `tier ${t.tier}`;
}

const DESTINATION_LABELS: Record<string, string> = {
  urea: "the urea plant",
  storage: "capture and geological storage",
  pcc: "precipitated calcium carbonate (chemically bound)",
  sale: "sale to a third party",
  other: "another destination",
};

function balanceRows(doc: ResultDocument, tolerance: string, noted: boolean): BalanceRow[] {
  const b = doc.balances;
  const rows = [
    { element: "Carbon", inflow: b.carbon.in_kmol, outflow: b.carbon.out_kmol, closure: b.carbon.closure_pct, unit: "kmol C" },
    { element: "Nitrogen", inflow: b.nitrogen.in_kmol, outflow: b.nitrogen.out_kmol, closure: b.nitrogen.closure_pct, unit: "kmol N" },
    {
      element: "Hydrogen equivalents",
      inflow: b.hydrogen.available_kmol,
      outflow: b.hydrogen.used_kmol,
      closure: b.hydrogen.closure_pct,
      unit: "kmol H2",
    },
  ];
  return rows.map((r) => {
    const within = r.closure === null || absWithin(r.closure, tolerance);
    return {
      element: r.element,
      inflow: { value: fixed(r.inflow, 0), unit: r.unit },
      outflow: { value: fixed(r.outflow, 0), unit: r.unit },
      closure: { value: signed(r.closure, 2), unit: "%" },
      tolerance: { value: `± ${fixed(tolerance, 1)}`, unit: "%" },
      mark: r.closure === null ? "info" : within ? "ok" : "attention",
      status: r.closure === null ? "No closure stated (one side unmeasured)" : within ? "Closed within tolerance" : noted ? "Outside tolerance, reason written" : "Outside tolerance",
    };
  });
}

/** Ratio, global test and the meters the reconciliation names, as sentences. */
export function reconciliationLines(doc: ResultDocument, streams: StreamFacts[]): string[] {
  const lines = [`Implied H2:N2 make-up ratio ${fixed(doc.synthesis.h2_n2_ratio, 3)} : 1, against 3 : 1 for ammonia synthesis.`];
  const rec = doc.reconciliation;
  if (!rec) return [...lines, "Data reconciliation was not run for this month."];
  lines.push(
    `Reconciliation global test: chi-square ${fixed(rec.chi2, 2)} against a critical value of ${fixed(rec.chi2_critical, 2)} (${rec.dof} degrees of freedom, 95 %): ${rec.passed ? "passed" : "failed"}.`,
  );
  const suspects = rec.streams.filter((s) => s.suspect);
  const name = (id: string) => {
    const s = streams.find((x) => x.key === id);
    return s ? `${s.name}${s.meterTag ? ` (${s.meterTag})` : ""}` : id;
  };
  if (suspects.length === 0) lines.push("No meter fails its individual test.");
  for (const s of suspects)
    lines.push(
      `Suspect meter: ${name(s.id)}, reconciled ${signed(s.adjustment_pct, 2)} % from its reading (test statistic ${fixed(s.test_statistic, 2)} against ${fixed(rec.z_critical, 2)}).`,
    );
  return lines;
}

export function buildMonthlyModel(input: MonthlyModelInput): MonthlyStatementModel {
  const doc = input.result;
  const byKey = new Map(input.streams.map((s) => [s.key, s]));
  const e = doc.emissions;

  const streamName = (id: string) => byKey.get(id)?.name ?? id;
  const monthEnd = lastDayOf(input.period);
  const inputs: InputRow[] = doc.streams.map((s) => {
    const facts = byKey.get(s.id);
    const cal = calibration(facts, monthEnd);
    return {
      stream: facts?.name ?? s.id,
      kind: KIND_LABELS[s.kind] ?? s.kind,
      quantity: { value: exact(s.quantity), unit: s.unit },
      dataSource: dataSource(facts),
      uncertainty: uncertaintyOf(doc, s.id, facts?.uncertaintyPct ?? null),
      tier: tierOf(doc, s.id),
      calibration: cal.text,
      overdue: cal.overdue,
    };
  });

  const deducted = Object.entries(doc.transfers.by_destination).filter(([, v]) => v.co2_t !== null && v.co2_t !== "0");
  const deductionNote = deducted.length
    ? deducted
        .map(([dest, v]) => `${fixed(v.co2_t, 1)} t CO2 to ${DESTINATION_LABELS[dest] ?? dest}: ${v.deducted ? "deducted" : "not deducted"} (${v.rule_source}).`)
        .join(" ")
    : "No CO2 was transferred out of the site this month.";
  const transfers: TransferRow[] = doc.transfers.streams.map((t) => ({
    stream: streamName(t.id),
    destination: DESTINATION_LABELS[t.destination] ?? t.destination,
    co2: { value: fixed(t.co2_t, 1), unit: "t CO2" },
    treatment: t.deducted ? "deducted from the installation's emissions" : "counted in the installation's emissions",
    rule: doc.transfers.by_destination[t.destination]?.rule_source ?? DASH,
  }));

  const balances = balanceRows(doc, input.site.closureTolerancePct, !!input.balanceNote);
  const flags = flagRows(doc.flags, input.balanceNote, input.flagNotes, streamName);
  const unconfirmed = unconfirmedRows(doc, streamName);
  const gases = (["co2", "ch4", "n2o"] as const).map((g) => {
    const row = doc.emissions_by_gas[g];
    return {
      gas: g.toUpperCase(),
      mass: { value: g === "co2" ? fixed(row.t, 1) : small(row.t), unit: "t" },
      gwp: row.gwp ?? "1",
      co2e: { value: fixed(row.co2e_t, 1), unit: "t CO2e" },
    };
  });
  // Result documents frozen before CO2e carried its own uncertainty have only the CO2 figure.
  const ue = (doc.uncertainty as Partial<ResultDocument["uncertainty"]>).co2e;
  const u = ue ?? doc.uncertainty.co2;
  const nonCo2Share = e.co2e_t !== null && e.gross_co2_t !== null ? ratioPct(minus(e.co2e_t, e.gross_co2_t), e.co2e_t) : null;
  const usUnits = input.site.meteringReference === "60F";

  return {
    header: {
      organisation: input.organisation,
      installation: installationFacts(input.site.installation),
      siteName: input.site.name,
      siteCode: input.site.code,
      period: input.period,
      periodLabel: monthLabel(input.period),
      revision: String(input.revision),
      statementRef: input.statementRef,
      meteringReference: meteringLabel(input.site.meteringReference),
      preparedBy: input.preparedBy,
      preparedAt: input.preparedAt ? utcStamp(input.preparedAt) : DASH,
    },
    summary: {
      co2e: {
        gross: { value: fixed(e.co2e_t, 1), unit: "t CO2e" },
        deducted: { value: fixed(e.deductible_co2_t, 1), unit: "t CO2" },
        net: { value: fixed(e.net_co2e_t, 1), unit: "t CO2e" },
      },
      uncertainty: `± ${fixed(u.u95_pct, 2)} % (± ${fixed(u.u95_t, 1)} ${ue ? "t CO2e" : "t CO2"})`,
      uncertaintyNote: ue
        ? `Expanded uncertainty of gross CO2e (coverage factor k = ${u.coverage_factor}): meters, gas analyses and factors, CH4 and N2O (${fixed(nonCo2Share, 2)} % of the CO2e) with their factors' ranges.`
        : `Expanded uncertainty of gross CO2 (coverage factor k = ${u.coverage_factor}); CH4 and N2O, ${fixed(nonCo2Share, 2)} % of the CO2e, are not in it.`,
      gases,
      ammonia: { value: fixed(doc.feed.ammonia_t, 1), unit: "t NH3" },
      closures: balances.map((b) => ({ element: b.element, closure: b.closure, tolerance: b.tolerance, mark: b.mark, status: b.status })),
      openFlags: flags.filter((f) => f.mark !== "info"),
    },
    method: methodSection(doc, streamName),
    unconfirmed,
    inputs,
    gasAnalyses: gasAnalysisRows(doc, input.document ?? null, input.analyses ?? [], streamName, usUnits),
    analysesBasis: "Calorific values per kilogram, and per cubic metre of real gas at 15 °C and 101.325 kPa (ISO 6976 reference conditions); composition as analysed, mol %.",
    balances,
    reconciliation: reconciliationLines(doc, input.streams),
    emissionsUnit: "t",
    emissionsBySource: doc.emissions_by_stream.map((s) => ({
      source: byKey.get(s.id)?.name ?? s.id,
      // The engine states its basis with every digit (the result document keeps them); the page rounds long figures.
      basis: roundBasis(s.basis),
      co2: fixed(s.co2_t, 1),
      ch4: small(s.ch4_t),
      n2o: small(s.n2o_t),
      co2e: fixed(s.co2e_t, 1),
    })),
    emissionsByGas: gases,
    co2: {
      gross: { value: fixed(e.gross_co2_t, 1), unit: "t CO2" },
      deducted: { value: fixed(e.deductible_co2_t, 1), unit: "t CO2" },
      net: { value: fixed(e.net_co2_t, 1), unit: "t CO2" },
      deductionNote,
    },
    transfers,
    intensities: intensityRows(doc, { usUnits }),
    uncertainty: [
      uncertaintyRow("Gross CO2", doc.uncertainty.co2, streamName),
      uncertaintyRow("Net CO2", doc.uncertainty.net_co2, streamName),
      ...(ue ? [uncertaintyRow("Gross CO2e", ue, streamName, "t CO2e")] : []),
    ],
    flags,
    revisions: revisionRows(input.revisions),
    cautions: [...STATEMENT_CAUTIONS],
    evidence: input.evidence,
    appendix: appendixRows(input, doc, flags),
    signOff: {
      signer: input.signOff.signer,
      role: input.signOff.role,
      date: input.signOff.signedAt ? utcStamp(input.signOff.signedAt) : "not signed yet",
      revision: String(input.revision),
      certificateSubject: input.signOff.certificateSubject,
      certificateFingerprint: input.signOff.certificateFingerprint,
      verifyAt: input.signOff.verifyAt,
      declaration: declarationText(unconfirmed.length),
    },
  };
}

/**
 * The signatory's declaration, in our own words. It says what signing means here and what it
 * does not: a statement is the operator's, not a verifier's opinion.
 */
export function declarationText(unconfirmed: number): string[] {
  return [
    "I have read this statement in full, this page and the pages that follow, before signing it.",
    "To the best of my knowledge and belief, its figures were computed from the installation's records for the period named, by the method and with the factors and global warming potentials it lists, and nothing known to me that would change them materially has been left out.",
    unconfirmed
      ? `The flags of the period with their explanations are disclosed in it, and so are the ${unconfirmed} cited ${unconfirmed === 1 ? "value" : "values"} not yet confirmed in ${unconfirmed === 1 ? "its" : "their"} published source, which I have acknowledged one by one.`
      : "The flags of the period with their explanations are disclosed in it; every cited value it rests on was confirmed in its published source or is the site's own figure.",
    "This statement is the operator's. It is not a verification opinion: where the scheme requires one, an accredited verifier gives it separately.",
  ];
}

export function installationFacts(i: InstallationIdentity | null | undefined): InstallationFacts | null {
  if (!i) return null;
  return {
    operator: i.operatorName || DASH,
    identifiers: i.identifiers,
    address: i.address || DASH,
    competentAuthority: i.competentAuthority || DASH,
    monitoringPlan: i.monitoringPlanRef ? `${i.monitoringPlanRef}${i.monitoringPlanVersion ? `, version ${i.monitoringPlanVersion}` : ""}` : DASH,
    contact: [i.contactName, i.contactEmail, i.contactPhone].filter(Boolean).join(", ") || DASH,
  };
}

function gasAnalysisRows(
  doc: ResultDocument,
  document: Record<string, unknown> | null,
  facts: { key: string; sampledOn: string | null; laboratory: string | null }[],
  streamName: (id: string) => string,
  usUnits: boolean,
): GasAnalysisRow[] {
  const docAnalyses = (document?.analyses ?? {}) as Record<string, { components?: Record<string, string | number> }>;
  const docStreams = ((document?.streams ?? []) as { id?: string; analysis?: string }[]).filter((s) => s.analysis);
  return Object.entries(doc.analyses).map(([key, a]) => {
    const f = facts.find((x) => x.key === key);
    const components = Object.entries(docAnalyses[key]?.components ?? {});
    const perMass = (v: string | null) => (usUnits && v ? `MJ/kg (${fixed(btuPerLb(v), 0)} Btu/lb)` : "MJ/kg");
    return {
      analysis: key,
      usedBy: docStreams.filter((s) => s.analysis === key).map((s) => streamName(s.id ?? "?")).join(", ") || DASH,
      sampledOn: f?.sampledOn ?? "not recorded",
      laboratory: f?.laboratory ?? "not recorded",
      composition: components.length ? `${components.map(([c, v]) => `${c} ${String(v)}`).join(", ")} mol %` : DASH,
      molarMass: { value: fixed(a.molar_mass, 3), unit: "kg/kmol" },
      gcv: { value: `${fixed(a.gcv_mj_per_kg, 3)}${a.gcv_mj_per_m3_15c ? ` · ${fixed(a.gcv_mj_per_m3_15c, 3)}` : ""}`, unit: `${perMass(a.gcv_mj_per_kg)}${a.gcv_mj_per_m3_15c ? " · MJ/m3" : ""}` },
      ncv: { value: `${fixed(a.ncv_mj_per_kg, 3)}${a.ncv_mj_per_m3_15c ? ` · ${fixed(a.ncv_mj_per_m3_15c, 3)}` : ""}`, unit: `${perMass(a.ncv_mj_per_kg)}${a.ncv_mj_per_m3_15c ? " · MJ/m3" : ""}` },
      carbon: { value: a.carbon_mass_fraction === null ? DASH : fixed(times(a.carbon_mass_fraction, "100"), 2), unit: "% by mass" },
    };
  });
}

/** Identifiers and codes for machines and cross-reference, kept out of the statement's body. */
function appendixRows(input: MonthlyModelInput, doc: ResultDocument, flags: FlagRow[]): AppendixRow[] {
  const rows: AppendixRow[] = [
    { item: "Site code", value: input.site.code },
    { item: "Factor set", value: `${doc.method.factor_set.id}, version ${doc.method.factor_set.version}` },
    { item: "Emissions method", value: doc.method.emissions },
    { item: "GWP set", value: doc.method.gwp.id },
    { item: "Computed by", value: (doc as { engine?: string }).engine ?? DASH },
    { item: "Statement reference", value: input.statementRef },
  ];
  for (const s of input.streams) rows.push({ item: `Stream ${s.name}`, value: s.key });
  for (const f of flags) rows.push({ item: `Flag: ${f.message}`, value: f.code });
  return rows;
}

function uncertaintyOf(doc: ResultDocument, streamId: string, configured: string | null): string {
  const pct = doc.activity_tiers.find((t) => t.stream === streamId)?.uncertainty_pct ?? configured;
  return pct ? `± ${fixed(pct, 1)} %` : "not stated";
}

/** The installation as the public verification answer names it (kept with the stored statement). */
export function installationSummary(i: InstallationIdentity | null | undefined): Record<string, string> {
  if (!i) return {};
  return {
    ...(i.operatorName ? { operator: i.operatorName } : {}),
    ...(i.identifiers.length ? { identifiers: i.identifiers.map((x) => `${x.scheme} ${x.identifier}`).join("; ") } : {}),
  };
}

/** Key figures kept with the stored statement for lists and the verification answer, as printed on page 1. */
export function statementSummary(doc: ResultDocument, installation?: InstallationIdentity | null): Record<string, string> {
  return {
    ...installationSummary(installation),
    co2e: `${fixed(doc.emissions.co2e_t, 1)} t CO2e`,
    netCo2e: `${fixed(doc.emissions.net_co2e_t, 1)} t CO2e`,
    grossCo2: `${fixed(doc.emissions.gross_co2_t, 1)} t CO2`,
    netCo2: `${fixed(doc.emissions.net_co2_t, 1)} t CO2`,
    ammonia: `${fixed(doc.feed.ammonia_t, 1)} t NH3`,
    intensity: `${fixed(doc.intensity.co2e_t_per_t_nh3, 3)} t CO2e/t NH3`,
    uncertainty: `± ${fixed(doc.uncertainty.co2.u95_pct, 2)} %`,
  };
}
