"use client";

import { flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { useState } from "react";
import { SortableHeader, TableFilter } from "./table-parts";

interface Props<Row extends { archived: boolean }> {
  rows: Row[];
  // TanStack's column type is invariant in its value type; the tables pass mixed columns.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<Row, any>[];
  filterId: string;
  placeholder: string;
  caption: string;
  /** What a row is, for the "no … matches" line. */
  noun: string;
}

/** A sortable, filterable table of set-up records; archived rows stay listed, dimmed. */
export function FilterableTable<Row extends { archived: boolean }>({ rows, columns, filterId, placeholder, caption, noun }: Props<Row>) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState("");
  const table = useReactTable({
    data: rows,
    columns,
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
      <TableFilter table={table} id={filterId} label="Filter" placeholder={placeholder} />
      <div className="relative overflow-x-auto border border-rule bg-white" role="region" aria-label={caption} tabIndex={0}>
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">{caption}</caption>
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
                <td colSpan={columns.length} className="px-2 py-4 text-ink-soft">
                  No {noun} matches “{globalFilter}”.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
