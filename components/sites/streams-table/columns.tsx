"use client";

import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { Status } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import { INDIRECT_FACTOR_UNIT, STREAM_KIND_LABELS } from "@/lib/validations/stream";
import type { StreamKind } from "@/lib/balance/types";
import { NumberCell, cmpDecimalText } from "../table-parts";
import { ArchiveStreamButton } from "./archive-stream-button";

export interface StreamTableRow {
  id: string;
  siteId: string;
  key: string;
  name: string;
  kind: StreamKind;
  unit: string;
  analysisKey: string | null;
  destination: string | null;
  fate: string | null;
  uncertaintyPct: string | null;
  indirectFactor: string | null;
  meterTag: string | null;
  calibratedOn: string | null;
  sortOrder: number;
  archived: boolean;
}

const decimalSort = (k: "uncertaintyPct" | "indirectFactor") => (a: { original: StreamTableRow }, b: { original: StreamTableRow }) =>
  Math.sign(cmpDecimalText(a.original[k], b.original[k]));

export const streamColumns: ColumnDef<StreamTableRow>[] = [
  { accessorKey: "sortOrder", header: "Order", meta: { numeric: true }, cell: ({ getValue }) => <NumberCell value={String(getValue<number>())} /> },
  {
    accessorKey: "key",
    header: "Key",
    cell: ({ row }) => (
      <Link href={`/settings/sites/${row.original.siteId}/streams/${row.original.id}`} className={`${link} num`} aria-label={`Edit stream ${row.original.key}`}>
        {row.original.key}
      </Link>
    ),
  },
  { accessorKey: "name", header: "Name" },
  { accessorKey: "kind", header: "Kind", cell: ({ getValue }) => STREAM_KIND_LABELS[getValue<StreamKind>()] },
  { accessorKey: "unit", header: "Unit", cell: ({ getValue }) => <span className="num">{getValue<string>()}</span> },
  { accessorKey: "analysisKey", header: "Analysis", cell: ({ getValue }) => <span className="num">{getValue<string | null>() ?? "—"}</span> },
  {
    id: "goesTo",
    accessorFn: (r) => r.fate ?? r.destination ?? "",
    header: "Fate / destination",
    cell: ({ getValue }) => getValue<string>() || <span className="text-ink-faint">—</span>,
  },
  {
    accessorKey: "uncertaintyPct",
    header: "Uncertainty (%, 95 %)",
    meta: { numeric: true },
    sortingFn: decimalSort("uncertaintyPct"),
    cell: ({ getValue }) => <NumberCell value={getValue<string | null>()} unit="%" />,
  },
  {
    accessorKey: "indirectFactor",
    header: "Indirect factor (t CO2 per MWh or GJ)",
    meta: { numeric: true },
    sortingFn: decimalSort("indirectFactor"),
    cell: ({ row }) => <NumberCell value={row.original.indirectFactor} unit={INDIRECT_FACTOR_UNIT[row.original.kind]} />,
  },
  { accessorKey: "meterTag", header: "Meter tag", cell: ({ getValue }) => <span className="num">{getValue<string | null>() ?? "—"}</span> },
  { accessorKey: "calibratedOn", header: "Calibrated", cell: ({ getValue }) => <span className="num whitespace-nowrap">{getValue<string | null>() ?? "—"}</span> },
  {
    id: "status",
    accessorFn: (r) => (r.archived ? "archived" : "active"),
    header: "Status",
    cell: ({ row }) => (row.original.archived ? <Status tone="locked">Archived</Status> : <Status tone="ok">Active</Status>),
  },
  {
    id: "actions",
    header: () => <span className="sr-only">Actions</span>,
    enableSorting: false,
    cell: ({ row }) => <ArchiveStreamButton siteId={row.original.siteId} streamId={row.original.id} streamKey={row.original.key} archived={row.original.archived} />,
  },
];
