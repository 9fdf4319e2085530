import { FigureTable, QtyCell } from "@/components/review/figure-table";
import { Notice, Status } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import type { yearEuEtsAndCbam } from "@/lib/ledger/year";
import { fixed } from "@/reports/format";

type Figures = NonNullable<ReturnType<typeof yearEuEtsAndCbam>>;
type StreamRow = Figures["euEts"]["source_streams"][number];

const CLASS_LABEL: Record<StreamRow["class"], string> = { major: "Major", minor: "Minor", "de-minimis": "De minimis" };
const STAT = "border border-rule bg-white px-3 py-2";

const tierText = (t: number | null) => (t === null ? "—" : t === 0 ? "below 1" : String(t));

function TierCell({ r }: { r: StreamRow }) {
  if (r.tier_required === null) return <span className="text-ink-soft">no tier needed</span>;
  if (r.tier_achieved === null) return <Status tone="warn">no uncertainty stated</Status>;
  const short = r.tier_achieved < r.tier_required;
  return (
    <Status tone={short ? "warn" : "ok"}>
      {tierText(r.tier_achieved)} of {r.tier_required}
      {short ? ` (needs ±${r.uncertainty_needed_pct} %)` : ""}
    </Status>
  );
}

/** EU trading-system monitoring check of the year: category, materiality, source streams and tiers, the ammonia benchmark. */
export function EuEtsCheck({ figures }: { figures: Figures }) {
  const e = figures.euEts;
  const b = e.benchmark;
  return (
    <div className="space-y-3">
      <dl className="grid gap-2 sm:grid-cols-3">
        <div className={STAT}>
          <dt className="text-xs text-ink-soft">Installation category (Art 19(2))</dt>
          <dd className="text-lg font-semibold">Category {e.installation_category}</dd>
        </div>
        <div className={STAT}>
          <dt className="text-xs text-ink-soft">Emissions read for the category</dt>
          <dd><QtyCell q={{ value: fixed(e.emissions_t, 0), unit: "t CO2e" }} strong /></dd>
        </div>
        <div className={STAT}>
          <dt className="text-xs text-ink-soft">Verifier&apos;s materiality level (2018/2067 Art 23)</dt>
          <dd>
            <span className="num whitespace-nowrap font-semibold">{e.materiality_threshold_pct} %</span>{" "}
            <span className="num whitespace-nowrap text-sm text-ink-soft">= {fixed(e.materiality_threshold_t, 0)} t CO2e</span>
          </dd>
        </div>
      </dl>
      <FigureTable
        caption="Source streams, class and tiers"
        rows={e.source_streams}
        columns={[
          { title: "Source stream", cell: (r) => <span className="num whitespace-nowrap">{r.id}</span> },
          { title: "Class", cell: (r) => CLASS_LABEL[r.class] },
          { title: "CO2e (t)", numeric: true, cell: (r) => <span className="num whitespace-nowrap">{fixed(r.emissions_t, 0)}</span> },
          { title: "Share (%)", numeric: true, cell: (r) => <span className="num">{fixed(r.share_pct, 2)}</span> },
          { title: "Meter, year (±%, 95 %)", numeric: true, cell: (r) => <span className="num">{r.uncertainty_pct === null ? "—" : fixed(r.uncertainty_pct, 2)}</span> },
          { title: "Activity tier reached", cell: (r) => <TierCell r={r} /> },
          {
            title: "Factors",
            cell: (r) =>
              r.factor_tier_required === null ? (
                <span className="text-ink-soft">{r.factor_origin === "analysis" ? "laboratory analysis" : "default values"}</span>
              ) : (
                <Status tone={r.factor_tier_achieved < r.factor_tier_required ? "warn" : "ok"}>
                  {r.factor_origin === "analysis" ? "laboratory analysis" : "default values"}, tier {r.factor_tier_achieved} of {r.factor_tier_required === 2 ? "2a/2b" : r.factor_tier_required}*
                </Status>
              ),
          },
        ]}
      />
      <p className="text-xs text-ink-soft">
        Tiers: Annex II Table 1 for gaseous fuels and fuels used as process input (tier 4 ±1.5 %, 3 ±2.5 %, 2 ±5 %, 1 ±7.5 % over the year). A major stream
        may use one tier lower (category C) or up to two lower (A and B) only where the competent authority accepts it (Art 26(1)). * The calculation-factor tier
        rule (tier 3 for laboratory analyses) was not confirmed in the published text.
      </p>
      {figures.flags.length ? (
        <Notice tone="warn" title="Monitoring shortfalls">
          <ul className="list-disc pl-5">{figures.flags.map((f, i) => <li key={i}>{f.message}</li>)}</ul>
        </Notice>
      ) : (
        <p className="text-sm">Every source stream meets the tiers its category and class require.</p>
      )}
      <div className="text-sm">
        <span className="font-medium">EU ammonia product benchmark: </span>
        {b ? (
          <>
            {b.value === null ? <span className="text-ink-soft">{b.label}: {b.value_note}</span> : <span className="num">{b.value} {b.unit} ({b.source})</span>}; this year{" "}
            <span className="num">{fixed(b.intensity_t_per_t, 3)} t CO2e/t NH3</span> counting CO2 to urea as emitted
            {b.difference_pct === null ? "." : <>, <span className="num">{fixed(b.difference_pct, 1)} %</span> against it.</>}
          </>
        ) : (
          <span className="text-ink-soft">{e.benchmark_note}.</span>
        )}
      </div>
      <ul className="list-disc space-y-0.5 pl-5 text-xs text-ink-soft">
        {e.notes.map((n) => <li key={n}>{n}</li>)}
      </ul>
      <p className="text-xs text-ink-soft">
        An indication for the monitoring plan, not a compliance decision: the competent authority and the verifier decide; follow the regulation&apos;s own text and
        local guidance.
      </p>
    </div>
  );
}

/** CBAM embedded emissions of the year's ammonia, with the communication to importers. */
export function CbamFigures({ figures, siteId, from, to }: { figures: Figures; siteId: string; from: string; to: string }) {
  const c = figures.cbam;
  const api = `/api/v1/sites/${siteId}/embedded-emissions?from=${from}&to=${to}`;
  const cells: [string, string, string][] = [
    ["Ammonia produced", fixed(c.production_t, 1), "t NH3"],
    ["Direct, per tonne", fixed(c.see_direct_t_per_t, 4), "t CO2e/t NH3"],
    ["Indirect, per tonne", c.see_indirect_t_per_t === null ? "not computed" : fixed(c.see_indirect_t_per_t, 4), "t CO2e/t NH3"],
    ["Embedded, per tonne", c.see_total_t_per_t === null ? "not computed" : fixed(c.see_total_t_per_t, 4), "t CO2e/t NH3"],
  ];
  return (
    <div className="space-y-3">
      <dl className="grid gap-2 sm:grid-cols-4">
        {cells.map(([label, value, unit]) => (
          <div key={label} className={STAT}>
            <dt className="text-xs text-ink-soft">{label}</dt>
            <dd><QtyCell q={{ value, unit }} strong /></dd>
          </div>
        ))}
      </dl>
      <p className="text-sm">
        {c.good.description}, CN {c.good.cn_code} <span className="text-ink-soft">(code unconfirmed)</span>; {c.good.route.toLowerCase()}. Direct:{" "}
        <span className="num">{fixed(c.direct_t, 0)} t CO2e</span> (CO2 to urea, <span className="num">{fixed(c.urea_co2_t, 0)} t</span>, counted as emitted;{" "}
        <span className="num">{fixed(c.direct_deducted_t, 0)} t</span> to storage deducted). Indirect:{" "}
        <span className="num">{fixed(c.electricity_mwh, 0)} MWh</span>
        {c.electricity_factor_t_per_mwh ? <> × <span className="num">{c.electricity_factor_t_per_mwh} t CO2/MWh</span></> : null}
        {c.indirect_complete ? <> = <span className="num">{fixed(c.indirect_t, 0)} t CO2</span></> : " — a month's electricity has no emission factor, so none is given"}.
      </p>
      <p className="text-sm">
        Communication to importers:{" "}
        <a className={link} href={`/sites/${siteId}/embedded-emissions?from=${from}&to=${to}`}>prepare and sign it</a> · <a className={link} href={api}>draft JSON ({from} to {to})</a> ·{" "}
        <a className={link} href="/api/v1/schemas/cbam-communication.json">its JSON Schema</a>. Another period or a shipped quantity:{" "}
        <span className="num">?from=YYYY-MM&amp;to=YYYY-MM&amp;shipped_t=…</span>
      </p>
      <p className="text-xs text-ink-soft">
        Not confirmed in the published text: the CN code, that fertilisers count indirect emissions, and the definitive period&apos;s implementing rules. No precursor
        is counted (the plant-month format has no stream for bought-in hydrogen). Check the figures with the importer and the competent authority before they are
        declared.
      </p>
    </div>
  );
}
