/**
 * What in a site's year waits for someone, and for whom, read off the year's series: the
 * engine's flags of months not yet balanced, and each month's next life-cycle step. Months with
 * the same step are named together so twelve open months make one line, not twelve.
 */
import type { Role } from "@/lib/auth/roles";
import type { SeriesMonth, YearSeries } from "@/lib/ledger/series";
import { absWithin, signed } from "@/reports/format";

export type AttentionTone = "fault" | "warn" | "pending";

export interface AttentionItem {
  key: string;
  tone: AttentionTone;
  /** "2026-08" or "2026-01, 2026-02 …" */
  months: string[];
  what: string;
  who: Role;
  /** What that person is expected to do. */
  todo: string;
  /** Where to do it: the month's page or its review. */
  href: string;
}

const ELEMENT: Record<"carbon" | "nitrogen" | "hydrogen", string> = { carbon: "carbon", nitrogen: "nitrogen", hydrogen: "hydrogen" };

/** Stream settings (factors, uncertainties) are site set-up, which only administrators change. */
const SETUP_FLAGS = new Set(["electricity-factor-missing", "steam-factor-missing", "uncertainty-incomplete"]);
/** Flags already stated as their own item (closures, suspect meters) or that repeat them. */
const COVERED_FLAGS = /closure-out-of-tolerance$|^reconciliation-|^h2-n2-ratio-out-of-range$/;

const NEXT_STEP: Partial<Record<NonNullable<SeriesMonth["state"]>, { who: Role; todo: string; what: string; review: boolean }>> = {
  open: { who: "process_engineer", todo: "close the balance", what: "open, balances within tolerance", review: false },
  balanced: { who: "environmental_officer", todo: "prepare and send for sign-off", what: "balanced", review: true },
  in_review: { who: "signatory", todo: "sign or return with comments", what: "in review", review: true },
  signed: { who: "environmental_officer", todo: "record the submission to the authority", what: "signed, not yet submitted", review: true },
};

export function attentionItems(series: YearSeries, siteId: string): AttentionItem[] {
  const items: AttentionItem[] = [];
  const monthHref = (m: string, review = false) => `/sites/${siteId}/months/${m}${review ? "/review" : ""}`;
  const streamName = new Map(series.suspect_meters.map((s) => [s.stream, s.meter ? `${s.name} (${s.meter})` : s.name]));
  const grouped = new Map<string, AttentionItem>();
  const group = (key: string, month: string, make: () => Omit<AttentionItem, "months" | "key">) => {
    const g = grouped.get(key);
    if (g) g.months.push(month);
    else grouped.set(key, { key, months: [month], ...make() });
  };

  for (const m of series.months) {
    if (m.state === null) continue;
    if (!m.computes) {
      items.push({ key: `${m.month}-compute`, tone: "fault", months: [m.month], what: "the stored figures do not compute", who: "process_engineer", todo: "complete the figures", href: monthHref(m.month) });
      continue;
    }
    const open = m.state === "open";
    let blocked = false;
    if (open && m.readings && m.readings.present < m.readings.expected) {
      blocked = true;
      items.push({
        key: `${m.month}-readings`, tone: "warn", months: [m.month],
        what: `${m.readings.expected - m.readings.present} of ${m.readings.expected} streams have no reading`,
        who: "process_engineer", todo: "enter or import the missing readings", href: monthHref(m.month),
      });
    }
    for (const el of ["carbon", "nitrogen", "hydrogen"] as const) {
      const c = m.closure_pct[el];
      if (!open || c === null || absWithin(c, series.tolerance_pct)) continue;
      blocked = true;
      items.push({
        key: `${m.month}-${el}`, tone: "warn", months: [m.month],
        what: `${ELEMENT[el]} closure ${signed(c, 1)} % (tolerance ±${series.tolerance_pct} %)`,
        who: "process_engineer", todo: "explain or correct", href: monthHref(m.month),
      });
    }
    if (open && m.suspect_meters.length) {
      blocked = true;
      items.push({
        key: `${m.month}-suspect`, tone: "warn", months: [m.month],
        what: `reconciliation names ${m.suspect_meters.map((s) => streamName.get(s) ?? s).join(", ")}`,
        who: "process_engineer", todo: "check the meter and its reading", href: monthHref(m.month),
      });
    }
    for (const f of m.flags) {
      if (COVERED_FLAGS.test(f.code) || f.code === "months-missing") continue;
      const setup = SETUP_FLAGS.has(f.code);
      if (!setup && !open) continue;
      group(`flag-${f.code}`, m.month, () => ({
        tone: f.severity === "error" ? "fault" : "warn",
        what: f.message.replace(/^./, (c) => c.toLowerCase()),
        who: setup ? "administrator" : "process_engineer",
        todo: setup ? "complete the stream settings of the site" : "look into it",
        href: setup ? `/settings/sites/${siteId}` : monthHref(m.month),
      }));
    }
    const step = NEXT_STEP[m.state];
    if (step && !blocked) group(`state-${m.state}`, m.month, () => ({ tone: "pending", what: step.what, who: step.who, todo: step.todo, href: monthHref(m.month, step.review) }));
  }
  const rank: Record<AttentionTone, number> = { fault: 0, warn: 1, pending: 2 };
  return [...items, ...grouped.values()].sort((a, b) => rank[a.tone] - rank[b.tone] || a.months[0].localeCompare(b.months[0]));
}

/** Consecutive months as ranges: "2026-01 to 2026-09, 2026-11, 2026-12" (months sorted, one year). */
export function monthsLabel(months: string[]): string {
  const runs: string[][] = [];
  for (const m of months) {
    const last = runs[runs.length - 1];
    if (last && Number(m.slice(5)) === Number(last[last.length - 1].slice(5)) + 1) last.push(m);
    else runs.push([m]);
  }
  return runs.map((r) => (r.length > 2 ? `${r[0]} to ${r[r.length - 1]}` : r.join(", "))).join(", ");
}
