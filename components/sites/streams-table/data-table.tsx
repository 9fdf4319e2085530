"use client";

import { FilterableTable } from "../filterable-table";
import { streamColumns, type StreamTableRow } from "./columns";

export function StreamsDataTable({ rows }: { rows: StreamTableRow[] }) {
  return (
    <FilterableTable
      rows={rows}
      columns={streamColumns}
      filterId="streams-filter"
      placeholder="key, name, kind, meter…"
      caption="Streams of the site with units; column headers sort the table"
      noun="stream"
    />
  );
}
