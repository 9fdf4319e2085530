import { Document, Page, Text, View } from "@react-pdf/renderer";
import { COMMUNICATION_FIGURE_ROWS, type CbamCommunication } from "@/lib/ledger/cbam-communication";
import { fixed } from "@/reports/format";
import { CautionsBlock, DeclarationBlock, InstallationBlock } from "./parts/blocks";
import { Footer, RunningHead, TitleBlock } from "./parts/frame";
import { DataTable, KeyValues, Section } from "./parts/primitives";
import { styles } from "./parts/theme";
import type { SignOff, StatementHeader } from "./model";

export interface CommunicationModel {
  header: StatementHeader;
  document: CbamCommunication;
  signOff: SignOff;
  cautions: string[];
}

/** The communication of embedded emissions to importers, signed like the statements. */
export function CommunicationStatement({ model: m }: { model: CommunicationModel }) {
  const h = m.header;
  const d = m.document;
  const f = d.figures;
  return (
    <Document
      title={`Embedded emissions of ammonia, ${h.siteName}, ${h.periodLabel}, revision ${h.revision}`}
      author={h.organisation}
      subject={`Communication of embedded emissions to importers, ${h.siteName}, ${h.periodLabel}`}
      creator="Synledger"
      producer="Synledger"
      language="en-GB"
    >
      <Page size="A4" style={styles.page}>
        <RunningHead h={h} kind="Embedded emissions" />
        <Footer verifyAt={m.signOff.verifyAt} />
        <TitleBlock h={h} title="Communication of embedded emissions" />
        <InstallationBlock i={h.installation} />

        <Section n="1" title="The good and the period">
          <KeyValues
            keyWidth={130}
            items={[
              ["Good", `${d.good.description}, CN ${d.good.cn_code}${d.good.cn_status === "unconfirmed" ? " (code unconfirmed)" : ""}`],
              ["Production route", d.good.route],
              ["Period", `${d.period.from} to ${d.period.to} (${d.period.months.length} months computed)`],
              ["Methods", `${d.methodology.emissions_methods.join(", ")}; factor sets ${d.methodology.factor_sets.join(", ")}; GWP ${d.methodology.gwp.join(", ")}`],
            ]}
          />
        </Section>

        <Section n="2" title="Embedded emissions">
          <DataTable<(typeof COMMUNICATION_FIGURE_ROWS)[number]>
            columns={[
              { title: "Figure", flex: 3.2, cell: ([, label]) => label },
              { title: "Value", flex: 1.6, numeric: true, cell: ([key, , places]) => (f[key].value === null ? "not computed" : fixed(f[key].value, places)) },
              { title: "Unit", flex: 1.3, cell: ([key]) => f[key].unit },
              { title: "How it was obtained", flex: 4.2, cell: ([key]) => <Text style={styles.small}>{f[key].how}</Text> },
            ]}
            rows={[...COMMUNICATION_FIGURE_ROWS]}
          />
          {d.shipment ? (
            <Text style={[styles.small, { marginTop: 4 }]}>
              For a shipment of {fixed(d.shipment.quantity_t, 1)} t NH3: direct {fixed(d.shipment.direct_t, 1)} t CO2e, indirect {d.shipment.indirect_t === null ? "not computed" : `${fixed(d.shipment.indirect_t, 1)} t CO2e`}, total{" "}
              {d.shipment.total_t === null ? "not computed" : `${fixed(d.shipment.total_t, 1)} t CO2e`}.
            </Text>
          ) : null}
          <Text style={[styles.small, styles.muted, { marginTop: 3 }]}>Precursors: none counted (no bought-in hydrogen in the records).</Text>
        </Section>

        <Section n="3" title="Data quality and verification">
          <KeyValues
            keyWidth={130}
            items={[
              ["Months signed", `${d.data_quality.months_signed} of ${d.data_quality.months_in_period}${d.data_quality.months_not_signed.length ? `; not signed: ${d.data_quality.months_not_signed.join(", ")}` : ""}`],
              ["Months missing", d.data_quality.months_missing.length ? d.data_quality.months_missing.join(", ") : "none"],
              ["Indirect emissions", d.data_quality.indirect_complete ? "every month's electricity has an emission factor" : "incomplete: a month's electricity has no emission factor"],
              ["Verification", d.verification.note],
            ]}
          />
        </Section>

        <Section n="4" title="Rules applied">
          <View>
            {d.methodology.rules.map((r, i) => (
              <Text key={i} style={[styles.small, { marginBottom: 1.5 }]}>
                {r.text} — {r.status === "confirmed" ? `read in ${r.checked}` : `unconfirmed (${r.checked})`}
              </Text>
            ))}
          </View>
        </Section>

        <DeclarationBlock s={m.signOff} unconfirmed={d.methodology.rules.filter((r) => r.status === "unconfirmed").length + (d.good.cn_status === "unconfirmed" ? 1 : 0)} />
        <Text style={[styles.small, styles.muted, { marginTop: 4 }]}>The machine-readable document (synledger.cbam-communication/1) is carried inside this PDF as cbam-communication.json; the signature covers it.</Text>
        <CautionsBlock items={[...d.cautions, ...m.cautions]} />
      </Page>
    </Document>
  );
}
