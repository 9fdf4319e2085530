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
  type RevisionFact,
  type WrittenNote,
} from "./build-model-parts";
import { calibrationDueOn } from "@/lib/ledger/calibration";
import { lastDayOf } from "@/lib/period";
import { DASH, absWithin, exact, fixed, monthLabel, signed, small, utcStamp } from "./format";
import { STATEMENT_CAUTIONS, type BalanceRow, type EvidenceFacts, type InputRow, type MonthlyStatementModel } from "./model";

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
  site: { name: string; code: string; meteringReference: string; closureTolerancePct: string };
  period: string;
  revision: number;
  statementRef: string;
  result: ResultDocument;
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

function dataSource(s: StreamFacts | undefined, monthEnd: string): string {
  if (!s) return DASH;
  const how = s.source === "invoice" ? "invoice" : s.source === "estimate" ? "estimate" : "meter";
  const tag = s.meterTag ? ` ${s.meterTag}` : "";
  const cal = s.calibratedOn && how === "meter" ? `, calibrated ${s.calibratedOn}` : "";
  const due = s.calibratedOn && s.calibrationIntervalMonths ? calibrationDueOn(s.calibratedOn, s.calibrationIntervalMonths) : null;
  const overdue = due && due < monthEnd && how === "meter" ? ` (calibration OVERDUE since ${due})` : "";
  return `${how}${how === "meter" ? tag : ""}${cal}${overdue}${s.note ? `: ${s.note}` : ""}`;
}

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

  const inputs: InputRow[] = doc.streams.map((s) => {
    const facts = byKey.get(s.id);
    return {
      stream: facts?.name ?? s.id,
      kind: KIND_LABELS[s.kind] ?? s.kind,
      quantity: { value: exact(s.quantity), unit: s.unit },
      dataSource: dataSource(facts, lastDayOf(input.period)),
      uncertainty: uncertaintyOf(doc, s.id, facts?.uncertaintyPct ?? null),
    };
  });

  const deducted = Object.entries(doc.transfers.by_destination).filter(([, v]) => v.co2_t !== null && v.co2_t !== "0");
  const deductionNote = deducted.length
    ? deducted
        .map(([dest, v]) => `${fixed(v.co2_t, 1)} t CO2 to ${dest}: ${v.deducted ? "deducted" : "not deducted"} (${v.rule_source}).`)
        .join(" ")
    : "No CO2 was transferred out of the site this month.";

  return {
    header: {
      organisation: input.organisation,
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
    method: methodSection(doc),
    inputs,
    balances: balanceRows(doc, input.site.closureTolerancePct, !!input.balanceNote),
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
    emissionsByGas: (["co2", "ch4", "n2o"] as const).map((g) => {
      const row = doc.emissions_by_gas[g];
      return {
        gas: g.toUpperCase(),
        mass: { value: g === "co2" ? fixed(row.t, 1) : small(row.t), unit: "t" },
        gwp: row.gwp ?? "1",
        co2e: { value: fixed(row.co2e_t, 1), unit: "t CO2e" },
      };
    }),
    co2: {
      gross: { value: fixed(e.gross_co2_t, 1), unit: "t CO2" },
      deducted: { value: fixed(e.deductible_co2_t, 1), unit: "t CO2" },
      net: { value: fixed(e.net_co2_t, 1), unit: "t CO2" },
      deductionNote,
    },
    intensities: intensityRows(doc),
    uncertainty: [uncertaintyRow("Gross CO2", doc.uncertainty.co2), uncertaintyRow("Net CO2", doc.uncertainty.net_co2)],
    flags: flagRows(doc.flags, input.balanceNote, input.flagNotes),
    revisions: revisionRows(input.revisions),
    cautions: [...STATEMENT_CAUTIONS],
    evidence: input.evidence,
    signOff: {
      signer: input.signOff.signer,
      role: input.signOff.role,
      date: input.signOff.signedAt ? utcStamp(input.signOff.signedAt) : "not signed yet",
      revision: String(input.revision),
      certificateSubject: input.signOff.certificateSubject,
      certificateFingerprint: input.signOff.certificateFingerprint,
      verifyAt: input.signOff.verifyAt,
    },
  };
}

function uncertaintyOf(doc: ResultDocument, streamId: string, configured: string | null): string {
  const pct = doc.activity_tiers.find((t) => t.stream === streamId)?.uncertainty_pct ?? configured;
  return pct ? `± ${fixed(pct, 1)} %` : "not stated";
}

/** Key figures kept with the stored statement for lists and the verification answer. */
export function statementSummary(doc: ResultDocument): Record<string, string> {
  return {
    ammonia: `${fixed(doc.feed.ammonia_t, 1)} t NH3`,
    grossCo2: `${fixed(doc.emissions.gross_co2_t, 1)} t CO2`,
    netCo2: `${fixed(doc.emissions.net_co2_t, 1)} t CO2`,
    co2e: `${fixed(doc.emissions.co2e_t, 1)} t CO2e`,
    intensity: `${fixed(doc.intensity.co2e_t_per_t_nh3, 3)} t CO2e/t NH3`,
  };
}
