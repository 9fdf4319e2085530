import Link from "next/link";
import { Status } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { attentionItems, monthsLabel, type AttentionTone } from "./attention";
import { getDb } from "@/db";
import { listStreams } from "@/db/queries/streams";
import { overdueMeters } from "@/lib/ledger/calibration";
import { loadSeries } from "./load";

const TONE_WORD: Record<AttentionTone, { tone: "fault" | "warn" | "pending"; word: string }> = {
  fault: { tone: "fault", word: "Blocked" },
  warn: { tone: "warn", word: "Check" },
  pending: { tone: "pending", word: "Next step" },
};

/**
 * Everything in the year that waits for a person, across the organisation's sites; the reader's
 * own items first, so each role finds its work at the top.
 */
export async function AttentionList({ organisationId, sites, year, roles }: { organisationId: string; sites: { id: string; name: string }[]; year: string; roles: Role[] }) {
  const perSite = await Promise.all(
    sites.map(async (s) => ({ site: s, series: await loadSeries(organisationId, s.id, year), streams: (await listStreams(getDb(), s.id)).filter((x) => !x.archivedAt) })),
  );
  const today = new Date().toISOString().slice(0, 10);
  const items = perSite.flatMap(({ site, series, streams }) => [
    ...overdueMeters(streams, today).map((o) => ({
      key: `calibration-${o.meter.key}`,
      tone: "warn" as const,
      months: [today.slice(0, 7)],
      what: `meter ${o.meter.meterTag ?? o.meter.key} (${o.meter.name}) calibration overdue since ${o.dueOn}`,
      who: "process_engineer" as Role,
      todo: "have it calibrated; an administrator records the new date",
      href: `/settings/sites/${site.id}`,
      site,
    })),
    ...(series ? attentionItems(series, site.id).map((i) => ({ ...i, site })) : []),
  ]);
  const mine = (who: Role) => (roles.includes(who) ? 0 : 1);
  items.sort((a, b) => mine(a.who) - mine(b.who));
  if (items.length === 0) return <p className="border border-rule bg-white px-4 py-3 text-ink-soft">Nothing in {year} waits for anyone.</p>;
  return (
    <ul className="divide-y divide-rule border border-rule bg-white text-sm">
      {items.map((i) => (
        <li key={`${i.site.id}-${i.key}`} className="grid gap-x-3 gap-y-0.5 px-4 py-2 sm:grid-cols-[7rem_minmax(0,1fr)_auto]">
          <Status tone={TONE_WORD[i.tone].tone}>{TONE_WORD[i.tone].word}</Status>
          <span>
            <span className="font-medium">{i.site.name}</span> · <span className="num">{monthsLabel(i.months)}</span> {i.what}
            <span className="text-ink-soft">
              {" "}
              — <span className={roles.includes(i.who) ? "font-semibold text-ink" : ""}>{ROLE_LABELS[i.who].toLowerCase()}</span> to {i.todo}
            </span>
          </span>
          <Link className={link} href={i.href}>
            Open<span className="sr-only"> {i.site.name} {i.months[0]}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
