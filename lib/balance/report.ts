// Plain-text report of one calculated month: aligned tables, units in every header.
import type { CalculationResult } from "./calculate";
import { formatEmissions } from "./report-emissions";
import { fx, table } from "./text-table";

const f = fx;

export { table };

export function formatReport(r: CalculationResult): string {
  const out: string[] = [`Synledger balance — ${r.site}, ${r.month}`, ""];
  out.push(
    table(
      ["stream", "kind", "quantity", "unit", "kmol", "t", "carbon t", "GJ LHV", "GJ HHV"],
      r.streams.map((s) => [s.id, s.kind, f(s.quantity, 2), s.unit, f(s.kmol, 1), f(s.t, 2), f(s.carbon_t, 2), f(s.gj_lhv, 1), f(s.gj_hhv, 1)]),
    ),
    "",
  );
  const b = r.balances;
  out.push(
    table(
      ["balance", "in kmol", "out kmol", "closure %"],
      [
        ["carbon (C)", f(b.carbon.in_kmol, 1), f(b.carbon.out_kmol, 1), f(b.carbon.closure_pct, 3)],
        ["nitrogen (as N2)", f(b.nitrogen.in_kmol, 1), f(b.nitrogen.out_kmol, 1), f(b.nitrogen.closure_pct, 3)],
        ["hydrogen (H2-eq)", f(b.hydrogen.in_kmol, 1), f(b.hydrogen.out_kmol, 1), f(b.hydrogen.closure_pct, 3)],
      ],
    ),
    "",
  );
  out.push(
    table(
      ["figure", "value", "unit"],
      [
        ["ammonia", f(r.feed.ammonia_t, 2), "t"],
        ["H2:N2 ratio (implied)", f(b.h2n2Ratio, 4), "mol/mol"],
        ["energy, feed + fuel", f(r.feed.gj_lhv_per_t_nh3, 3), "GJ LHV/t NH3"],
        ["feed", f(r.feed.feed_gj_lhv_per_t_nh3, 3), "GJ LHV/t NH3"],
        ["theoretical minimum feed", f(r.feed.theoretical_min_gj_lhv_per_t_nh3, 3), "GJ LHV/t NH3"],
        ["feed efficiency", f(r.feed.feed_efficiency_pct, 2), "%"],
      ],
    ),
    "",
  );
  const rec = r.reconciliation;
  if (rec) {
    out.push(`Reconciliation over ${rec.constraints.join(", ")} (χ² = ${rec.chi2.toFixed(3)}, dof ${rec.dof}, critical ${f(rec.chi2_critical, 3)}: ${rec.passed ? "passed" : "FAILED"})`);
    out.push(
      table(
        ["stream", "measured", "reconciled", "adjust %", "test", "status"],
        rec.streams.map((s) => [
          s.id, f(s.measured, 2), f(s.reconciled, 2), f(s.adjustment_pct, 3), f(s.test_statistic, 2),
          s.suspect ? "SUSPECT" : s.redundancy,
        ]),
      ),
      "",
    );
  }
  out.push(...formatEmissions(r.emissions.detail));
  if (r.flags.length) {
    out.push("Flags");
    for (const fl of r.flags) out.push(`  [${fl.severity}] ${fl.code}: ${fl.message}`);
  }
  return out.join("\n") + "\n";
}
