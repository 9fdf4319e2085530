"use client";

import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { YearSeries } from "@/lib/ledger/series";
import { fixed } from "@/reports/format";
import type { ChartRow } from "./chart-data";
import { ACCENT, BROWN, ChartFrame, FigureTooltip, INK, RULE, SOFT, axisProps, type SeriesKey } from "./chart-frame";

const margin = { top: 8, right: 12, bottom: 0, left: 0 };
const legendStyle = { fontSize: 11, color: "#46526a" };

function Grid() {
  return <CartesianGrid stroke={RULE} strokeDasharray="2 3" vertical={false} />;
}

/** Recharts picks round ticks around the data; reference lines extend the axis so none falls off it. */
const AUTO: [string, string] = ["auto", "auto"];

const tick = (places: number) => (v: number) => v.toFixed(places);

export function ProductionChart({ rows }: { rows: ChartRow[] }) {
  const keys: SeriesKey[] = [{ key: "nh3", name: "Ammonia", unit: "t NH3", places: 0 }];
  return (
    <ChartFrame id="production" title="Production" unit="t NH3 per month">
      <ResponsiveContainer>
        <BarChart data={rows} margin={margin}>
          <Grid />
          <XAxis dataKey="label" {...axisProps} />
          <YAxis {...axisProps} width={56} tickFormatter={(v: number) => `${Math.round(v / 1000)}k`} />
          <Tooltip content={(p) => <FigureTooltip active={p.active} payload={p.payload} keys={keys} />} cursor={{ fill: "#f1efe7" }} />
          <Bar dataKey="nh3" name="Ammonia" fill={ACCENT} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}

/** Largest gap between the CO2e and the direct CO2 line, relative: when tiny, the lines lie on each other and the note says so. */
function co2eOverCo2(rows: ChartRow[]): number {
  let max = 0;
  for (const r of rows) if (r.co2e !== null && r.co2 !== null && r.co2 > 0) max = Math.max(max, Math.abs(r.co2e - r.co2) / r.co2);
  return max;
}

export function IntensityChart({ rows, series }: { rows: ChartRow[]; series: YearSeries }) {
  const keys: SeriesKey[] = [
    { key: "co2e", name: "CO2e", unit: "t CO2e/t NH3", places: 3 },
    { key: "co2", name: "Direct CO2", unit: "t CO2/t NH3", places: 3 },
  ];
  const together = co2eOverCo2(rows) < 0.005;
  const notes = [
    series.benchmarks.length ? `Benchmark lines (labelled at the right): ${series.benchmarks.map((b) => `${b.label} ${fixed(b.value, 3)} ${b.unit}`).join("; ")}.` : "The factor set names no benchmark in force this year.",
    together ? "CO2e and direct CO2 differ by less than 0.5 % in every month: CO2e is the line, direct CO2 the square markers on it." : "CO2e is the solid line, direct CO2 the square markers.",
  ];
  return (
    <ChartFrame id="intensity" title="Intensity per tonne" unit="t CO2e/t NH3 and t CO2/t NH3" note={notes.join(" ")}>
      <ResponsiveContainer>
        <LineChart data={rows} margin={{ ...margin, right: series.benchmarks.length ? 96 : margin.right }}>
          <Grid />
          <XAxis dataKey="label" {...axisProps} />
          <YAxis {...axisProps} width={56} domain={AUTO} tickFormatter={tick(2)} />
          <Tooltip content={(p) => <FigureTooltip active={p.active} payload={p.payload} keys={keys} />} />
          <Legend wrapperStyle={legendStyle} />
          {series.benchmarks.map((b, i) => (
            // Labels outside the plot, at the right end of their line, so none sits on the data.
            <ReferenceLine key={b.id} y={Number(b.value)} ifOverflow="extendDomain" stroke={i === 0 ? BROWN : SOFT} strokeDasharray="6 3" label={{ value: `${b.label.replace(/^IPCC Table 3\.1, /, "").slice(0, 18)} ${fixed(b.value, 3)}`, position: "right", fontSize: 10, fill: i === 0 ? BROWN : SOFT }} />
          ))}
          <Line dataKey="co2e" name="CO2e" stroke={INK} strokeWidth={2} dot={{ r: 2.5 }} connectNulls={false} isAnimationActive={false} />
          <Line dataKey="co2" name="Direct CO2" stroke="none" legendType="square" dot={<SquareDot />} activeDot={<SquareDot />} connectNulls={false} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}

/** A hollow square marker, told apart from the round dots of the CO2e line even where they overlap. */
function SquareDot(props: { cx?: number; cy?: number }) {
  if (props.cx === undefined || props.cy === undefined || Number.isNaN(props.cy)) return null;
  return <rect x={props.cx - 4} y={props.cy - 4} width={8} height={8} fill="#ffffff" stroke={ACCENT} strokeWidth={1.5} />;
}

export function EnergyChart({ rows }: { rows: ChartRow[] }) {
  const keys: SeriesKey[] = [
    { key: "gj", name: "Energy", unit: "GJ NCV/t NH3", places: 2 },
    { key: "gjMin", name: "Theoretical minimum", unit: "GJ NCV/t NH3", places: 2 },
  ];
  return (
    <ChartFrame id="energy" title="Energy per tonne" unit="GJ (net calorific value) per t NH3" note="Feed and fuel together; the lower line is the theoretical minimum for the month's gas.">
      <ResponsiveContainer>
        <LineChart data={rows} margin={margin}>
          <Grid />
          <XAxis dataKey="label" {...axisProps} />
          <YAxis {...axisProps} width={56} domain={[0, "auto"]} tickFormatter={tick(0)} />
          <Tooltip content={(p) => <FigureTooltip active={p.active} payload={p.payload} keys={keys} />} />
          <Legend wrapperStyle={legendStyle} />
          <Line dataKey="gj" name="Energy" stroke={INK} strokeWidth={2} dot={{ r: 2.5 }} isAnimationActive={false} />
          <Line dataKey="gjMin" name="Theoretical minimum" stroke={BROWN} strokeDasharray="6 3" dot={false} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}

export function ClosureChart({ rows, tolerance }: { rows: ChartRow[]; tolerance: string }) {
  const tol = Number(tolerance);
  const keys: SeriesKey[] = [
    { key: "carbon", name: "Carbon", unit: "%", places: 2, sign: true },
    { key: "nitrogen", name: "Nitrogen", unit: "%", places: 2, sign: true },
    { key: "hydrogen", name: "Hydrogen", unit: "%", places: 2, sign: true },
  ];
  return (
    <ChartFrame id="closures" title="Balance closures" unit="% of inflow" note={`Shaded band: tolerance ±${tolerance} %. Below zero, less leaves than enters.`}>
      <ResponsiveContainer>
        <LineChart data={rows} margin={margin}>
          <Grid />
          <XAxis dataKey="label" {...axisProps} />
          <YAxis {...axisProps} width={56} domain={AUTO} tickFormatter={tick(1)} />
          <ReferenceArea y1={-tol} y2={tol} fill={ACCENT} fillOpacity={0.08} stroke="none" ifOverflow="extendDomain" />
          <ReferenceLine y={0} stroke={SOFT} />
          <Tooltip content={(p) => <FigureTooltip active={p.active} payload={p.payload} keys={keys} />} />
          <Legend wrapperStyle={legendStyle} />
          <Line dataKey="carbon" name="Carbon" stroke={INK} strokeWidth={2} dot={{ r: 2.5 }} isAnimationActive={false} />
          <Line dataKey="nitrogen" name="Nitrogen" stroke={ACCENT} strokeDasharray="5 2" dot={{ r: 2 }} isAnimationActive={false} />
          <Line dataKey="hydrogen" name="Hydrogen" stroke={BROWN} strokeDasharray="1 2" strokeWidth={2} dot={{ r: 2 }} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}

export function RatioChart({ rows, target }: { rows: ChartRow[]; target: string }) {
  const keys: SeriesKey[] = [{ key: "ratio", name: "H2:N2", unit: "mol/mol", places: 3 }];
  return (
    <ChartFrame id="ratio" title="Implied H2:N2 make-up ratio" unit="mol H2 per mol N2" note={`Line at ${target} : 1, the ratio ammonia synthesis consumes.`}>
      <ResponsiveContainer>
        <LineChart data={rows} margin={margin}>
          <Grid />
          <XAxis dataKey="label" {...axisProps} />
          <YAxis {...axisProps} width={56} domain={AUTO} tickFormatter={tick(2)} />
          <ReferenceLine y={Number(target)} ifOverflow="extendDomain" stroke={BROWN} strokeDasharray="6 3" label={{ value: `${target} : 1`, position: "insideBottomLeft", fontSize: 10, fill: BROWN }} />
          <Tooltip content={(p) => <FigureTooltip active={p.active} payload={p.payload} keys={keys} />} />
          <Line dataKey="ratio" name="H2:N2" stroke={INK} strokeWidth={2} dot={{ r: 2.5 }} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}

export function SuspectChart({ series }: { series: YearSeries }) {
  const data = series.suspect_meters.map((s) => ({ label: s.meter ?? s.stream, name: s.name, count: s.months.length, months: s.months.join(", ") }));
  return (
    <ChartFrame
      id="suspects"
      title="Meters the reconciliation names"
      unit="months named"
      note={data.length ? data.map((d) => `${d.label}: ${d.name}, ${d.months}`).join(" · ") : undefined}
    >
      {data.length === 0 ? (
        <p className="pt-16 text-center text-sm text-ink-soft">No month of {series.year} names a suspect meter.</p>
      ) : (
        <ResponsiveContainer>
          <BarChart data={data} layout="vertical" margin={{ ...margin, left: 8 }}>
            <Grid />
            <XAxis type="number" allowDecimals={false} {...axisProps} />
            <YAxis type="category" dataKey="label" {...axisProps} width={96} />
            <Tooltip
              content={({ active, payload }) => {
                const d = payload?.[0]?.payload as (typeof data)[number] | undefined;
                return active && d ? (
                  <div className="border border-rule-strong bg-white px-2.5 py-1.5 text-xs">
                    <p className="font-semibold">{d.name}</p>
                    <p>
                      {d.label}: named in <span className="num">{d.months}</span>
                    </p>
                  </div>
                ) : null;
              }}
              cursor={{ fill: "#f1efe7" }}
            />
            <Bar dataKey="count" name="Months named" fill={BROWN} isAnimationActive={false} barSize={18} />
          </BarChart>
        </ResponsiveContainer>
      )}
    </ChartFrame>
  );
}
