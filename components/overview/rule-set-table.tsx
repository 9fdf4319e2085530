import { FigureTable } from "@/components/review/figure-table";
import { num } from "@/lib/balance/decimal";
import { yearUnderEachFactorSet } from "@/lib/ledger/year";
import { fixed } from "@/reports/format";

/**
 * The year recomputed under each built-in factor set: what changes is mostly what the rules let
 * be deducted (CO2 to urea, storage or sale). Computed on request, never stored.
 */
export async function RuleSetTable({ documents, tolerance, recorded }: { documents: Record<string, unknown>[]; tolerance: string; recorded: string[] }) {
  // Yield first so the rest of the page streams out before these 36 engine runs.
  await new Promise((resolve) => setImmediate(resolve));
  const sets = yearUnderEachFactorSet(documents, tolerance, recorded);
  const t = (v: Parameters<typeof num>[0]) => fixed(num(v), 1);
  return (
    <FigureTable
      caption="Gross, deducted and net CO2 of the year under each built-in factor set"
      rows={sets}
      columns={[
        { title: "Factor set", cell: (s) => <span>{s.name} <span className="num text-xs text-ink-soft">{s.factorSet}</span>{s.recorded ? <span className="ml-1 text-xs font-semibold text-accent-strong">(recorded)</span> : null}</span> },
        { title: "Gross CO2 (t)", numeric: true, cell: (s) => <span className="num whitespace-nowrap">{t(s.year?.co2.gross_t)}</span> },
        { title: "Deducted (t CO2)", numeric: true, cell: (s) => <span className="num whitespace-nowrap">{t(s.year?.co2.deductible_t)}</span> },
        { title: "Net CO2 (t)", numeric: true, cell: (s) => <span className="num whitespace-nowrap">{t(s.year?.co2.net_t)}</span> },
        { title: "CO2e (t)", numeric: true, cell: (s) => <span className="num whitespace-nowrap">{t(s.year?.emissions.co2e_t)}</span> },
        { title: "CO2e intensity (t CO2e/t NH3)", numeric: true, cell: (s) => <span className="num whitespace-nowrap">{fixed(num(s.year?.intensity.co2e_t_per_t_nh3), 3)}</span> },
      ]}
    />
  );
}
