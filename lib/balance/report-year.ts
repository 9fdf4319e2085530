// Plain-text report of an annual roll-up: one row per month, the totals, then the year's
// uncertainty split into its correlated (factor) and independent (meter) parts.
import { uncertaintyLine } from "./report-emissions";
import { fx, table } from "./text-table";
import type { YearRollUp } from "./year";

export function formatYearReport(y: YearRollUp): string {
  const r = y.year;
  const d0 = y.files[0].result.emissions.detail;
  const out: string[] = [
    `Synledger year — ${y.site}, ${r.year} (${r.months_included.length} of 12 months)`,
    `Method ${d0.method}; factor set ${d0.factor_set.id} v${d0.factor_set.version}; GWP100 ${d0.gwp.id}`,
    "",
  ];
  const rows = y.files.map((m) => {
    const d = m.result.emissions.detail;
    return [
      m.doc.month, fx(d.intensity.ammonia_t, 1), fx(d.emissions.co2_t, 1), fx(d.emissions.co2e_t, 1), fx(d.emissions.net_co2e_t, 1),
      fx(d.intensity.co2e_t_per_t_nh3, 4), fx(d.intensity.gj_lhv_per_t_nh3, 3), fx(m.result.balances.carbon.closure_pct, 3), fx(d.uncertainty.co2.u95_t, 1),
    ];
  });
  const e = r.emissions;
  rows.push(["year", fx(r.ammonia_t, 1), fx(e.co2_t, 1), fx(e.co2e_t, 1), fx(e.net_co2e_t, 1), fx(r.intensity.co2e_t_per_t_nh3, 4),
    fx(r.intensity.gj_lhv_per_t_nh3, 3), "", fx(r.uncertainty.co2.u95_t, 1)]);
  out.push(
    table(["month", "NH3 t", "CO2 t", "CO2e t", "net CO2e t", "t CO2e/t NH3", "GJ LHV/t NH3", "C closure %", "CO2 ± t (95 %)"], rows),
    "",
    table(
      ["annual figure", "value", "unit"],
      [
        ["ammonia", fx(r.ammonia_t, 1), "t"],
        ["CO2, gross (direct)", fx(r.co2.gross_t, 1), "t CO2"],
        ["CO2, deductible transfers", fx(r.co2.deductible_t, 1), "t CO2"],
        ["CO2, net", fx(r.co2.net_t, 1), "t CO2"],
        ["CH4", fx(e.ch4_t, 3), "t CH4"],
        ["N2O", fx(e.n2o_t, 4), "t N2O"],
        ["CO2e, direct", fx(e.co2e_t, 1), "t CO2e"],
        ["CO2e, net", fx(e.net_co2e_t, 1), "t CO2e"],
        ...Object.entries(r.transfers_by_destination).map(([k, v]) => [`CO2 transferred to ${k}`, fx(v, 1), "t CO2"]),
        ["direct CO2e intensity", fx(r.intensity.co2e_t_per_t_nh3, 4), "t CO2e/t NH3"],
        ["net CO2e intensity", fx(r.intensity.net_co2e_t_per_t_nh3, 4), "t CO2e/t NH3"],
        [`CO2e with imported electricity and steam${r.intensity.indirect_complete ? "" : " (incomplete)"}`, fx(r.intensity.co2e_incl_indirect_t_per_t_nh3, 4), "t CO2e/t NH3"],
        ["energy, feed + fuel", fx(r.intensity.gj_lhv_per_t_nh3, 3), "GJ LHV/t NH3"],
      ],
      1,
    ),
    "",
    uncertaintyLine("Annual gross CO2", r.uncertainty.co2),
    uncertaintyLine("Annual net CO2", r.uncertainty.net_co2),
    "  (factor part correlated across months, added linearly per factor; meter part independent, added in quadrature)",
    "",
  );
  if (r.months_missing.length) out.push(`Missing months: ${r.months_missing.join(", ")}`, "");
  if (y.flags.length) {
    out.push("Flags");
    for (const fl of y.flags) out.push(`  [${fl.severity}] ${fl.code}: ${fl.message}`);
  }
  return out.join("\n") + "\n";
}
