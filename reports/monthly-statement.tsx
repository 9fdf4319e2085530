import { Document, Page, Text, View } from "@react-pdf/renderer";
import type { MonthlyStatementModel } from "./model";
import { CautionsBlock, EvidenceBlock, FlagsBlock, GasTable, IntensityBlock, MethodBlock, RevisionsBlock, SignOffBlock, UncertaintyBlock } from "./parts/blocks";
import { Footer, RunningHead, TitleBlock } from "./parts/frame";
import { DataTable, QtyText, Section, Status } from "./parts/primitives";
import { colour, styles } from "./parts/theme";

/** The monthly greenhouse-gas statement. Lays out the model; computes nothing. */
export function MonthlyStatement({ model: m }: { model: MonthlyStatementModel }) {
  const h = m.header;
  return (
    <Document
      title={`Monthly GHG statement ${h.siteCode} ${h.period} rev ${h.revision}`}
      author={h.organisation}
      subject={`Greenhouse-gas statement, ${h.siteName}, ${h.periodLabel}`}
      creator="Synledger"
      producer="Synledger"
    >
      <Page size="A4" style={styles.page}>
        <RunningHead h={h} kind="Monthly statement" />
        <Footer verifyAt={m.signOff.verifyAt} />
        <TitleBlock h={h} title="Monthly greenhouse-gas statement" />

        <MethodBlock n="1" m={m.method} />

        <Section n="2" title="Inputs">
          <DataTable
            columns={[
              { title: "Stream", flex: 3, cell: (r) => r.stream },
              { title: "Kind", flex: 1.8, cell: (r) => r.kind },
              { title: "Quantity", flex: 2.6, numeric: true, cell: (r) => <QtyText q={r.quantity} /> },
              { title: "Data source", flex: 3.6, cell: (r) => r.dataSource },
              { title: "Uncertainty", flex: 1.4, numeric: true, cell: (r) => r.uncertainty },
            ]}
            rows={m.inputs}
          />
        </Section>

        <Section n="3" title="Element balances and closure">
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
          {m.reconciliation.map((t, i) => (
            <Text key={i} style={[styles.small, { marginTop: 3 }]}>
              {t}
            </Text>
          ))}
        </Section>

        <Section n="4" title="Emissions by source and gas">
          <DataTable
            columns={[
              { title: "Source", flex: 2.6, cell: (r) => r.source },
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
        </Section>

        <Section n="5" title="Gross, deducted and net CO2">
          <View style={{ flexDirection: "row", borderTopWidth: 0.75, borderTopColor: colour.ink, paddingTop: 4 }} wrap={false}>
            {(
              [
                ["Gross CO2", m.co2.gross],
                ["Deducted (transferred)", m.co2.deducted],
                ["Net CO2", m.co2.net],
              ] as const
            ).map(([label, q], i) => (
              <View key={i} style={{ flex: 1, paddingRight: 8 }}>
                <Text style={[styles.small, styles.muted]}>{label}</Text>
                <View style={{ fontSize: i === 2 ? 13 : 11 }}>
                  <QtyText q={q} strong={i === 2} left />
                </View>
              </View>
            ))}
          </View>
          <Text style={[styles.small, styles.muted, { marginTop: 3 }]}>{m.co2.deductionNote}</Text>
        </Section>

        <IntensityBlock n="6" rows={m.intensities} />
        <UncertaintyBlock n="7" rows={m.uncertainty} />
        <FlagsBlock n="8" rows={m.flags} />
        <RevisionsBlock n="9" rows={m.revisions} />
        <CautionsBlock items={m.cautions} />
        {m.evidence ? <EvidenceBlock e={m.evidence} /> : null}
        <SignOffBlock s={m.signOff} />
      </Page>
    </Document>
  );
}
