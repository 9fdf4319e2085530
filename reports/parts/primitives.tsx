import type { ReactNode } from "react";
import { Circle, Line, Path, Polygon, Svg, Text, View } from "@react-pdf/renderer";
import type { Mark, Qty } from "../model";
import { colour, styles } from "./theme";

/** A number in tabular mono with its unit in small sans beside it; units are never dropped. */
export function QtyText({ q, strong, left }: { q: Qty; strong?: boolean; left?: boolean }) {
  return (
    <Text style={[styles.num, strong ? { fontWeight: 500 } : {}, left ? { textAlign: "left" } : {}]}>
      {q.value}
      {q.unit ? <Text style={styles.unit}> {q.unit}</Text> : null}
    </Text>
  );
}

/** Drawn status marks, so status survives grey printing and colour blindness. */
export function StatusMark({ mark }: { mark: Mark }) {
  const s = { stroke: colour.ink, strokeWidth: 1.1, fill: "none" };
  return (
    <Svg width={8} height={8} viewBox="0 0 10 10" style={{ marginRight: 3, marginTop: 1 }}>
      {mark === "ok" ? (
        <>
          <Circle cx={5} cy={5} r={4.3} {...s} />
          <Path d="M2.8 5.2 L4.4 6.8 L7.3 3.5" {...s} />
        </>
      ) : mark === "attention" ? (
        <>
          <Polygon points="5,0.8 9.4,9 0.6,9" {...s} />
          <Line x1={5} y1={3.8} x2={5} y2={6.3} {...s} />
          <Circle cx={5} cy={7.7} r={0.45} fill={colour.ink} />
        </>
      ) : mark === "fail" ? (
        <>
          <Polygon points="3,0.7 7,0.7 9.3,3 9.3,7 7,9.3 3,9.3 0.7,7 0.7,3" {...s} />
          <Path d="M3.4 3.4 L6.6 6.6 M6.6 3.4 L3.4 6.6" {...s} />
        </>
      ) : (
        <>
          <Circle cx={5} cy={5} r={4.3} {...s} />
          <Line x1={5} y1={4.4} x2={5} y2={7.4} {...s} />
          <Circle cx={5} cy={2.9} r={0.45} fill={colour.ink} />
        </>
      )}
    </Svg>
  );
}

export function Status({ mark, text }: { mark: Mark; text: string }) {
  return (
    <View style={{ flexDirection: "row" }}>
      <StatusMark mark={mark} />
      <Text style={{ flex: 1 }}>{text}</Text>
    </View>
  );
}

/** `keep`: a short section that moves to the next page whole rather than leave its heading behind. */
export function Section({ n, title, children, breakBefore, keep }: { n: string; title: string; children: ReactNode; breakBefore?: boolean; keep?: boolean }) {
  return (
    <View style={styles.section} break={breakBefore} wrap={keep ? false : undefined}>
      {/* minPresenceAhead keeps a heading from being stranded at the foot of a page. */}
      <View style={styles.sectionHead} minPresenceAhead={110}>
        <View style={styles.sectionBar} />
        <Text style={styles.sectionNumber}>{n}</Text>
        <Text style={styles.sectionTitle}>{title}</Text>
      </View>
      {children}
    </View>
  );
}

export interface Column<R> {
  title: string;
  /** Relative width. */
  flex: number;
  numeric?: boolean;
  cell: (row: R) => ReactNode;
}

/** A ruled table whose header repeats when it breaks across pages. */
export function DataTable<R>({ columns, rows, total, empty }: { columns: Column<R>[]; rows: R[]; total?: R; empty?: string }) {
  const line = (row: R, style: typeof styles.row, i: number) => (
    <View key={i} style={style} wrap={false}>
      {columns.map((c, j) => (
        <View key={j} style={[styles.cell, { flex: c.flex }]}>
          {typeof c.cell(row) === "string" ? <Text style={c.numeric ? styles.num : {}}>{c.cell(row)}</Text> : c.cell(row)}
        </View>
      ))}
    </View>
  );
  return (
    <View style={styles.table}>
      <View style={styles.headRow} fixed>
        {columns.map((c, j) => (
          <Text key={j} style={[styles.headCell, { flex: c.flex, textAlign: c.numeric ? "right" : "left" }]}>
            {c.title}
          </Text>
        ))}
      </View>
      {rows.length === 0 && empty ? <Text style={[styles.muted, { padding: 3 }]}>{empty}</Text> : null}
      {rows.map((r, i) => line(r, styles.row, i))}
      {total ? line(total, styles.totalRow, rows.length) : null}
    </View>
  );
}

export function KeyValues({ items, keyWidth }: { items: [string, ReactNode][]; keyWidth?: number }) {
  return (
    <View>
      {items.map(([k, v], i) => (
        <View key={i} style={styles.keyValue}>
          <Text style={keyWidth ? [styles.key, { width: keyWidth }] : styles.key}>{k}</Text>
          <View style={styles.value}>{typeof v === "string" ? <Text>{v}</Text> : v}</View>
        </View>
      ))}
    </View>
  );
}
