// Words for a statement's kind and period, shared by the server pages and the verification drop box.
import { monthLabel } from "@/reports/format";

export type StatementKindName = "monthly" | "annual" | "cbam";

/** How a statement's period reads: a month, a calendar year, or the months a communication of embedded emissions covers. */
export function periodLabelOf(kind: StatementKindName, period: string): string {
  if (kind === "monthly") return monthLabel(period);
  if (kind === "annual") return `Calendar year ${period}`;
  const [from, to] = period.split("..");
  return from === to ? monthLabel(from) : `${monthLabel(from)} to ${monthLabel(to)}`;
}

/** The kind of statement in words, capitalised. */
export function kindLabelOf(kind: StatementKindName): string {
  return kind === "monthly" ? "Monthly" : kind === "annual" ? "Annual" : "Embedded-emissions communication";
}
