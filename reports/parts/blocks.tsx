import { Text, View } from "@react-pdf/renderer";
import type { EvidenceFacts, FlagRow, GasRow, IntensityRow, MethodSection, RevisionRow, SignOff, UncertaintyRow } from "../model";
import { DataTable, KeyValues, QtyText, Section, Status } from "./primitives";
import { colour, styles } from "./theme";

export function MethodBlock({ n, m }: { n: string; m: MethodSection }) {
  return (
    <Section n={n} title="Method and factor set">
      <KeyValues items={[["Method", m.method], ["Factor set", m.factorSet], ["GWP values", m.gwpSet]]} />
      <View style={{ marginTop: 4 }}>
        <DataTable
          columns={[
            { title: "Factor or rule", flex: 3, cell: (r) => r.item },
            { title: "Value", flex: 2.4, numeric: true, cell: (r) => <QtyText q={r.value} /> },
            { title: "Source", flex: 4, cell: (r) => r.source },
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
    <Section n={n} title={title}>
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
          { title: "Flag", flex: 3.4, cell: (r) => <Status mark={r.mark} text={`${r.message} (${r.code})`} /> },
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
    <Section n={n} title="Revision history">
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
  const digest = (hex: string) => (
    <Text style={{ fontFamily: "Plex Mono", fontSize: 7 }}>
      {hex.slice(0, 32)}
      {"\n"}
      {hex.slice(32)}
    </Text>
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

/** The sign-off: who answered for the statement, in which role, when, and with which certificate. */
export function SignOffBlock({ s }: { s: SignOff }) {
  return (
    <View style={{ marginTop: 14, borderTopWidth: 2, borderTopColor: colour.accent, paddingTop: 6 }} wrap={false}>
      <Text style={[styles.sectionTitle, { marginBottom: 5 }]}>Sign-off</Text>
      <View style={{ flexDirection: "row" }}>
        <View style={{ flex: 1 }}>
          <KeyValues items={[["Signed by", s.signer], ["Role", s.role], ["Date", s.date], ["Revision", s.revision]]} />
        </View>
        <View style={{ flex: 1.3, paddingLeft: 8, borderLeftWidth: 0.75, borderLeftColor: colour.rule }}>
          <KeyValues
            items={[
              ["Certificate", s.certificateSubject],
              [
                "SHA-256 fingerprint",
                // Two lines of 32 hex digits: a 64-digit word would overflow the column.
                <Text key="fingerprint" style={{ fontFamily: "Plex Mono", fontSize: 7 }}>
                  {s.certificateFingerprint.slice(0, 32)}
                  {"\n"}
                  {s.certificateFingerprint.slice(32)}
                </Text>,
              ],
              ["Check a copy at", s.verifyAt],
            ]}
          />
        </View>
      </View>
      <Text style={[styles.small, styles.muted, { marginTop: 5 }]}>
        The signature is the digital signature carried by this file, made when the signatory signed in Synledger. A printed
        copy proves nothing on its own: verify the PDF file.
      </Text>
    </View>
  );
}
