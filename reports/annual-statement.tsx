import { Document, Page, Text, View } from "@react-pdf/renderer";
import type { AnnualMonthRow, AnnualSourceRow, AnnualStatementModel, EuEtsSection } from "./model";
import { CautionsBlock, DeclarationBlock, FlagsBlock, GasTable, InstallationBlock, IntensityBlock, MethodBlock, RevisionsBlock, UncertaintyBlock } from "./parts/blocks";
import { Footer, RunningHead, TitleBlock } from "./parts/frame";
import { DataTable, KeyValues, Section } from "./parts/primitives";
import { styles } from "./parts/theme";

type YearRow = Omit<AnnualMonthRow, "month" | "revision" | "status"> & Partial<Pick<AnnualMonthRow, "month" | "revision" | "status">>;

/** The annual statement: the twelve signed months, their totals and the combined uncertainty. */
export function AnnualStatement({ model: m }: { model: AnnualStatementModel }) {
  const h = m.header;
  const u = m.units;
  const total: YearRow = { ...m.totals, month: "Year", revision: "", status: "" };
  return (
    <Document
      title={`Annual greenhouse-gas statement, ${h.siteName}, ${h.period}, revision ${h.revision}`}
      author={h.organisation}
      subject={`Greenhouse-gas statement, ${h.siteName}, ${h.periodLabel}`}
      creator="Synledger"
      producer="Synledger"
      language="en-GB"
    >
      <Page size="A4" style={styles.page}>
        <RunningHead h={h} kind="Annual statement" />
        <Footer verifyAt={m.signOff.verifyAt} />
        <TitleBlock h={h} title="Annual greenhouse-gas statement" />
        <InstallationBlock i={h.installation} />

        <Section n="1" title="Months of the year">
          <DataTable<YearRow>
            columns={[
              { title: "Month", flex: 1.6, cell: (r) => r.month ?? "" },
              { title: "Rev.", flex: 0.7, numeric: true, cell: (r) => r.revision ?? "" },
              { title: `NH3 (${u.ammonia})`, flex: 1.8, numeric: true, cell: (r) => r.ammonia },
              { title: `Gross CO2 (${u.co2})`, flex: 1.9, numeric: true, cell: (r) => r.grossCo2 },
              { title: `Deducted (${u.co2})`, flex: 1.8, numeric: true, cell: (r) => r.deducted },
              { title: `Net CO2 (${u.co2})`, flex: 1.9, numeric: true, cell: (r) => r.netCo2 },
              { title: `CO2e (${u.co2e})`, flex: 1.9, numeric: true, cell: (r) => r.co2e },
              { title: `Intensity (${u.intensity})`, flex: 2.2, numeric: true, cell: (r) => r.intensity },
              { title: "Status", flex: 1.6, cell: (r) => r.status ?? "" },
            ]}
            rows={m.months}
            total={total}
          />
          <Text style={[styles.small, styles.muted, { marginTop: 3 }]}>Each month is also a signed statement of its own, at the revision shown (section 3).</Text>
        </Section>
        <DeclarationBlock s={m.signOff} unconfirmed={m.unconfirmedCount} />

        <MethodBlock n="2" m={m.method} breakBefore />

        <Section n="3" title="Monthly statements this statement adds up">
          <DataTable<AnnualSourceRow>
            columns={[
              { title: "Month", flex: 1.4, cell: (r) => r.month },
              { title: "Rev.", flex: 0.5, numeric: true, cell: (r) => r.revision },
              { title: "Statement reference", flex: 3.2, cell: (r) => <Text style={{ fontFamily: "Plex Mono", fontSize: 7 }}>{r.statementRef}</Text> },
              { title: "Frozen result, SHA-256 (first 32 digits)", flex: 3.4, cell: (r) => <Text style={{ fontFamily: "Plex Mono", fontSize: 7 }}>{r.resultSha256.slice(0, 32)}</Text> },
            ]}
            rows={m.sources}
            empty="No month of the year is signed."
          />
        </Section>

        <Section n="4" title="Emissions by gas, year">
          <GasTable rows={m.emissionsByGas} />
        </Section>

        <IntensityBlock n="5" rows={m.intensities} />
        <UncertaintyBlock n="6" rows={m.uncertainty} title="Combined uncertainty (95 % confidence)" />
        <FlagsBlock n="7" rows={m.flags} />
        <RevisionsBlock n="8" rows={m.revisions} />
        {m.euEts ? <EuEtsBlock n="9" e={m.euEts} /> : null}
        <CautionsBlock items={m.cautions} />
      </Page>
    </Document>
  );
}

/** EU trading-system monitoring check and CBAM embedded emissions: an indication for the monitoring plan and for importers. */
function EuEtsBlock({ n, e }: { n: string; e: EuEtsSection }) {
  return (
    <Section n={n} title="EU emissions trading monitoring check and CBAM embedded emissions" breakBefore>
      <KeyValues items={e.facts} keyWidth={120} />
      <DataTable<EuEtsSection["streams"][number]>
        columns={[
          { title: "Source stream", flex: 1.6, cell: (r) => r.id },
          { title: "Class", flex: 1.1, cell: (r) => r.cls },
          { title: "CO2e (t)", flex: 1.3, numeric: true, cell: (r) => r.co2e },
          { title: "Share (%)", flex: 1, numeric: true, cell: (r) => r.share },
          { title: "Meter, year (%)", flex: 1.3, numeric: true, cell: (r) => r.uncertainty },
          { title: "Activity tier", flex: 1.2, cell: (r) => r.tier },
          { title: "Factors", flex: 2, cell: (r) => r.factors },
        ]}
        rows={e.streams}
        empty="No source stream this year."
      />
      {e.shortfalls.length ? (
        <View style={{ marginTop: 3 }}>
          {e.shortfalls.map((s, i) => <Text key={i} style={styles.small}>Shortfall: {s}</Text>)}
        </View>
      ) : (
        <Text style={[styles.small, { marginTop: 3 }]}>Every source stream meets the tiers its category and class require.</Text>
      )}
      {e.report ? (
        <View style={{ marginTop: 5 }}>
          <Text style={[styles.small, { fontWeight: 600, marginBottom: 2 }]}>Annual emissions report content</Text>
          <DataTable<NonNullable<EuEtsSection["report"]>["streams"][number]>
            columns={[
              { title: "Source stream", flex: 1.2, cell: (r) => r.id },
              { title: "Activity data", flex: 2, numeric: true, cell: (r) => r.activity },
              { title: "NCV (GJ/t)", flex: 1.1, numeric: true, cell: (r) => r.ncv },
              { title: "EF (t CO2/TJ)", flex: 1.1, numeric: true, cell: (r) => r.ef },
              { title: "Oxidation factor", flex: 1.8, cell: (r) => <Text style={styles.small}>{r.oxidation}</Text> },
              { title: "Tiers", flex: 2.2, cell: (r) => <Text style={styles.small}>{r.tiers}</Text> },
              { title: "CO2e (t)", flex: 1.2, numeric: true, cell: (r) => r.co2e },
            ]}
            rows={e.report.streams}
          />
          {[...e.report.transfers, ...e.report.gaps].map((x, i) => <Text key={i} style={styles.small}>{x}</Text>)}
        </View>
      ) : null}
      <View style={{ marginTop: 5 }}>
        <KeyValues items={e.cbam} keyWidth={120} />
      </View>
      {e.notes.map((x, i) => <Text key={i} style={[styles.small, styles.muted]}>{x}</Text>)}
    </Section>
  );
}
