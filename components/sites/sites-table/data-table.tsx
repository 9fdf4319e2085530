"use client";

import { flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { useState } from "react";
import { SortableHeader, TableFilter } from "../table-parts";
import { siteColumns, type SiteTableRow } from "./columns";

export function SitesDataTable({ rows }: { rows: SiteTableRow[] }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState("");
  const table = useReactTable({
    data: rows,
    columns: siteColumns,
    state: { sorting, globalFilter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const shown = table.getRowModel().rows;
  return (
    <div className="space-y-2">
      <TableFilter table={table} id="sites-filter" label="Filter" placeholder="name, code, method…" />
      <div className="overflow-x-auto border border-rule bg-white">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Sites of the organisation; column headers sort the table</caption>
          <thead>
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => (
                  <SortableHeader key={h.id} header={h} />
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {shown.map((row) => (
              <tr key={row.id} className={`border-b border-rule last:border-0 ${row.original.archived ? "text-ink-soft" : ""}`}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`px-2 py-1.5 ${(cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric ? "text-right" : ""}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {shown.length === 0 ? (
              <tr>
                <td colSpan={siteColumns.length} className="px-2 py-4 text-ink-soft">
                  No site matches “{globalFilter}”.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
