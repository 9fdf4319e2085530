import { Document, Page, Text, View } from "@react-pdf/renderer";
import type { MonthlyStatementModel } from "./model";
import {
  AppendixBlock,
  CautionsBlock,
  DeclarationBlock,
  EvidenceBlock,
  FlagsBlock,
  GasAnalysesBlock,
  GasTable,
  InstallationBlock,
  IntensityBlock,
  MethodBlock,
  RevisionsBlock,
  SummaryBlock,
  TransfersBlock,
  UncertaintyBlock,
  UnconfirmedBlock,
} from "./parts/blocks";
import { Footer, RunningHead, TitleBlock } from "./parts/frame";
import { DataTable, QtyText, Section, Status } from "./parts/primitives";
import { colour, styles } from "./parts/theme";

/**
 * The monthly greenhouse-gas statement. Page 1 is what the signatory signs: installation,
 * summary of the figures and the declaration; the pages after it hold everything behind them.
 * Lays out the model; computes nothing.
 */
export function MonthlyStatement({ model: m }: { model: MonthlyStatementModel }) {
  const h = m.header;
  return (
    <Document
      title={`Monthly greenhouse-gas statement, ${h.siteName}, ${h.periodLabel}, revision ${h.revision}`}
      author={h.organisation}
      subject={`Greenhouse-gas statement, ${h.siteName}, ${h.periodLabel}`}
      creator="Synledger"
      producer="Synledger"
      language="en-GB"
    >
      <Page size="A4" style={styles.page}>
        <RunningHead h={h} kind="Monthly statement" />
        <Footer verifyAt={m.signOff.verifyAt} />
        <TitleBlock h={h} title="Monthly greenhouse-gas statement" />
        <InstallationBlock i={h.installation} />
        <SummaryBlock s={m.summary} method={m.method} intensities={m.intensities} />
        <DeclarationBlock s={m.signOff} unconfirmed={m.unconfirmed.length} />

        <MethodBlock n="1" m={m.method} breakBefore />
        <UnconfirmedBlock n="2" rows={m.unconfirmed} />

        <Section n="3" title="Inputs">
          <DataTable
            columns={[
              { title: "Stream", flex: 2.8, cell: (r) => r.stream },
              { title: "Kind", flex: 1.6, cell: (r) => r.kind },
              { title: "Quantity", flex: 2.4, numeric: true, cell: (r) => <QtyText q={r.quantity} /> },
              { title: "Source", flex: 2.4, cell: (r) => r.dataSource },
              { title: "Uncert.", flex: 1.1, numeric: true, cell: (r) => r.uncertainty },
              { title: "Tier", flex: 1.2, cell: (r) => r.tier },
              { title: "Calibrated", flex: 2.6, cell: (r) => (r.overdue ? <Status mark="attention" text={r.calibration} /> : <Text>{r.calibration}</Text>) },
            ]}
            rows={m.inputs}
          />
          <Text style={[styles.small, styles.muted, { marginTop: 3 }]}>Gas volumes are at the site’s metering reference, {h.meteringReference}. Tier: the activity-data tier the meter’s stated uncertainty reaches under the set’s thresholds (the EU MRR ones where the set has none).</Text>
        </Section>

        <GasAnalysesBlock n="4" rows={m.gasAnalyses} basis={m.analysesBasis} />

        <Section n="5" title="Element balances and closure" keep>
          <DataTable
            columns={[
              { title: "Balance", flex: 2.4, cell: (r) => r.element },
              { title: "In", flex: 2.2, numeric: true, cell: (r) => <QtyText q={r.inflow} /> },
              { title: "Out", flex: 2.2, numeric: true, cell: (r) => <QtyText q={r.outflow} /> },
              { title: "Closure", flex: 1.5, numeric: true, cell: (r) => <QtyText q={r.closure} strong /> },
              { title: "Tolerance", flex: 1.5, numeric: true, cell: (r) => <QtyText q={r.tolerance} /> },
              { title: "Status", flex: 3, cell: (r) => <Status mark={r.mark} text={r.status} /> },
            ]}
            rows={m.balances}
          />
        </Section>

        <Section n="6" title="Reconciliation" keep>
          {m.reconciliation.map((t, i) => (
            <Text key={i} style={[styles.small, { marginTop: i ? 2 : 0 }]}>
              {t}
            </Text>
          ))}
        </Section>

        <Section n="7" title="Emissions by source stream and gas">
          <DataTable
            columns={[
              { title: "Source stream", flex: 2.6, cell: (r) => r.source },
              { title: "Basis", flex: 3.8, cell: (r) => <Text style={styles.small}>{r.basis}</Text> },
              { title: `CO2 (${m.emissionsUnit})`, flex: 1.6, numeric: true, cell: (r) => r.co2 },
              { title: `CH4 (${m.emissionsUnit})`, flex: 1.3, numeric: true, cell: (r) => r.ch4 },
              { title: `N2O (${m.emissionsUnit})`, flex: 1.3, numeric: true, cell: (r) => r.n2o },
              { title: `CO2e (${m.emissionsUnit})`, flex: 1.6, numeric: true, cell: (r) => r.co2e },
            ]}
            rows={m.emissionsBySource}
          />
          <View style={{ marginTop: 6 }}>
            <GasTable rows={m.emissionsByGas} />
          </View>
          <View style={{ flexDirection: "row", borderTopWidth: 0.75, borderTopColor: colour.ink, paddingTop: 4, marginTop: 6 }} wrap={false}>
            {(
              [
                ["Gross CO2", m.co2.gross],
                ["Deducted (transferred)", m.co2.deducted],
                ["Net CO2", m.co2.net],
              ] as const
            ).map(([label, q], i) => (
              <View key={i} style={{ flex: 1, paddingRight: 8 }}>
                <Text style={[styles.small, styles.muted]}>{label}</Text>
                <QtyText q={q} strong={i === 2} left />
              </View>
            ))}
          </View>
        </Section>

        <TransfersBlock n="8" rows={m.transfers} note={m.co2.deductionNote} />
        <IntensityBlock n="9" rows={m.intensities} />
        <UncertaintyBlock n="10" rows={m.uncertainty} />
        <FlagsBlock n="11" rows={m.flags} />
        <RevisionsBlock n="12" rows={m.revisions} />
        <CautionsBlock items={m.cautions} />
        {m.evidence ? <EvidenceBlock e={m.evidence} /> : null}
        <AppendixBlock rows={m.appendix} />
      </Page>
    </Document>
  );
}
