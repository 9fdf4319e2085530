import Link from "next/link";
import { QtyCell } from "@/components/review/figure-table";
import { MONTH_STATES } from "@/components/ui/month-state";
import { Status, type StatusTone } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import { absWithin, fixed, percentOver, signed } from "@/reports/format";
import { loadSeries } from "./load";
import { STATE_ORDER, siteSummary, type StateKey } from "./site-summary";

const STATE_LABEL: Record<StateKey, { label: string; tone: StatusTone }> = { ...MONTH_STATES, not_started: { label: "Not started", tone: "info" } };
const MEASURE: Record<string, string> = { co2_t_per_t_nh3: "Direct CO2", co2e_t_per_t_nh3: "Direct CO2e" };

function ClosureCell({ name, value, tolerance }: { name: string; value: string | null; tolerance: string }) {
  const within = value === null || absWithin(value, tolerance);
  return (
    <div>
      <dt className="text-xs text-ink-soft">{name}</dt>
      <dd className="flex flex-wrap items-baseline gap-x-1.5">
        <QtyCell q={{ value: signed(value, 2), unit: "%" }} />
        <Status tone={value === null ? "info" : within ? "ok" : "warn"}>
          <span className="text-xs">{value === null ? "not stated" : within ? "within" : "outside"}</span>
        </Status>
      </dd>
    </div>
  );
}

/** One site's current year: states, completeness, closures, intensities and benchmark position. */
export async function SiteYearCard({ organisationId, site, year }: { organisationId: string; site: { id: string; name: string; code: string }; year: string }) {
  const series = await loadSeries(organisationId, site.id, year);
  if (!series) return null;
  const s = siteSummary(series);
  const tol = series.tolerance_pct;
  const headingId = `site-${site.id}`;

  return (
    <section aria-labelledby={headingId} className="border border-rule bg-white">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule px-4 py-2.5">
        <h2 id={headingId} className="text-base font-semibold">
          {site.name} <span className="num text-sm font-normal text-ink-faint">{site.code}</span>
        </h2>
        <nav aria-label={`${site.name} views`} className="flex gap-3 text-sm">
          <Link className={link} href={`/sites/${site.id}/trends?year=${year}`}>
            Trends
          </Link>
          <Link className={link} href={`/sites/${site.id}/years/${year}`}>
            Year {year}
          </Link>
          <Link className={link} href={`/sites/${site.id}/what-if`}>
            What-if
          </Link>
        </nav>
      </div>

      <div className="grid gap-x-6 gap-y-3 px-4 py-3 md:grid-cols-2">
        <div>
          <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Months of {year}</h3>
          <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-sm">
            {STATE_ORDER.filter((k) => s.byState[k].length > 0).map((k) => (
              <li key={k} title={s.byState[k].join(", ")}>
                <Status tone={STATE_LABEL[k].tone}>
                  {STATE_LABEL[k].label} <span className="num">{s.byState[k].length}</span>
                </Status>
              </li>
            ))}
          </ul>
          <p className="mt-1.5 text-sm text-ink-soft">
            Data: <span className="num text-ink">{s.completeness.present}</span> of <span className="num text-ink">{s.completeness.expected}</span> stream
            readings in {s.completeness.months} started months
            {s.ytd.months_left_out_in_progress.length ? ` (${s.ytd.months_left_out_in_progress.join(", ")} in progress: readings so far)` : ""}
          </p>
        </div>

        <div>
          <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">
            Latest closures{s.latest ? <> · {s.latest.month}</> : null} · tolerance ±{fixed(tol, 1)} %
          </h3>
          {s.latest ? (
            <dl className="mt-1 grid grid-cols-2 gap-2 min-[480px]:grid-cols-3">
              <ClosureCell name="Carbon" value={s.latest.closures.carbon} tolerance={tol} />
              <ClosureCell name="Nitrogen" value={s.latest.closures.nitrogen} tolerance={tol} />
              <ClosureCell name="Hydrogen" value={s.latest.closures.hydrogen} tolerance={tol} />
            </dl>
          ) : (
            <p className="mt-1 text-sm text-ink-soft">No month computes yet.</p>
          )}
        </div>

        <div>
          <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Year to date ({s.ytd.months_included.length} complete months)</h3>
          {s.ytd.months_left_out_in_progress.length ? (
            <p className="text-xs text-ink-soft">
              <Status tone="pending">Provisional</Status> {s.ytd.months_left_out_in_progress.join(", ")} is in progress and not counted.
            </p>
          ) : null}
          <dl className="mt-1 grid grid-cols-2 gap-2 text-sm">
            <div>
              <dt className="text-xs text-ink-soft">CO2e intensity</dt>
              <dd>
                <QtyCell q={{ value: fixed(s.ytd.co2e_t_per_t_nh3, 3), unit: "t CO2e/t NH3" }} strong />
              </dd>
            </div>
            <div>
              <dt className="text-xs text-ink-soft">Energy, net calorific value</dt>
              <dd>
                <QtyCell q={{ value: fixed(s.ytd.gj_lhv_per_t_nh3, 2), unit: "GJ NCV/t NH3" }} strong />
                <span className="block text-xs text-ink-soft">
                  theoretical minimum <span className="num">{fixed(s.ytd.theoretical_min_gj_lhv_per_t_nh3, 2)}</span> GJ/t
                </span>
              </dd>
            </div>
          </dl>
        </div>

        <div>
          <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Against the factor set&rsquo;s benchmarks</h3>
          {s.benchmarks.length === 0 ? (
            <p className="mt-1 text-sm text-ink-soft">The factor set names no benchmark in force for {year}.</p>
          ) : (
            <ul className="mt-1 space-y-1 text-sm">
              {s.benchmarks.map((b) => (
                <li key={b.id}>
                  <Status tone={b.above ? "warn" : "ok"}>{b.above ? "Above" : "At or below"}</Status>{" "}
                  <span className="text-ink-soft">{b.label}:</span> {MEASURE[b.compared_with]}{" "}
                  <QtyCell q={{ value: fixed(b.site_value, 3), unit: "" }} /> against <QtyCell q={{ value: fixed(b.value, 3), unit: b.unit }} />
                  {b.site_value ? <span className="text-ink-soft"> ({b.above ? "+" : "−"}{percentOver(b.site_value, b.value)} %)</span> : null}
                </li>
              ))}
            </ul>
          )}
          {s.drivers.length > 0 ? (
            <div className="mt-2 border-l-2 border-warn/50 pl-2.5 text-sm">
              <p className="font-medium">Why: the months above it</p>
              <ul className="mt-0.5 space-y-0.5">
                {s.drivers.map((d) => (
                  <li key={d.month}>
                    <Link className={link} href={`/sites/${site.id}/months/${d.month}/review`}>
                      {d.month}
                    </Link>{" "}
                    <QtyCell q={{ value: fixed(d.value, 3), unit: "t/t NH3" }} />
                    {d.notes.length ? <span className="text-ink-soft">: {d.notes.join("; ")}</span> : <span className="text-ink-soft">: no balance or meter flag</span>}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </div>
      </div>
    </section>
  );
}
