import type { YearSeries } from "@/lib/ledger/series";
import { fixed, signed } from "@/reports/format";
import { STATE_LABELS } from "@/lib/month-states";


/** The numbers behind the charts, month by month, units in the column headings. */
export function SeriesTable({ series }: { series: YearSeries }) {
  const head = [
    ["Month", ""],
    ["State", ""],
    ["Ammonia", "t NH3"],
    ["CO2e intensity", "t CO2e/t NH3"],
    ["Direct CO2 intensity", "t CO2/t NH3"],
    ["Energy", "GJ NCV/t NH3"],
    ["Theoretical minimum", "GJ NCV/t NH3"],
    ["Carbon closure", "%"],
    ["Nitrogen closure", "%"],
    ["Hydrogen closure", "%"],
    ["H2:N2", "mol/mol"],
    ["Meter named", ""],
  ];
  const t = series.totals;
  const cell = "px-2.5 py-1 text-right num whitespace-nowrap";
  return (
    <div className="relative overflow-x-auto border border-rule bg-white" role="region" aria-label="Monthly figures" tabIndex={0}>
      <table className="w-full border-collapse text-sm">
        <caption className="px-2.5 py-1.5 text-left text-xs text-ink-soft">
          {series.site.name}, {series.year}: monthly figures from the stored months. Closure tolerance ±{series.tolerance_pct} %; H2:N2 against {series.h2_n2_target} : 1.
        </caption>
        <thead>
          <tr className="border-b border-rule-strong bg-paper-deep">
            {head.map(([h, u], i) => (
              <th key={h} scope="col" className={`px-2.5 py-1.5 text-xs font-semibold text-ink-soft ${i > 1 && i < 11 ? "text-right" : "text-left"}`}>
                {h}
                {u ? <span className="block font-normal">({u})</span> : null}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {series.months.map((m) => (
            <tr key={m.month} className="border-b border-rule">
              <th scope="row" className="px-2.5 py-1 text-left font-normal num">
                {m.month}
              </th>
              <td className="px-2.5 py-1">{m.state ? STATE_LABELS[m.state] : "Not started"}</td>
              <td className={cell}>{fixed(m.ammonia_t, 1)}</td>
              <td className={cell}>{fixed(m.co2e_t_per_t_nh3, 3)}</td>
              <td className={cell}>{fixed(m.co2_t_per_t_nh3, 3)}</td>
              <td className={cell}>{fixed(m.gj_lhv_per_t_nh3, 2)}</td>
              <td className={cell}>{fixed(m.theoretical_min_gj_lhv_per_t_nh3, 2)}</td>
              <td className={cell}>{signed(m.closure_pct.carbon, 2)}</td>
              <td className={cell}>{signed(m.closure_pct.nitrogen, 2)}</td>
              <td className={cell}>{signed(m.closure_pct.hydrogen, 2)}</td>
              <td className={cell}>{fixed(m.h2_n2_ratio, 3)}</td>
              <td className="px-2.5 py-1">{m.suspect_meters.join(", ") || "—"}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="border-t-2 border-rule-strong font-semibold">
            <th scope="row" className="px-2.5 py-1 text-left">
              Year to date
            </th>
            <td className="px-2.5 py-1 font-normal text-ink-soft">
              {t.months_included.length} complete months{t.months_left_out_in_progress.length ? ` (${t.months_left_out_in_progress.join(", ")} in progress, not counted)` : ""}
            </td>
            <td className={cell}>{fixed(t.ammonia_t, 1)}</td>
            <td className={cell}>{fixed(t.co2e_t_per_t_nh3, 3)}</td>
            <td className={cell}>{fixed(t.co2_t_per_t_nh3, 3)}</td>
            <td className={cell}>{fixed(t.gj_lhv_per_t_nh3, 2)}</td>
            <td className={cell}>{fixed(t.theoretical_min_gj_lhv_per_t_nh3, 2)}</td>
            <td colSpan={5} />
          </tr>
        </tfoot>
      </table>
    </div>
  );
}
