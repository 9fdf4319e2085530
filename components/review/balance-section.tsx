/**
 * The balance half of the review page: the three element balances as beams, the H2:N2 make-up
 * ratio against 3, and the reconciliation (measured against reconciled, suspect meters named).
 */
import type { ResultDocument } from "@/lib/balance/result";
import { exact, fixed, signed } from "@/reports/format";
import type { MonthlyStatementModel } from "@/reports/model";
import { Decimal } from "decimal.js";
import { namedSuspects } from "@/lib/balance/suspects";
import { BalanceBeam } from "./balance-beam";

/** Decimals a figure was written with ("42792.4" → 1), at most 3. */
const decimalsOf = (v: string | null) => Math.min(3, v && v.includes(".") ? v.split(".")[1].length : 0);
import { FigureTable, MarkText, QtyCell, Section } from "./figure-table";

export interface StreamName {
  key: string;
  name: string;
  unit: string;
  meterTag: string | null;
}

/** Deviation of the ratio from 3 as a percentage of 3, so it sits on a beam like the closures. */
function ratioDeviationPct(ratio: string | null): string | null {
  return ratio === null ? null : new Decimal(ratio).minus(3).div(3).times(100).toString();
}

/** How the meters were tested; a result frozen before the per-meter tests were gated says nothing. */
function sidakNote(rec: NonNullable<ResultDocument["reconciliation"]>): string {
  const t = (rec as Partial<typeof rec>).measurement_tests;
  if (!t?.per_test_confidence) return "";
  return ` Meters are tested one by one only when it fails, each at ${fixed(new Decimal(t.per_test_confidence).times(100).toString(), 2)} % so the ${t.meters_tested} tests together hold 95 % (Šidák).`;
}

export function BalanceSection({ doc, model, tolerance, streams }: { doc: ResultDocument; model: MonthlyStatementModel; tolerance: string; streams: StreamName[] }) {
  const b = doc.balances;
  const rows = model.balances;
  const rec = doc.reconciliation;
  const byKey = new Map(streams.map((s) => [s.key, s]));
  const named = namedSuspects(rec?.streams);
  const unmetered = (rec?.unmeasured ?? []).filter((u) => u.stream);
  return (
    <>
      <Section
        id="balances"
        title="Element balances"
        note={`Closure is (out − in) / in. The shaded band is the site's tolerance of ±${fixed(tolerance, 1)} %; a beam tipping outside it needs the engineer's written reason before the month can be balanced.`}
      >
        <div className="grid gap-3 md:grid-cols-2">
          <BalanceBeam title="Carbon" value={b.carbon.closure_pct} tolerance={tolerance} unit="%" valueText={`${signed(b.carbon.closure_pct, 2)} %`} detail={`in ${rows[0].inflow.value} ${rows[0].inflow.unit}, out ${rows[0].outflow.value} ${rows[0].outflow.unit}`} />
          <BalanceBeam title="Nitrogen" value={b.nitrogen.closure_pct} tolerance={tolerance} unit="%" valueText={`${signed(b.nitrogen.closure_pct, 2)} %`} detail={`in ${rows[1].inflow.value} ${rows[1].inflow.unit}, out ${rows[1].outflow.value} ${rows[1].outflow.unit}`} />
          <BalanceBeam title="Hydrogen equivalents" value={b.hydrogen.closure_pct} tolerance={tolerance} unit="%" valueText={`${signed(b.hydrogen.closure_pct, 2)} %`} detail={`available ${rows[2].inflow.value} ${rows[2].inflow.unit}, used ${rows[2].outflow.value} ${rows[2].outflow.unit}`} />
          <BalanceBeam
            title="H2:N2 make-up ratio against 3"
            value={ratioDeviationPct(doc.synthesis.h2_n2_ratio)}
            tolerance="5"
            unit="%"
            valueText={`${fixed(doc.synthesis.h2_n2_ratio, 3)} : 1`}
            sides={["nitrogen-rich", "hydrogen-rich"]}
            detail="Shown as the deviation from 3 : 1 in %; the band is ±5 % (2.85–3.15), common practice, no source."
          />
        </div>
      </Section>

      <Section
        id="reconciliation"
        title="Reconciliation"
        note={
          rec
            ? `Weighted least squares adjusts each measured flow within its stated uncertainty so the balances close; a flow no meter measures is solved for, not forced onto the meters. Global test: chi-square ${fixed(rec.chi2, 2)} against ${fixed(rec.chi2_critical, 2)} (${rec.dof} degrees of freedom, 95 %). ${sidakNote(rec)}`
            : "Data reconciliation was not run for this month."
        }
      >
        {rec ? (
          <>
            <p>
              {rec.passed ? (
                <MarkText mark="ok">Global test passed: the meters agree with the balances within their uncertainties.</MarkText>
              ) : (
                <MarkText mark="attention">Global test failed: the balances and the stated meter uncertainties disagree.</MarkText>
              )}
            </p>
            <FigureTable
              caption="Measured and reconciled flows"
              columns={[
                { title: "Stream", cell: (r) => <span>{byKey.get(r.id)?.name ?? r.id}</span> },
                { title: "Meter", cell: (r) => <span className="num whitespace-nowrap text-xs">{byKey.get(r.id)?.meterTag ?? "—"}</span> },
                { title: "Measured", numeric: true, cell: (r) => <QtyCell q={{ value: exact(r.measured), unit: byKey.get(r.id)?.unit ?? "" }} /> },
                // Reconciled to the decimals the meter's own reading was given with, so the two read side by side.
                { title: "Reconciled", numeric: true, cell: (r) => <QtyCell q={{ value: fixed(r.reconciled, decimalsOf(r.measured)), unit: byKey.get(r.id)?.unit ?? "" }} /> },
                { title: "Adjustment", numeric: true, cell: (r) => <QtyCell q={{ value: signed(r.adjustment_pct, 2), unit: "%" }} /> },
                { title: `Test (limit ${fixed(rec.z_critical, 2)})`, numeric: true, cell: (r) => <span className="num">{fixed(r.test_statistic, 2)}</span> },
                {
                  title: "Verdict",
                  cell: (r) =>
                    named.includes(r.id) ? (
                      <MarkText mark="attention">Most likely wrong</MarkText>
                    ) : r.suspect ? (
                      <MarkText mark="info">Moved by the meter that is off</MarkText>
                    ) : r.redundancy === "redundant" ? (
                      <MarkText mark="ok">Consistent</MarkText>
                    ) : (
                      <MarkText mark="info">Not checkable</MarkText>
                    ),
                },
              ]}
              rows={rec.streams}
            />
            {unmetered.length ? (
              <FigureTable
                caption="Flows without a meter"
                columns={[
                  { title: "Stream", cell: (u) => <span>{byKey.get(u.stream!)?.name ?? u.stream}</span> },
                  { title: "Figure used", numeric: true, cell: (u) => <QtyCell q={{ value: fixed(doc.streams.find((s) => s.id === u.stream)?.quantity ?? u.quantity, 3), unit: byKey.get(u.stream!)?.unit ?? "" }} /> },
                  {
                    title: "How",
                    cell: (u) =>
                      u.observable && u.quantity && !u.quantity.startsWith("-") ? (
                        <MarkText mark="info">Solved from the balances</MarkText>
                      ) : (
                        <MarkText mark="attention">The balances cannot fix it: the entered estimate is used (none entered: zero)</MarkText>
                      ),
                  },
                ]}
                rows={unmetered}
              />
            ) : null}
          </>
        ) : null}
      </Section>
    </>
  );
}
