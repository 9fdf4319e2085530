import type { ReactNode } from "react";
import { Text, View } from "@react-pdf/renderer";
import type {
  AppendixRow,
  EvidenceFacts,
  FlagRow,
  GasAnalysisRow,
  GasRow,
  InstallationFacts,
  IntensityRow,
  MethodSection,
  Qty,
  RevisionRow,
  SignOff,
  SummaryFacts,
  TransferRow,
  UncertaintyRow,
  UnconfirmedRow,
} from "../model";
import { DataTable, KeyValues, QtyText, Section, Status, StatusMark } from "./primitives";
import { colour, styles } from "./theme";

export function MethodBlock({ n, m, breakBefore }: { n: string; m: MethodSection; breakBefore?: boolean }) {
  return (
    <Section n={n} title="Method, factor set and every factor used" breakBefore={breakBefore}>
      <KeyValues items={[["Method", m.method], ["Factor set", m.factorSet], ["GWP values", m.gwpSet], ["Calorific basis", m.energyBasis]]} />
      <View style={{ marginTop: 4 }}>
        <DataTable
          columns={[
            { title: "Factor or rule actually used", flex: 3, cell: (r) => r.item },
            { title: "Value", flex: 2.4, numeric: true, cell: (r) => <QtyText q={r.value} /> },
            { title: "Source (document, table or article)", flex: 4, cell: (r) => r.source },
            { title: "Status", flex: 1.3, cell: (r) => <Status mark={r.status === "unconfirmed" ? "attention" : r.status === "site" ? "info" : "ok"} text={r.statusText} /> },
          ]}
          rows={m.sources}
        />
      </View>
      {m.notes.map((t, i) => (
        <Text key={i} style={[styles.small, styles.muted, { marginTop: 3 }]}>
          {t}
        </Text>
      ))}
    </Section>
  );
}

export function GasTable({ rows }: { rows: GasRow[] }) {
  return (
    <DataTable
      columns={[
        { title: "Gas", flex: 2, cell: (r) => r.gas },
        { title: "Mass", flex: 2.5, numeric: true, cell: (r) => <QtyText q={r.mass} /> },
        { title: "GWP (100 yr)", flex: 1.5, numeric: true, cell: (r) => r.gwp },
        { title: "CO2-equivalent", flex: 2.5, numeric: true, cell: (r) => <QtyText q={r.co2e} /> },
      ]}
      rows={rows}
    />
  );
}

export function IntensityBlock({ n, rows }: { n: string; rows: IntensityRow[] }) {
  return (
    <Section n={n} title="Intensities and benchmarks">
      <DataTable
        columns={[
          { title: "Measure", flex: 3, cell: (r) => r.measure },
          { title: "This period", flex: 2.2, numeric: true, cell: (r) => <QtyText q={r.value} strong /> },
          { title: "Benchmark", flex: 2.2, numeric: true, cell: (r) => <QtyText q={r.benchmark} /> },
          { title: "Benchmark source", flex: 2.6, cell: (r) => r.benchmarkSource },
          { title: "Position", flex: 2.4, cell: (r) => <Status mark={r.mark} text={r.position} /> },
        ]}
        rows={rows}
      />
    </Section>
  );
}

export function UncertaintyBlock({ n, rows, title = "Uncertainty" }: { n: string; rows: UncertaintyRow[]; title?: string }) {
  return (
    <Section n={n} title={title} keep>
      <DataTable
        columns={[
          { title: "Figure", flex: 3, cell: (r) => r.figure },
          { title: "Value", flex: 2.2, numeric: true, cell: (r) => <QtyText q={r.value} /> },
          { title: "Expanded uncertainty", flex: 2.4, numeric: true, cell: (r) => r.expanded },
          { title: "Basis", flex: 4, cell: (r) => r.note },
        ]}
        rows={rows}
      />
    </Section>
  );
}

export function FlagsBlock({ n, rows }: { n: string; rows: FlagRow[] }) {
  return (
    <Section n={n} title="Flags and explanations">
      <DataTable
        columns={[
          { title: "Flag", flex: 3.4, cell: (r) => <Status mark={r.mark} text={r.message} /> },
          {
            title: "Explanation",
            flex: 5,
            cell: (r) =>
              r.explanation ? (
                <Text>
                  {r.explanation}
                  <Text style={styles.muted}> — {r.explainedBy}</Text>
                </Text>
              ) : (
                <Text style={styles.muted}>No explanation recorded.</Text>
              ),
          },
        ]}
        rows={rows}
        empty="No flags were raised for this period."
      />
    </Section>
  );
}

export function RevisionsBlock({ n, rows }: { n: string; rows: RevisionRow[] }) {
  return (
    <Section n={n} title="Revision history" keep={rows.length <= 12}>
      <DataTable
        columns={[
          { title: "Revision", flex: 1, numeric: true, cell: (r) => r.revision },
          { title: "Signed", flex: 2.2, cell: (r) => r.signedAt },
          { title: "Signed by", flex: 2.6, cell: (r) => r.signer },
          { title: "Reason", flex: 5, cell: (r) => r.reason },
        ]}
        rows={rows}
      />
    </Section>
  );
}

export function CautionsBlock({ items }: { items: string[] }) {
  return (
    <View style={{ marginTop: 14, padding: 8, borderWidth: 0.75, borderColor: colour.rule, backgroundColor: colour.band }} wrap={false}>
      <Text style={{ fontWeight: 600, marginBottom: 3 }}>Read with care</Text>
      {items.map((t, i) => (
        <View key={i} style={{ flexDirection: "row", marginBottom: 1.5 }}>
          <Text style={{ width: 8 }}>•</Text>
          <Text style={{ flex: 1 }}>{t}</Text>
        </View>
      ))}
    </View>
  );
}

/** The frozen record behind the figures: both documents' digests, and the files this PDF carries. */
export function EvidenceBlock({ e }: { e: EvidenceFacts }) {
  // Two lines of 32 hex digits as two Text elements: a "\n" run between them would be set in the
  // PDF's built-in Helvetica, which is not embedded (PDF/A forbids that).
  const digest = (hex: string) => (
    <View>
      <Text style={{ fontFamily: "Plex Mono", fontSize: 7 }}>{hex.slice(0, 32)}</Text>
      <Text style={{ fontFamily: "Plex Mono", fontSize: 7 }}>{hex.slice(32)}</Text>
    </View>
  );
  return (
    <View style={{ marginTop: 14, padding: 8, borderWidth: 0.75, borderColor: colour.rule }} wrap={false}>
      <Text style={[styles.sectionTitle, { marginBottom: 5 }]}>Frozen record behind these figures</Text>
      <KeyValues
        items={[
          ["Plant-month document, SHA-256", digest(e.documentSha256)],
          ["Result document, SHA-256", digest(e.resultSha256)],
          ["Computed by", e.engineVersion],
          ["Frozen at", e.frozenAt],
        ]}
      />
      <Text style={[styles.small, { marginTop: 4 }]}>
        Attached to this PDF: {e.files.map((f) => `${f.name} (${f.what})`).join("; ")}. The digests are of these files as attached (canonical JSON, RFC 8785).
        Anyone holding the PDF can recompute the result from the plant-month document: npm run balance -- --check-statement FILE.pdf.
      </Text>
    </View>
  );
}

/** The installation the statement is issued for: page 1, before any figure. */
export function InstallationBlock({ i }: { i: InstallationFacts | null }) {
  if (!i) {
    return (
      <View style={{ marginTop: 6, padding: 6, borderWidth: 0.75, borderColor: colour.rule }}>
        <Text style={styles.muted}>Installation identity: not recorded (this revision was frozen before Synledger kept it).</Text>
      </View>
    );
  }
  return (
    <View style={{ marginTop: 6, flexDirection: "row", borderTopWidth: 0.75, borderTopColor: colour.ink, paddingTop: 5 }} wrap={false}>
      <View style={{ flex: 1.2, paddingRight: 8 }}>
        <KeyValues
          keyWidth={88}
          items={[
            ["Operator", i.operator],
            ["Installation address", i.address],
            ["Competent authority", i.competentAuthority],
          ]}
        />
      </View>
      <View style={{ flex: 1, paddingLeft: 8, borderLeftWidth: 0.75, borderLeftColor: colour.rule }}>
        <KeyValues
          keyWidth={118}
          items={[
            ...i.identifiers.map((x): [string, ReactNode] => [x.scheme, <Text key={x.scheme} style={{ fontFamily: "Plex Mono" }}>{x.identifier}</Text>]),
            ["Monitoring plan", i.monitoringPlan],
            ["Reporting contact", i.contact],
          ]}
        />
      </View>
    </View>
  );
}

/** Page 1's figures: totals with their uncertainty, gases, production, closures, intensities and open flags. */
export function SummaryBlock({ s, method, intensities }: { s: SummaryFacts; method: MethodSection; intensities: IntensityRow[] }) {
  const big = (label: string, q: Qty, strong = false) => (
    <View style={{ flex: 1, paddingRight: 8 }}>
      <Text style={[styles.small, styles.muted]}>{label}</Text>
      <View style={{ fontSize: strong ? 13 : 11 }}>
        <QtyText q={q} strong={strong} left />
      </View>
    </View>
  );
  return (
    <View style={{ marginTop: 8 }}>
      <View style={{ flexDirection: "row", alignItems: "center", marginBottom: 4 }}>
        <View style={styles.sectionBar} />
        <Text style={styles.sectionTitle}>Summary for signature</Text>
      </View>
      <KeyValues items={[["Method", method.method], ["Factor set", method.factorSet], ["GWP values", method.gwpShort], ["Calorific basis", method.energyBasis]]} />
      <View style={{ flexDirection: "row", marginTop: 5, borderTopWidth: 0.75, borderTopColor: colour.ink, paddingTop: 4 }} wrap={false}>
        {big("Total CO2e, gross", s.co2e.gross)}
        {big("Deducted (CO2 transferred)", s.co2e.deducted)}
        {big("Total CO2e, net", s.co2e.net, true)}
        <View style={{ flex: 1.1 }}>
          <Text style={[styles.small, styles.muted]}>Uncertainty of the gross (95 %)</Text>
          <Text style={[styles.num, { textAlign: "left", fontSize: 9 }]}>{s.uncertainty}</Text>
        </View>
      </View>
      <Text style={[styles.small, styles.muted, { marginTop: 1 }]}>{s.uncertaintyNote}</Text>
      <View style={{ flexDirection: "row", marginTop: 4 }} wrap={false}>
        {s.gases.map((g) => (
          <View key={g.gas} style={{ flex: 1, paddingRight: 8 }}>
            <Text style={[styles.small, styles.muted]}>
              {g.gas} (GWP {g.gwp}) = {g.co2e.value} {g.co2e.unit}
            </Text>
            <QtyText q={g.mass} left />
          </View>
        ))}
        <View style={{ flex: 1 }}>
          <Text style={[styles.small, styles.muted]}>Ammonia produced</Text>
          <QtyText q={s.ammonia} left strong />
        </View>
      </View>
      <View style={{ flexDirection: "row", marginTop: 4, flexWrap: "wrap" }} wrap={false}>
        <Text style={[styles.small, styles.muted, { marginRight: 6 }]}>Balance closures</Text>
        {s.closures.map((c) => (
          <View key={c.element} style={{ flexDirection: "row", marginRight: 10 }}>
            <StatusMark mark={c.mark} />
            <Text>
              {c.element} <Text style={{ fontFamily: "Plex Mono" }}>{c.closure.value} %</Text>
              <Text style={styles.muted}>{c.mark === "ok" ? ` (within ${c.tolerance.value} %)` : ` (${c.status.toLowerCase()})`}</Text>
            </Text>
          </View>
        ))}
      </View>
      <View style={{ marginTop: 5 }}>
        <DataTable
          columns={[
            { title: "Intensity", flex: 5.4, cell: (r: IntensityRow) => <Text style={styles.small}>{r.measure}</Text> },
            { title: "This period", flex: 1.8, numeric: true, cell: (r: IntensityRow) => <QtyText q={r.value} strong /> },
            { title: "Benchmark", flex: 1.6, numeric: true, cell: (r: IntensityRow) => (r.benchmark.value === "—" ? <Text style={[styles.small, styles.muted, { textAlign: "right" }]}>none in the set</Text> : <QtyText q={r.benchmark} />) },
            { title: "Position", flex: 1.8, cell: (r: IntensityRow) => (r.mark === "info" ? <Text style={[styles.small, styles.muted]}>for information</Text> : <Status mark={r.mark} text={r.position} />) },
          ]}
          rows={intensities}
        />
      </View>
      <View style={{ marginTop: 5 }}>
        <DataTable
          columns={[
            { title: "Open flags of the period", flex: 3.2, cell: (r: FlagRow) => <Status mark={r.mark} text={r.message} /> },
            {
              title: "Written explanation",
              flex: 4.2,
              cell: (r: FlagRow) =>
                r.explanation ? (
                  <Text>
                    {r.explanation}
                    <Text style={styles.muted}> — {r.explainedBy}</Text>
                  </Text>
                ) : (
                  <Text style={styles.muted}>No explanation recorded.</Text>
                ),
            },
          ]}
          rows={s.openFlags}
          empty="No warnings or errors were raised for this period."
        />
      </View>
    </View>
  );
}

/** The declaration the signatory makes, with who signed, when and with which certificate. */
export function DeclarationBlock({ s, unconfirmed }: { s: SignOff; unconfirmed: number }) {
  return (
    <View style={{ marginTop: 8, borderTopWidth: 2, borderTopColor: colour.accent, paddingTop: 4 }} wrap={false}>
      <Text style={[styles.sectionTitle, { marginBottom: 3 }]}>Declaration of the signatory</Text>
      {s.declaration.map((t, i) => (
        <View key={i} style={{ flexDirection: "row", marginBottom: 1.5 }}>
          <Text style={{ width: 12 }}>{i + 1}.</Text>
          <Text style={{ flex: 1 }}>{t}</Text>
        </View>
      ))}
      <View style={{ marginTop: 4, borderTopWidth: 0.5, borderTopColor: colour.rule, paddingTop: 3 }}>
        <Text>
          Signed by <Text style={{ fontWeight: 600 }}>{s.signer}</Text>, {s.role.toLowerCase()}, {s.date === "not signed yet" ? "not signed yet" : `on ${s.date}`}, revision {s.revision}
          {unconfirmed ? `; ${unconfirmed} unconfirmed ${unconfirmed === 1 ? "value" : "values"} acknowledged` : ""}.
        </Text>
        <Text style={styles.small}>
          Certificate {s.certificateSubject}, SHA-256 fingerprint <Text style={{ fontFamily: "Plex Mono", fontSize: 6.5 }}>{s.certificateFingerprint}</Text>
        </Text>
      </View>
      <Text style={[styles.small, { marginTop: 4 }]}>
        Anyone holding this file can check it, without an account, at <Text style={{ fontFamily: "Plex Mono" }}>{s.verifyAt}</Text>. The signature is the digital
        signature this PDF carries; a printed copy proves nothing on its own.
      </Text>
    </View>
  );
}

/** The cited values not yet read in their published source, each acknowledged by the signatory. */
export function UnconfirmedBlock({ n, rows }: { n: string; rows: UnconfirmedRow[] }) {
  return (
    <Section n={n} title="Values not yet confirmed in their published source">
      <Text style={[styles.small, { marginBottom: 3 }]}>
        Each value below is cited to the document named but has not yet been read in its published text. The signatory acknowledged each one before signing.
        Check them there before relying on the figures that use them.
      </Text>
      <DataTable
        columns={[
          { title: "Value", flex: 3.4, cell: (r: UnconfirmedRow) => r.item },
          { title: "As used", flex: 2, numeric: true, cell: (r: UnconfirmedRow) => r.value },
          { title: "Cited source", flex: 4, cell: (r: UnconfirmedRow) => r.source },
        ]}
        rows={rows}
        empty="None: every cited value was confirmed in its published source or is the site's own figure."
      />
    </Section>
  );
}

export function GasAnalysesBlock({ n, rows, basis }: { n: string; rows: GasAnalysisRow[]; basis: string }) {
  return (
    <Section n={n} title="Gas analyses">
      <Text style={[styles.small, styles.muted, { marginBottom: 3 }]}>{basis}</Text>
      {rows.map((r) => (
        <View key={r.analysis} style={{ borderTopWidth: 0.75, borderTopColor: colour.ink, paddingTop: 3, marginBottom: 5 }} wrap={false}>
          <View style={{ flexDirection: "row" }}>
            <View style={{ flex: 1, paddingRight: 6 }}>
              <KeyValues items={[["Analysis", r.analysis], ["Used for", r.usedBy], ["Sampled", r.sampledOn], ["Laboratory", r.laboratory]]} />
            </View>
            <View style={{ flex: 1, paddingLeft: 6, borderLeftWidth: 0.5, borderLeftColor: colour.rule }}>
              <KeyValues
                items={[
                  ["Molar mass", <QtyText key="m" q={r.molarMass} left />],
                  ["GCV (gross, HHV)", <QtyText key="g" q={r.gcv} left />],
                  ["NCV (net, LHV)", <QtyText key="n" q={r.ncv} left />],
                  ["Carbon content", <QtyText key="c" q={r.carbon} left />],
                ]}
              />
            </View>
          </View>
          <Text style={[styles.small, { marginTop: 2, fontFamily: "Plex Mono" }]}>{r.composition}</Text>
        </View>
      ))}
    </Section>
  );
}

export function TransfersBlock({ n, rows, note }: { n: string; rows: TransferRow[]; note: string }) {
  return (
    <Section n={n} title="CO2 transferred out of the installation" keep={rows.length <= 8}>
      <DataTable
        columns={[
          { title: "Stream", flex: 2.6, cell: (r: TransferRow) => r.stream },
          { title: "To", flex: 2.2, cell: (r: TransferRow) => r.destination },
          { title: "CO2", flex: 1.6, numeric: true, cell: (r: TransferRow) => <QtyText q={r.co2} /> },
          { title: "Treatment", flex: 2.6, cell: (r: TransferRow) => r.treatment },
          { title: "Rule", flex: 3.4, cell: (r: TransferRow) => <Text style={styles.small}>{r.rule}</Text> },
        ]}
        rows={rows}
        empty="No CO2 was transferred out of the installation in this period."
      />
      <Text style={[styles.small, styles.muted, { marginTop: 3 }]}>{note}</Text>
    </Section>
  );
}

export function AppendixBlock({ rows }: { rows: AppendixRow[] }) {
  return (
    <View style={{ marginTop: 14 }} wrap>
      <Text style={[styles.sectionTitle, { marginBottom: 4 }]}>Appendix: identifiers and codes</Text>
      <Text style={[styles.small, styles.muted, { marginBottom: 3 }]}>For cross-reference with the attached documents and with exports; the statement’s text uses names.</Text>
      <DataTable
        columns={[
          { title: "Item", flex: 5, cell: (r: AppendixRow) => <Text style={styles.small}>{r.item}</Text> },
          { title: "Code", flex: 3, cell: (r: AppendixRow) => <Text style={[styles.small, { fontFamily: "Plex Mono" }]}>{r.value}</Text> },
        ]}
        rows={rows}
      />
    </View>
  );
}
