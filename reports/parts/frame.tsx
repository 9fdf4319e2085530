import { Text, View } from "@react-pdf/renderer";
import type { StatementHeader } from "../model";
import { KeyValues } from "./primitives";
import { colour, styles } from "./theme";

/** Repeated on every page so a loose page still says which statement it belongs to. */
export function RunningHead({ h, kind }: { h: StatementHeader; kind: string }) {
  return (
    <View style={styles.runningHead} fixed>
      <Text>
        <Text style={{ color: colour.ink, fontWeight: 600 }}>Synledger</Text>  ·  {kind}  ·  {h.siteName}  ·  {h.periodLabel}
      </Text>
      <Text>
        revision <Text style={{ fontFamily: "Plex Mono" }}>{h.revision}</Text>  ·  ref <Text style={{ fontFamily: "Plex Mono" }}>{h.statementRef}</Text>
      </Text>
    </View>
  );
}

export function Footer({ verifyAt }: { verifyAt: string }) {
  return (
    <View style={styles.footer} fixed>
      <Text style={{ flex: 1, paddingRight: 8 }}>Digitally signed PDF: any change breaks the signature. Check a copy at {verifyAt}</Text>
      <Text style={{ width: 60, textAlign: "right" }} render={({ pageNumber, totalPages }) => `page ${pageNumber} of ${totalPages}`} />
    </View>
  );
}

export function TitleBlock({ h, title }: { h: StatementHeader; title: string }) {
  return (
    <View style={{ flexDirection: "row", justifyContent: "space-between", marginBottom: 4 }}>
      <View style={{ flex: 1.15, paddingRight: 10 }}>
        <Text style={styles.title}>{title}</Text>
        <Text style={styles.subtitle}>
          {h.siteName} · {h.periodLabel}
        </Text>
      </View>
      <View style={{ flex: 1, borderLeftWidth: 0.75, borderLeftColor: colour.rule, paddingLeft: 8 }}>
        <KeyValues
          keyWidth={62}
          items={[
            ["Organisation", h.organisation],
            ["Installation", h.siteName],
            ["Period", h.periodLabel.includes(h.period) ? h.periodLabel : `${h.periodLabel} (${h.period})`],
            ["Revision", h.revision],
            ["Prepared", `${h.preparedBy}, ${h.preparedAt}`],
          ]}
        />
      </View>
    </View>
  );
}
