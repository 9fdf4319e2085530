// The emissions part of the text report: method and sources first (a reader must know the rules
// before the numbers mean anything), then the figures, each with its unit. Values not yet read in
// their published text (status "unconfirmed") carry a * and the footnote says what that means.
import type { EmissionsResult } from "../emissions/result";
import type { UncertaintyFigures } from "../emissions/uncertainty";
import { fx, table } from "./text-table";

const star = (status: string) => (status === "unconfirmed" ? "*" : "");

export function uncertaintyLine(label: string, u: UncertaintyFigures): string {
  return `${label}: ${fx(u.value_t, 1)} t ± ${fx(u.u95_t, 1)} t (± ${fx(u.u95_pct, 2)} %, 95 %, k = ${u.coverage_factor.toFixed()}); ` +
    `standard parts: meters ${fx(u.meter_u_std_t, 1)} t, factors ${fx(u.factor_u_std_t, 1)} t` +
    (u.meters_without_uncertainty.length ? `; no uncertainty stated for ${u.meters_without_uncertainty.join(", ")}` : "");
}

export function formatEmissions(d: EmissionsResult): string[] {
  const out: string[] = [];
  const fs = d.factor_set;
  out.push(
    `Emissions — method ${d.method}; factor set ${fs.id} v${fs.version} (${fs.name})${fs.built_in ? "" : ", organisation's own set"}`,
    `GWP100 ${d.gwp.id}: CH4 ${d.gwp.ch4.toFixed()}, N2O ${d.gwp.n2o.toFixed()}${star(d.gwp.status)} (${d.gwp.source})`,
  );
  if (d.screening_estimate) out.push("SCREENING ESTIMATE: tonnes of ammonia × a default factor, not a monitored figure.");
  out.push("");
  const e = d.emissions;
  out.push(
    table(
      ["stream", "kind", "CO2 t", "CH4 t", "N2O t", "CO2e t", "basis"],
      [
        ...d.by_stream.map((s) => [s.id, s.kind, fx(s.co2_t, 1), fx(s.ch4_t, 3), fx(s.n2o_t, 4), fx(s.co2e_t, 1), s.basis]),
        ["total", "", fx(e.co2_t, 1), fx(e.ch4_t, 3), fx(e.n2o_t, 4), fx(e.co2e_t, 1), ""],
      ],
      1,
    ),
    "",
    table(
      ["gas", "t", "GWP100", "t CO2e"],
      [
        ["CO2", fx(d.by_gas.co2.t, 1), "1", fx(d.by_gas.co2.co2e_t, 1)],
        ["CH4", fx(d.by_gas.ch4.t, 3), d.gwp.ch4.toFixed(), fx(d.by_gas.ch4.co2e_t, 1)],
        ["N2O", fx(d.by_gas.n2o.t, 4), d.gwp.n2o.toFixed(), fx(d.by_gas.n2o.co2e_t, 1)],
      ],
    ),
    "",
    table(
      ["CO2", "value", "unit"],
      [
        ["gross (direct, before deductions)", fx(d.co2.gross_t, 1), "t CO2"],
        ["deductible transfers", fx(d.co2.deductible_t, 1), "t CO2"],
        ["net CO2", fx(d.co2.net_t, 1), "t CO2"],
        ["direct CO2e", fx(e.co2e_t, 1), "t CO2e"],
        ["net CO2e", fx(e.net_co2e_t, 1), "t CO2e"],
      ],
      1,
    ),
    uncertaintyLine("Uncertainty of the month's gross CO2", d.uncertainty.co2),
    "",
    table(
      ["CO2 transferred to", "t CO2", "deducted", "rule"],
      Object.entries(d.transfers.by_destination).map(([k, v]) => [k, fx(v.co2_t, 1), v.deducted ? "yes" : "no", v.rule_source]),
      1,
    ),
    "",
  );
  const i = d.intensity;
  const tm = d.theoretical_minimum;
  out.push(
    table(
      ["intensity", "value", "unit"],
      [
        ["direct CO2", fx(i.co2_t_per_t_nh3, 4), "t CO2/t NH3"],
        ["direct CO2e", fx(i.co2e_t_per_t_nh3, 4), "t CO2e/t NH3"],
        ["net CO2e (after deductions)", fx(i.net_co2e_t_per_t_nh3, 4), "t CO2e/t NH3"],
        [`CO2e with imported electricity and steam${i.indirect_complete ? "" : " (incomplete)"}`, fx(i.co2e_incl_indirect_t_per_t_nh3, 4), "t CO2e/t NH3"],
        ["indirect (electricity, steam)", fx(i.indirect_co2e_t, 1), "t CO2e"],
        ["energy, feed + fuel", fx(i.gj_lhv_per_t_nh3, 3), "GJ LHV/t NH3"],
        ["theoretical minimum (feed)", fx(tm?.min_gj_lhv_per_t, 3), "GJ LHV/t NH3"],
        ["above the minimum", fx(tm?.excess_gj_per_t, 3), "GJ LHV/t NH3"],
        ["minimum / actual", fx(tm?.efficiency_pct, 2), "%"],
      ],
      1,
    ),
    "",
  );
  if (d.benchmarks.length)
    out.push(
      table(
        ["benchmark", "value", "unit", "site", "site − bm", "site/bm %"],
        d.benchmarks.map((b) => [`${b.label}${star(b.status)}`, b.value.toFixed(3), b.unit, fx(b.site_value, 4), fx(b.difference, 4), fx(b.ratio_pct, 1)]),
      ),
      "",
    );
  if (d.tiers.length)
    out.push(
      table(
        ["meter", "kind", "U95 %", "activity tier"],
        d.tiers.map((t) => [t.stream_id, t.kind, fx(t.uncertainty_pct, 2), t.tier === null ? "— (no uncertainty stated)" : t.tier === 0 ? "below tier 1" : `tier ${t.tier}`]),
      ),
      "",
    );
  if (d.balance_check) {
    const b = d.balance_check;
    out.push(`Measured CO2 to air ${fx(b.measured_co2_t, 1)} t against the carbon balance ${fx(b.balance_co2_t, 1)} t: difference ${fx(b.difference_t, 1)} t (± ${fx(b.u95_t, 1)} t, 95 %)`, "");
  }
  out.push("Sources");
  for (const c of d.citations) out.push(`  ${c.status === "unconfirmed" ? "*" : c.status === "site" ? "s" : " "} ${c.label}${c.value ? ` ${c.value}${c.unit ? ` ${c.unit}` : ""}` : ""} — ${c.source}`);
  if (d.citations.some((c) => c.status === "unconfirmed") || d.benchmarks.some((b) => b.status === "unconfirmed") || d.gwp.status === "unconfirmed")
    out.push("  * unconfirmed: not yet read in the published text of its source; check it there before a statement relies on it.");
  if (d.citations.some((c) => c.status === "site")) out.push("  s the site's own figure: rests on the site's evidence (supplier or grid operator), not on a published table.");
  out.push("");
  return out;
}
