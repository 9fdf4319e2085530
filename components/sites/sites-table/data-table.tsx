"use client";

import { FilterableTable } from "../filterable-table";
import { siteColumns, type SiteTableRow } from "./columns";

export function SitesDataTable({ rows }: { rows: SiteTableRow[] }) {
  return (
    <FilterableTable
      rows={rows}
      columns={siteColumns}
      filterId="sites-filter"
      placeholder="name, code, method…"
      caption="Sites of the organisation; column headers sort the table"
      noun="site"
    />
  );
}
