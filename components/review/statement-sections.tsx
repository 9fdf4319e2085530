/**
 * The emissions half of the review page, drawn from the same MonthlyStatementModel the signed
 * PDF prints: what the signatory reads here is, string for string, what the statement says.
 */
import type { MonthlyStatementModel } from "@/reports/model";
import { ExplainFlagForm, type ExplainContext } from "./explain-flag-form";
import { FigureTable, MarkText, QtyCell, Section } from "./figure-table";

/** `explain`: set when the reader may write explanations of the flags now (engineer or officer, month not frozen). */
export function EmissionsSections({ m, explain }: { m: MonthlyStatementModel; explain?: ExplainContext }) {
  const u = m.emissionsUnit;
  return (
    <>
      <Section id="emissions" title="Emissions by source and gas">
        <FigureTable
          caption="Emissions by source"
          columns={[
            { title: "Source", cell: (r) => r.source },
            { title: "Basis", cell: (r) => <span className="text-xs text-ink-soft">{r.basis}</span> },
            { title: `CO2 (${u})`, numeric: true, cell: (r) => <span className="num whitespace-nowrap">{r.co2}</span> },
            { title: `CH4 (${u})`, numeric: true, cell: (r) => <span className="num">{r.ch4}</span> },
            { title: `N2O (${u})`, numeric: true, cell: (r) => <span className="num">{r.n2o}</span> },
            { title: `CO2e (${u})`, numeric: true, cell: (r) => <span className="num whitespace-nowrap">{r.co2e}</span> },
          ]}
          rows={m.emissionsBySource}
        />
        <FigureTable
          caption="Emissions by gas"
          columns={[
            { title: "Gas", cell: (r) => r.gas },
            { title: "Mass", numeric: true, cell: (r) => <QtyCell q={r.mass} /> },
            { title: "GWP (100 yr)", numeric: true, cell: (r) => <span className="num">{r.gwp}</span> },
            { title: "CO2-equivalent", numeric: true, cell: (r) => <QtyCell q={r.co2e} /> },
          ]}
          rows={m.emissionsByGas}
        />
        <div className="grid grid-cols-1 gap-3 border border-rule bg-white px-4 py-3 sm:grid-cols-3">
          {(
            [
              ["Gross CO2", m.co2.gross],
              ["Deducted (transferred)", m.co2.deducted],
              ["Net CO2", m.co2.net],
            ] as const
          ).map(([label, q]) => (
            <div key={label}>
              <p className="text-xs text-ink-soft">{label}</p>
              <p className="text-lg">
                <QtyCell q={q} strong={label === "Net CO2"} />
              </p>
            </div>
          ))}
          <p className="text-xs text-ink-soft sm:col-span-3">{m.co2.deductionNote}</p>
        </div>
      </Section>

      <Section id="intensities" title="Intensities against benchmarks">
        <FigureTable
          caption="Intensities"
          columns={[
            { title: "Measure", cell: (r) => r.measure },
            { title: "This month", numeric: true, cell: (r) => <QtyCell q={r.value} strong /> },
            { title: "Benchmark", numeric: true, cell: (r) => <QtyCell q={r.benchmark} /> },
            { title: "Benchmark source", cell: (r) => <span className="text-xs">{r.benchmarkSource}</span> },
            { title: "Position", cell: (r) => <MarkText mark={r.mark}>{r.position}</MarkText> },
          ]}
          rows={m.intensities}
        />
        <FigureTable
          caption="Uncertainty"
          columns={[
            { title: "Figure", cell: (r) => r.figure },
            { title: "Value", numeric: true, cell: (r) => <QtyCell q={r.value} /> },
            { title: "Expanded uncertainty", cell: (r) => <span className="num whitespace-nowrap text-xs">{r.expanded}</span> },
            { title: "From", cell: (r) => <span className="text-xs text-ink-soft">{r.note}</span> },
          ]}
          rows={m.uncertainty}
        />
      </Section>

      <Section id="flags" title="Flags and explanations">
        <FigureTable
          caption="Flags"
          empty="The engine raised no flags for this month."
          columns={[
            { title: "Flag", cell: (r) => <MarkText mark={r.mark}>{r.code}</MarkText> },
            { title: "What the engine found", cell: (r) => r.message },
            {
              title: "Explanation",
              cell: (r) =>
                explain ? (
                  <ExplainFlagForm ctx={explain} code={r.code} stream={r.stream} current={r.explanation} by={r.explainedBy} />
                ) : r.explanation ? (
                  <span>
                    {r.explanation} <span className="text-xs text-ink-soft">({r.explainedBy})</span>
                  </span>
                ) : (
                  <span className="text-ink-faint">no explanation recorded</span>
                ),
            },
          ]}
          rows={m.flags}
        />
      </Section>

      <Section id="method" title="Method and factor set">
        <dl className="grid grid-cols-1 gap-x-6 gap-y-1 border border-rule bg-white px-4 py-3 text-sm sm:grid-cols-[10rem_1fr]">
          <dt className="text-ink-soft">Method</dt>
          <dd>{m.method.method}</dd>
          <dt className="text-ink-soft">Factor set</dt>
          <dd>{m.method.factorSet}</dd>
          <dt className="text-ink-soft">GWP values</dt>
          <dd>{m.method.gwpSet}</dd>
          <dt className="text-ink-soft">Calorific basis</dt>
          <dd>{m.method.energyBasis}</dd>
        </dl>
        <FigureTable
          caption="Factors and their sources"
          columns={[
            { title: "Factor or rule", cell: (r) => r.item },
            { title: "Value", numeric: true, cell: (r) => <QtyCell q={r.value} /> },
            { title: "Source", cell: (r) => r.source },
            { title: "Status", cell: (r) => <MarkText mark={r.status === "unconfirmed" ? "attention" : r.status === "site" ? "info" : "ok"}>{r.statusText}</MarkText> },
          ]}
          rows={m.method.sources}
        />
        <h3 className="text-sm font-semibold">
          Values not yet confirmed in their published source <span className="num font-normal text-ink-soft">({m.unconfirmed.length})</span>
        </h3>
        <p className="text-xs text-ink-soft">Printed as unconfirmed in the statement; the signatory acknowledges each one before signing.</p>
        <FigureTable
          caption={`Values not yet confirmed in their published source (${m.unconfirmed.length}): the signatory acknowledges each before signing`}
          empty="None: every cited value was confirmed in its published source or is the site's own figure."
          columns={[
            { title: "Value", cell: (r) => r.item },
            { title: "As used", numeric: true, cell: (r) => <span className="num">{r.value}</span> },
            { title: "Cited source", cell: (r) => <span className="text-xs">{r.source}</span> },
          ]}
          rows={m.unconfirmed}
        />
        {m.method.notes.map((n) => (
          <p key={n} className="text-xs text-ink-soft">
            {n}
          </p>
        ))}
      </Section>
    </>
  );
}
