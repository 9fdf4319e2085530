"use client";

import { useState } from "react";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/status";
import { buttonSecondary } from "@/components/ui/styles";
import { chartRows, hasData } from "./chart-data";
import { ClosureChart, EnergyChart, IntensityChart, ProductionChart, RatioChart, SuspectChart } from "./series-charts";
import { SeriesTable } from "./series-table";
import { useYearSeries } from "./use-year-series";

type View = "charts" | "table";

/** The year's trends for one site: six charts or one table of the same numbers, fetched from the API. */
export function TrendCharts({ siteId, year }: { siteId: string; year: string }) {
  const q = useYearSeries(siteId, year);
  const [view, setView] = useState<View>("charts");

  if (q.isPending) {
    return (
      <div aria-busy="true" aria-label="Loading the year's series" className="grid gap-4 md:grid-cols-2">
        {[0, 1, 2, 3, 4, 5].map((i) => (
          <div key={i} className="h-[270px] animate-pulse border border-rule bg-paper-deep" />
        ))}
      </div>
    );
  }
  if (q.isError) {
    return (
      <Notice tone="fault" title="The series could not be loaded">
        {q.error.message}{" "}
        <button type="button" className="underline" onClick={() => q.refetch()}>
          Try again
        </button>
      </Notice>
    );
  }
  const series = q.data;
  if (!hasData(series)) {
    return (
      <EmptyState title={`No month of ${year} computes yet`}>
        <p>The charts appear once a process engineer has entered a month&rsquo;s figures and they compute.</p>
      </EmptyState>
    );
  }
  const rows = chartRows(series);
  const toggle = (v: View, label: string) => (
    <button type="button" aria-pressed={view === v} onClick={() => setView(v)} className={`${buttonSecondary} py-1 aria-pressed:border-accent aria-pressed:bg-accent-wash`}>
      {label}
    </button>
  );

  return (
    <div className="space-y-3">
      <div role="group" aria-label="Show the year as" className="flex gap-2">
        {toggle("charts", "Charts")}
        {toggle("table", "Table")}
      </div>
      {view === "table" ? (
        <SeriesTable series={series} />
      ) : (
        <div className="grid gap-4 md:grid-cols-2">
          <ProductionChart rows={rows} />
          <IntensityChart rows={rows} series={series} />
          <EnergyChart rows={rows} />
          <ClosureChart rows={rows} tolerance={series.tolerance_pct} />
          <RatioChart rows={rows} target={series.h2_n2_target} />
          <SuspectChart series={series} />
        </div>
      )}
    </div>
  );
}
