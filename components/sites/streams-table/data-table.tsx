"use client";

import { flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { useState } from "react";
import { SortableHeader, TableFilter } from "../table-parts";
import { streamColumns, type StreamTableRow } from "./columns";

export function StreamsDataTable({ rows }: { rows: StreamTableRow[] }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState("");
  const table = useReactTable({
    data: rows,
    columns: streamColumns,
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
      <TableFilter table={table} id="streams-filter" label="Filter" placeholder="key, name, kind, meter…" />
      <div className="overflow-x-auto border border-rule bg-white">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Streams of the site with units; column headers sort the table</caption>
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
                <td colSpan={streamColumns.length} className="px-2 py-4 text-ink-soft">
                  No stream matches “{globalFilter}”.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
