import Link from "next/link";
import { FigureTable, MarkText, QtyCell } from "@/components/review/figure-table";
import { MONTH_STATES, type MonthState } from "@/components/ui/month-state";
import { Status } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import type { YearSeries } from "@/lib/ledger/series";
import type { AnnualStatementModel } from "@/reports/model";

const STAT = "border border-rule bg-white px-3 py-2";

/** The year's headline totals with the combined 95 % uncertainty of CO2. */
export function YearTotals({ model, series }: { model: AnnualStatementModel; series: YearSeries }) {
  const u = model.uncertainty[0];
  const cells: [string, string, string, string?][] = [
    ["Ammonia", model.totals.ammonia, "t NH3"],
    ["Gross CO2", model.totals.grossCo2, "t CO2", u ? `${u.expanded}, 95 %` : undefined],
    ["Deducted", model.totals.deducted, "t CO2"],
    ["Net CO2", model.totals.netCo2, "t CO2", model.uncertainty[1]?.expanded],
    ["CO2e, direct", model.totals.co2e, "t CO2e", model.uncertainty[2]?.expanded],
    ["CO2e intensity", model.totals.intensity, "t CO2e/t NH3"],
  ];
  return (
    <div className="space-y-2">
    <dl className="grid gap-2 sm:grid-cols-3">
      {cells.map(([label, value, unit, note]) => (
        <div key={label} className={STAT}>
          <dt className="text-xs text-ink-soft">{label}</dt>
          <dd>
            <QtyCell q={{ value, unit }} strong />
            {note ? <span className="num block text-xs text-ink-soft">{note}</span> : null}
          </dd>
        </div>
      ))}
    </dl>
      <p className="text-xs text-ink-soft">
        {series.totals.months_included.length} of 12 months counted
        {series.totals.months_left_out_in_progress.length ? ` (${series.totals.months_left_out_in_progress.join(", ")} in progress, left out: provisional)` : ""}. Uncertainty at 95 %: a meter&apos;s calibration error repeats in every month until it is recalibrated, its random part does not; each month&apos;s gas
        analysis is its own; a factor is the same in every month.
      </p>
      {model.uncertainty.length ? (
        <ul className="space-y-0.5 text-xs text-ink-soft">
          {model.uncertainty.filter((r) => r.expanded).map((r) => (
            <li key={r.figure}>
              <span className="font-medium text-ink">{r.figure}</span> {r.expanded}: {r.note}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

type MonthRowView = AnnualStatementModel["months"][number] & { period: string; state: MonthState; statementId: string | null };

/** Months of the year with their state and, where signed, the monthly statement. */
export function YearMonths({ rows, siteId, units }: { rows: MonthRowView[]; siteId: string; units: AnnualStatementModel["units"] }) {
  return (
    <FigureTable
      caption="Months of the year"
      rows={rows}
      columns={[
        { title: "Month", cell: (r) => <Link className={link} href={`/sites/${siteId}/months/${r.period}/review`}>{r.month}</Link> },
        { title: "State", cell: (r) => <Status tone={MONTH_STATES[r.state].tone}>{MONTH_STATES[r.state].label}</Status> },
        { title: "Rev.", numeric: true, cell: (r) => <span className="num">{r.revision}</span> },
        { title: `NH3 (${units.ammonia})`, numeric: true, cell: (r) => <span className="num">{r.ammonia}</span> },
        { title: `Gross CO2 (${units.co2})`, numeric: true, cell: (r) => <span className="num">{r.grossCo2}</span> },
        { title: `Net CO2 (${units.co2})`, numeric: true, cell: (r) => <span className="num">{r.netCo2}</span> },
        { title: `CO2e (${units.co2e})`, numeric: true, cell: (r) => <span className="num">{r.co2e}</span> },
        { title: `Intensity (${units.intensity})`, numeric: true, cell: (r) => <span className="num">{r.intensity}</span> },
        {
          title: "Signed statement",
          cell: (r) => (r.statementId ? <a className={link} href={`/api/v1/statements/${r.statementId}/pdf`}>PDF</a> : <span className="text-ink-soft">—</span>),
        },
      ]}
    />
  );
}

export function YearBySource({ rows }: { rows: { id: string; name: string; co2: string; ch4: string; n2o: string; co2e: string }[] }) {
  return (
    <FigureTable
      caption="Emissions by source, year"
      rows={rows}
      columns={[
        { title: "Source", cell: (r) => r.name },
        { title: "CO2 (t)", numeric: true, cell: (r) => <span className="num">{r.co2}</span> },
        { title: "CH4 (t)", numeric: true, cell: (r) => <span className="num">{r.ch4}</span> },
        { title: "N2O (t)", numeric: true, cell: (r) => <span className="num">{r.n2o}</span> },
        { title: "CO2e (t)", numeric: true, cell: (r) => <span className="num">{r.co2e}</span> },
      ]}
    />
  );
}

export function YearByGas({ model }: { model: AnnualStatementModel }) {
  return (
    <FigureTable
      caption="Emissions by gas, year"
      rows={model.emissionsByGas}
      columns={[
        { title: "Gas", cell: (r) => r.gas },
        { title: "Mass", numeric: true, cell: (r) => <QtyCell q={r.mass} /> },
        { title: "GWP (100-year)", numeric: true, cell: (r) => <span className="num">{r.gwp}</span> },
        { title: "CO2e", numeric: true, cell: (r) => <QtyCell q={r.co2e} /> },
      ]}
    />
  );
}

export function YearIntensities({ model }: { model: AnnualStatementModel }) {
  return (
    <FigureTable
      caption="Intensities of the year against benchmarks"
      rows={model.intensities}
      columns={[
        { title: "Measure", cell: (r) => r.measure },
        { title: "Year", numeric: true, cell: (r) => <QtyCell q={r.value} /> },
        { title: "Reference", numeric: true, cell: (r) => <QtyCell q={r.benchmark} /> },
        { title: "Position", cell: (r) => <MarkText mark={r.mark}>{r.position}</MarkText> },
        { title: "Source", cell: (r) => <span className="text-xs text-ink-soft">{r.benchmarkSource}</span> },
      ]}
    />
  );
}
