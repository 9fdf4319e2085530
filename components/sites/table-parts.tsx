"use client";

import { flexRender, type Header, type Table } from "@tanstack/react-table";

/**
 * Pieces both set-up tables share. Sorting is a real button in the header so it can be reached
 * by keyboard, and aria-sort tells screen readers the current order.
 */
export function SortableHeader<T>({ header }: { header: Header<T, unknown> }) {
  const sorted = header.column.getIsSorted();
  const content = flexRender(header.column.columnDef.header, header.getContext());
  const align = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric ? "text-right" : "text-left";
  if (header.isPlaceholder) return <th />;
  return (
    <th
      scope="col"
      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}
      className={`border-b border-rule-strong px-2 py-1.5 align-bottom text-xs font-medium text-ink-soft ${align}`}
    >
      {header.column.getCanSort() ? (
        <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-baseline gap-1 hover:text-ink">
          <span>{content}</span>
          <span aria-hidden="true" className="num text-ink-faint">
            {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
          </span>
        </button>
      ) : (
        content
      )}
    </th>
  );
}

export function TableFilter<T>({ table, id, label, placeholder }: { table: Table<T>; id: string; label: string; placeholder: string }) {
  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="text-sm text-ink-soft">
        {label}
      </label>
      <input
        id={id}
        type="search"
        value={(table.getState().globalFilter as string) ?? ""}
        onChange={(e) => table.setGlobalFilter(e.target.value)}
        placeholder={placeholder}
        className="w-56 border border-rule-strong bg-white px-2 py-1 text-sm"
      />
    </div>
  );
}

/** A numeric cell: tabular monospace, right-aligned, the unit spelled out beside the value. */
export function NumberCell({ value, unit }: { value: string | null; unit?: string }) {
  if (value === null || value === "") return <span className="text-ink-faint">—</span>;
  return (
    <span className="num whitespace-nowrap">
      {value}
      {unit ? <span className="ml-1 text-ink-faint">{unit}</span> : null}
    </span>
  );
}

/** Orders decimal strings without turning them into binary floats. */
export function cmpDecimalText(a: string | null, b: string | null): number {
  if (a === b) return 0;
  if (a === null || a === "") return -1;
  if (b === null || b === "") return 1;
  const [ai, af = ""] = a.split(".");
  const [bi, bf = ""] = b.split(".");
  const ia = ai.replace(/^0+(?=\d)/, "");
  const ib = bi.replace(/^0+(?=\d)/, "");
  if (ia.length !== ib.length) return ia.length - ib.length;
  if (ia !== ib) return ia < ib ? -1 : 1;
  const n = Math.max(af.length, bf.length);
  const fa = af.padEnd(n, "0");
  const fb = bf.padEnd(n, "0");
  return fa === fb ? 0 : fa < fb ? -1 : 1;
}
