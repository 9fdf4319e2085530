"use client";

import { createColumnHelper, flexRender, getCoreRowModel, getFilteredRowModel, getPaginationRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import { SortableHeader } from "@/components/sites/table-parts";
import { MonthStateBadge } from "@/components/ui/month-state";
import { Status } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import type { LedgerRow } from "@/lib/ledger/ledger-rows";
import { absWithin, fixed, signed } from "@/reports/format";

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const monthLabel = (k: string) => `${MONTHS[Number(k.slice(5)) - 1]} ${k.slice(0, 4)}`;

type Filter = "all" | "mine" | "open" | "flags";

/** Numbers sort by value, not as text; a missing figure sorts last. */
const byNumber = (a: string | null, b: string | null) => (a === null ? (b === null ? 0 : 1) : b === null ? -1 : Number(a) - Number(b));

function Closure({ value, tolerance }: { value: string | null; tolerance: string }) {
  if (value === null) return <span className="text-ink-faint">—</span>;
  const within = absWithin(value, tolerance);
  return (
    <span className={within ? "" : "font-medium text-warn"}>
      {signed(value, 2)}
      {within ? null : <span className="sr-only"> (outside ±{tolerance} %)</span>}
    </span>
  );
}

const PAGE_SIZE = 50;
const pagerButton = "border border-rule-strong bg-white px-2.5 py-1 text-ink hover:bg-paper-deep disabled:cursor-not-allowed disabled:text-ink-faint";

const h = createColumnHelper<LedgerRow & { mine: boolean }>();

/** The ledger as a grid: sortable, filterable, each month a link to its page and its review. */
export function LedgerGrid({ rows, roles, sites }: { rows: LedgerRow[]; roles: Role[]; sites: { id: string; name: string }[] }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filter, setFilter] = useState<Filter>("all");
  const [site, setSite] = useState<string>("");
  const data = useMemo(() => rows.map((r) => ({ ...r, mine: r.next !== null && roles.includes(r.next.role) })), [rows, roles]);
  const shownData = useMemo(
    () =>
      data.filter(
        (r) =>
          (!site || r.siteId === site) &&
          (filter === "all" || (filter === "mine" && r.mine) || (filter === "open" && (r.state === "open" || r.state === null) && r.timing !== "future") || (filter === "flags" && r.flags.length > 0)),
      ),
    [data, filter, site],
  );
  const columns = useMemo(
    () => [
      h.accessor("month", {
        header: "Month",
        cell: (c) => (
          <span className="whitespace-nowrap">
            <Link className={link} href={`/sites/${c.row.original.siteId}/months/${c.getValue()}`}>
              {monthLabel(c.getValue())}
            </Link>
            {c.row.original.timing === "in-progress" ? <span className="block text-xs text-ink-soft">in progress</span> : null}
          </span>
        ),
      }),
      h.accessor("siteName", { header: "Site" }),
      h.accessor("stateLabel", { header: "State", cell: (c) => <MonthStateBadge state={c.row.original.state} /> }),
      h.accessor("revision", { header: "Rev.", meta: { numeric: true }, cell: (c) => <span className="num">{c.getValue() ?? "—"}</span> }),
      h.accessor("ammonia_t", { header: "NH3 (t)", meta: { numeric: true }, sortingFn: (a, b) => byNumber(a.original.ammonia_t, b.original.ammonia_t), cell: (c) => <span className="num">{fixed(c.getValue(), 1)}</span> }),
      h.accessor((r) => r.closure.carbon, { id: "carbon", header: "C closure (%)", meta: { numeric: true }, sortingFn: (a, b) => byNumber(a.original.closure.carbon, b.original.closure.carbon), cell: (c) => <span className="num"><Closure value={c.getValue()} tolerance={c.row.original.tolerancePct} /></span> }),
      h.accessor((r) => r.closure.nitrogen, { id: "nitrogen", header: "N closure (%)", meta: { numeric: true }, sortingFn: (a, b) => byNumber(a.original.closure.nitrogen, b.original.closure.nitrogen), cell: (c) => <span className="num"><Closure value={c.getValue()} tolerance={c.row.original.tolerancePct} /></span> }),
      h.accessor((r) => r.closure.hydrogen, { id: "hydrogen", header: "H closure (%)", meta: { numeric: true }, sortingFn: (a, b) => byNumber(a.original.closure.hydrogen, b.original.closure.hydrogen), cell: (c) => <span className="num"><Closure value={c.getValue()} tolerance={c.row.original.tolerancePct} /></span> }),
      h.accessor("co2e_t", { header: "CO2e (t)", meta: { numeric: true }, sortingFn: (a, b) => byNumber(a.original.co2e_t, b.original.co2e_t), cell: (c) => <span className="num">{fixed(c.getValue(), 1)}</span> }),
      h.accessor("intensity", { header: "t CO2e/t NH3", meta: { numeric: true }, sortingFn: (a, b) => byNumber(a.original.intensity, b.original.intensity), cell: (c) => <span className="num">{fixed(c.getValue(), 3)}</span> }),
      h.accessor((r) => r.flags.length, {
        id: "flags",
        header: "Flags",
        meta: { numeric: true },
        cell: (c) => (c.getValue() ? <span title={c.row.original.flags.join("\n")}><Status tone="warn">{c.getValue()}</Status></span> : <span className="text-ink-faint">0</span>),
      }),
      h.accessor((r) => (r.next ? ROLE_LABELS[r.next.role] : ""), {
        id: "next",
        header: "Next",
        cell: (c) => {
          const n = c.row.original.next;
          if (!n) return <span className="text-ink-faint">nothing to do</span>;
          return (
            <Link className={`${link} whitespace-nowrap text-sm`} href={`/sites/${c.row.original.siteId}/months/${c.row.original.month}/review`}>
              {ROLE_LABELS[n.role]}: {n.todo}
              {c.row.original.mine ? <span className="sr-only"> (you)</span> : null}
            </Link>
          );
        },
      }),
    ],
    [],
  );
  const table = useReactTable({
    data: shownData,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    // Fifty months a page: a fleet's ledger runs to hundreds of rows, and a page of them reads (and renders) faster.
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageIndex: 0, pageSize: PAGE_SIZE } },
  });
  const shown = table.getRowModel().rows;
  const { pageIndex } = table.getState().pagination;
  const total = table.getPrePaginationRowModel().rows.length;
  const pager =
    total > PAGE_SIZE ? (
      <nav className="flex flex-wrap items-center gap-2 text-sm" aria-label="Pages of months">
        <span className="num text-ink-soft" aria-live="polite">
          Months {pageIndex * PAGE_SIZE + 1}–{Math.min(total, (pageIndex + 1) * PAGE_SIZE)} of {total}
        </span>
        <button type="button" className={pagerButton} onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
          Previous page
        </button>
        <button type="button" className={pagerButton} onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          Next page
        </button>
      </nav>
    ) : null;
  const chip = (f: Filter, text: string) => (
    <button
      type="button"
      onClick={() => setFilter(f)}
      aria-pressed={filter === f}
      className={`border px-2.5 py-1 text-sm ${filter === f ? "border-accent bg-accent-wash font-medium text-ink" : "border-rule-strong bg-white text-ink-soft hover:text-ink"}`}
    >
      {text} <span className="num text-xs">({data.filter((r) => (f === "all" ? true : f === "mine" ? r.mine : f === "open" ? (r.state === "open" || r.state === null) && r.timing !== "future" : r.flags.length > 0) && (!site || r.siteId === site)).length})</span>
    </button>
  );
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Show">
        {chip("all", "All months")}
        {chip("mine", "Needs my action")}
        {chip("open", "Open")}
        {chip("flags", "With flags")}
        {sites.length > 1 ? (
          <label className="ml-auto flex items-center gap-2 text-sm text-ink-soft">
            Site
            <select value={site} onChange={(e) => setSite(e.target.value)} className="border border-rule-strong bg-white px-2 py-1 text-sm text-ink">
              <option value="">every site</option>
              {sites.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>

      {/* Phones: a card per month. */}
      <ul className="space-y-2 sm:hidden" aria-label="Months">
        {shown.map(({ original: r }) => (
          <li key={`${r.siteId}-${r.month}`} className="border border-rule bg-white px-3 py-2 text-sm">
            <div className="flex items-baseline justify-between gap-2">
              <Link className={`${link} font-medium`} href={`/sites/${r.siteId}/months/${r.month}`}>
                {monthLabel(r.month)} · {r.siteName}
              </Link>
              <MonthStateBadge state={r.state} />
            </div>
            <dl className="num mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-xs [&_dd]:whitespace-nowrap">
              <dt className="text-ink-soft">NH3</dt>
              <dd className="text-right">{fixed(r.ammonia_t, 1)} t</dd>
              <dt className="text-ink-soft">C / N / H closure</dt>
              <dd className="text-right">
                <Closure value={r.closure.carbon} tolerance={r.tolerancePct} /> / <Closure value={r.closure.nitrogen} tolerance={r.tolerancePct} /> / <Closure value={r.closure.hydrogen} tolerance={r.tolerancePct} /> %
              </dd>
              <dt className="text-ink-soft">CO2e</dt>
              <dd className="text-right">{fixed(r.co2e_t, 1)} t · {fixed(r.intensity, 3)} t/t</dd>
            </dl>
            {r.flags.length ? <p className="mt-1 text-xs"><Status tone="warn">{r.flags.length} flag{r.flags.length === 1 ? "" : "s"}</Status></p> : null}
            {r.next ? (
              <p className="mt-1 text-xs">
                Next:{" "}
                <Link className={link} href={`/sites/${r.siteId}/months/${r.month}/review`}>
                  {ROLE_LABELS[r.next.role]}, {r.next.todo}
                </Link>
              </p>
            ) : null}
          </li>
        ))}
      </ul>

      <div className="relative hidden overflow-x-auto border border-rule bg-white sm:block" role="region" aria-label="Months of every site" tabIndex={0}>
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Months of every site, newest first; column headers sort the table</caption>
          <thead>
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((hd) => (
                  <SortableHeader key={hd.id} header={hd} />
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {shown.map((row) => (
              <tr key={row.id} className={`border-b border-rule last:border-0 ${row.original.mine ? "bg-accent-wash/30" : ""}`}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`px-2 py-1.5 ${(cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric ? "text-right whitespace-nowrap" : ""}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {shown.length === 0 ? <p className="text-sm text-ink-soft">No month matches this choice.</p> : null}
      {pager}
    </div>
  );
}
