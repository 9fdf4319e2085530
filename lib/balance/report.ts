// Plain-text report of one calculated month: aligned tables, units in every header.
import type { CalculationResult } from "./calculate";
import type { Dec } from "./decimal";

const f = (x: Dec | null | undefined, places: number): string => (x === null || x === undefined ? "—" : x.toFixed(places));

/** Right-aligns every column but the first; the header row is underlined. */
export function table(header: string[], rows: string[][]): string {
  const widths = header.map((h, j) => Math.max(h.length, ...rows.map((r) => r[j].length)));
  const line = (r: string[]) => r.map((c, j) => (j === 0 ? c.padEnd(widths[j]) : c.padStart(widths[j]))).join("  ").trimEnd();
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

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
        ["CO2e intensity", f(r.emissions.intensity.co2e_t_per_t_nh3, 4), "t CO2e/t NH3"],
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
  if (r.flags.length) {
    out.push("Flags");
    for (const fl of r.flags) out.push(`  [${fl.severity}] ${fl.code}: ${fl.message}`);
  }
  return out.join("\n") + "\n";
}
