/**
 * Which meter the reconciliation names as most likely wrong. Several meters can fail their
 * individual test in a month where one is off: the adjustment of the faulty one is spread over
 * the meters it is balanced against. The one with the largest test statistic (and any that cannot
 * be told apart from it) is named; the others are carried along by it, and naming them would
 * blame good meters. One rule for the live balance, the month's pages, the series and the PDF.
 */
import { Dec } from "./decimal";

export interface SuspectCandidate {
  id: string;
  suspect: boolean;
  test_statistic: Dec | string | null;
}

export function namedSuspects(streams: readonly SuspectCandidate[] | null | undefined): string[] {
  const flagged = (streams ?? []).filter((s) => s.suspect && s.test_statistic !== null);
  if (flagged.length === 0) return [];
  const stat = (s: SuspectCandidate) => new Dec(s.test_statistic as Dec | string);
  const top = flagged.reduce((a, s) => (stat(s).gt(a) ? stat(s) : a), stat(flagged[0]));
  return flagged.filter((s) => stat(s).minus(top).abs().lte(top.times("1e-20"))).map((s) => s.id);
}
