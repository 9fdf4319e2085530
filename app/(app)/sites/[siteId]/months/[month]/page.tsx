import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { MonthEntryForm } from "@/components/month/month-entry-form";
import { monthEntryProps } from "@/components/month/month-entry-props";
import { formatDateTime, monthLabel } from "@/reports/format";
import { MonthStateBadge } from "@/components/ui/month-state";
import { link, pageTitle } from "@/components/ui/styles";
import { getDb } from "@/db";
import { loadMonthBundle, type MonthBundle } from "@/db/queries/months";
import { latestSnapshot } from "@/db/queries/snapshots";
import { previousAnalyses } from "@/db/queries/streams";
import { can, requirePageActor } from "@/lib/auth/guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { documentInput, isFrozenState } from "@/lib/ledger/month-runs";
import { isMonthKey, monthTiming } from "@/lib/period";
import { MonthTimingNotice } from "@/components/month/month-timing";
import { EMISSIONS_METHOD_LABELS, METERING_REFERENCE_LABELS } from "@/lib/validations/site";

type Params = { siteId: string; month: string };

interface FrozenDocument {
  method: { emissions: string; factor_set: string; gwp: string };
  streams: { id: string; kind: string; analysis?: string; fate?: string; destination?: string; uncertainty_pct?: string; factor_t_per_MWh?: string; factor_t_per_GJ?: string; meter?: string }[];
}

/** The site's streams as the frozen document defined them (kind, analysis, fate, uncertainty, factor, meter). */
function withFrozenStreams(bundle: MonthBundle, doc: FrozenDocument): MonthBundle {
  const frozen = new Map(doc.streams.map((s) => [s.id, s]));
  return {
    ...bundle,
    streams: bundle.streams.map((s) => {
      const f = frozen.get(s.key);
      if (!f) return s;
      return {
        ...s,
        kind: f.kind as typeof s.kind,
        analysisKey: f.analysis ?? null,
        fate: f.fate ?? null,
        destination: f.destination ?? null,
        uncertaintyPct: f.uncertainty_pct ?? null,
        indirectFactor: f.factor_t_per_MWh ?? f.factor_t_per_GJ ?? null,
        meterTag: f.meter ?? null,
      };
    }),
  };
}

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { month } = await params;
  return { title: isMonthKey(month) ? monthLabel(month) : "Month" };
}

/**
 * One site's month: the entry form for process engineers, the same figures read-only for
 * everyone else. Another organisation's site is a plain 404, so its existence is not revealed.
 */
export default async function MonthPage({ params }: { params: Promise<Params> }) {
  const { siteId, month } = await params;
  const actor = await requirePageActor();
  if (!isMonthKey(month)) notFound();
  const db = getDb();
  const bundle = await loadMonthBundle(db, actor.organisationId, siteId, month);
  if (!bundle) notFound();
  const { site, month: record } = bundle;
  const timing = monthTiming(month);
  if (timing.kind === "future") {
    return (
      <div className="space-y-4">
        <p className="text-sm text-ink-soft">
          {site.name} <span className="num text-ink-faint">{site.code}</span>
        </p>
        <h1 className={pageTitle}>{monthLabel(month)}</h1>
        <MonthTimingNotice period={month} timing={timing} coveredThrough={null} />
      </div>
    );
  }
  const previous = await previousAnalyses(db, site.id, month);
  const frozen = record && isFrozenState(record.state) ? await latestSnapshot(db, record.id, record.revision) : null;
  // A frozen month is shown with the stream definitions and method it was frozen with, so the
  // balance beside the read-only form is the frozen one, whatever the site's settings say now.
  const frozenDoc = frozen ? (JSON.parse(frozen.documentText) as FrozenDocument) : null;
  const method = frozenDoc?.method ?? documentInput(bundle, month).method;

  let readOnlyReason: string | null = null;
  if (record && isFrozenState(record.state)) {
    readOnlyReason = `${monthLabel(month)} is ${record.state.replace("_", " ")}, so its figures are frozen${frozen ? ` (revision ${record.revision}, frozen ${formatDateTime(frozen.createdAt)}, document SHA-256 ${frozen.documentSha256.slice(0, 12)}…)` : ""}. Correcting them means reopening the month with a written reason, which starts a new revision.`;
  } else if (!can(actor, "month:enter")) {
    readOnlyReason = `You are signed in as ${actor.roles.map((r) => ROLE_LABELS[r]).join(" and ")}: the site's process engineers enter these figures, and you see them as they are saved.`;
  } else if (site.archivedAt) {
    readOnlyReason = `${site.name} is archived: its months can be read but no longer changed.`;
  }
  const props = monthEntryProps(frozenDoc ? withFrozenStreams(bundle, frozenDoc) : bundle, previous);

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="text-sm text-ink-soft">
            {site.name} <span className="num text-ink-faint">{site.code}</span> ·{" "}
            <Link className={link} href={`/sites/${site.id}/months/${month}/review`}>
              review and sign-off
            </Link>
            {/* The CSV import wizard had no way in from the app: it opens from the month it fills. */}
            {can(actor, "month:enter") && !site.archivedAt ? (
              <>
                {" "}
                ·{" "}
                <Link className={link} href={`/sites/${site.id}/import`}>
                  import figures from a CSV file
                </Link>
              </>
            ) : null}
          </p>
          <h1 className={pageTitle}>{monthLabel(month)}</h1>
        </div>
        <div className="text-right text-sm">
          <MonthStateBadge state={record?.state ?? null} />
          {record ? (
            <p className="num mt-0.5 text-xs text-ink-soft">
              rev. {record.revision} · version {record.version} · changed {formatDateTime(record.updatedAt)}
            </p>
          ) : null}
        </div>
      </div>

      {timing.kind === "in-progress" ? <MonthTimingNotice period={month} timing={timing} coveredThrough={record?.coveredThrough ?? null} /> : null}

      <dl className="grid grid-cols-2 gap-x-6 gap-y-1 border border-rule bg-white px-4 py-2.5 text-sm sm:grid-cols-4">
        <div>
          <dt className="text-xs text-ink-soft">Metering reference</dt>
          <dd className="num">{METERING_REFERENCE_LABELS[site.meteringReference]}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Balance tolerance</dt>
          <dd className="num">±{site.closureTolerancePct} %</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Emissions method</dt>
          <dd>{EMISSIONS_METHOD_LABELS[method.emissions as keyof typeof EMISSIONS_METHOD_LABELS] ?? method.emissions}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">Factor set · GWP</dt>
          <dd className="num">
            {method.factor_set} · {method.gwp}
          </dd>
        </div>
      </dl>

      <MonthEntryForm
        key={`${site.id}/${month}`}
        siteId={site.id}
        period={month}
        version={record?.version ?? 0}
        context={{ siteName: site.name, period: month, method, tolerancePct: frozen?.closureTolerancePct ?? site.closureTolerancePct }}
        readOnlyReason={readOnlyReason}
        {...props}
      />
    </div>
  );
}
