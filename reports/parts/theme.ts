import { StyleSheet } from "@react-pdf/renderer";

/**
 * Statement palette: paper white, ink navy, one verdigris accent. The accent is mid-dark so it
 * prints as a clear grey; meaning never rests on it alone (marks and words carry the status).
 */
export const colour = {
  paper: "#FFFFFF",
  ink: "#1A2B45",
  muted: "#566277",
  rule: "#C8CED8",
  band: "#F1F3F6",
  accent: "#2E7F74",
};

export const styles = StyleSheet.create({
  page: {
    backgroundColor: colour.paper,
    color: colour.ink,
    fontFamily: "Plex Sans",
    // No page-wide lineHeight: in react-pdf 4.9 it stops render-prop text (the page numbers) from printing.
    fontSize: 8.5,
    paddingTop: 54,
    paddingBottom: 50,
    paddingHorizontal: 40,
  },
  runningHead: {
    position: "absolute",
    top: 22,
    left: 40,
    right: 40,
    flexDirection: "row",
    justifyContent: "space-between",
    borderBottomWidth: 0.75,
    borderBottomColor: colour.accent,
    paddingBottom: 4,
    fontSize: 7.5,
    color: colour.muted,
  },
  footer: {
    position: "absolute",
    bottom: 22,
    left: 40,
    right: 40,
    flexDirection: "row",
    justifyContent: "space-between",
    borderTopWidth: 0.5,
    borderTopColor: colour.rule,
    paddingTop: 4,
    fontSize: 7,
    color: colour.muted,
  },
  title: { fontSize: 15, fontWeight: 600, marginBottom: 3 },
  subtitle: { fontSize: 10, color: colour.muted, marginBottom: 10 },
  section: { marginTop: 12 },
  sectionHead: {
    flexDirection: "row",
    alignItems: "center",
    marginBottom: 5,
  },
  sectionBar: { width: 3, height: 11, backgroundColor: colour.accent, marginRight: 6 },
  sectionTitle: { fontSize: 10.5, fontWeight: 600 },
  sectionNumber: { fontFamily: "Plex Mono", fontSize: 9, color: colour.muted, marginRight: 5 },
  table: { borderTopWidth: 0.75, borderTopColor: colour.ink },
  headRow: {
    flexDirection: "row",
    borderBottomWidth: 0.5,
    borderBottomColor: colour.ink,
    paddingVertical: 3,
  },
  headCell: { fontSize: 7.2, fontWeight: 500, color: colour.muted, paddingHorizontal: 3 },
  row: {
    flexDirection: "row",
    borderBottomWidth: 0.4,
    borderBottomColor: colour.rule,
    paddingVertical: 2.6,
  },
  totalRow: {
    flexDirection: "row",
    borderTopWidth: 0.75,
    borderTopColor: colour.ink,
    borderBottomWidth: 0.75,
    borderBottomColor: colour.ink,
    paddingVertical: 3,
    backgroundColor: colour.band,
  },
  cell: { paddingHorizontal: 3 },
  num: { fontFamily: "Plex Mono", textAlign: "right" },
  unit: { fontFamily: "Plex Sans", fontSize: 7, color: colour.muted },
  muted: { color: colour.muted },
  small: { fontSize: 7.5 },
  keyValue: { flexDirection: "row", marginBottom: 2 },
  key: { width: 110, color: colour.muted },
  value: { flex: 1 },
});
