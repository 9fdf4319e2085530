"use client";

import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { Status } from "@/components/ui/status";
import { link } from "@/components/ui/styles";
import { EMISSIONS_METHOD_LABELS, METERING_REFERENCE_LABELS } from "@/lib/validations/site";
import { NumberCell, cmpDecimalText } from "../table-parts";

export interface SiteTableRow {
  id: string;
  name: string;
  code: string;
  meteringReference: keyof typeof METERING_REFERENCE_LABELS;
  closureTolerancePct: string;
  factorSet: string;
  emissionsMethod: string;
  gwp: string;
  streamCount: number;
  archived: boolean;
}

export const siteColumns: ColumnDef<SiteTableRow>[] = [
  {
    accessorKey: "name",
    header: "Site",
    cell: ({ row }) => (
      <Link href={`/settings/sites/${row.original.id}`} className={`${link} font-medium`}>
        {row.original.name}
      </Link>
    ),
  },
  { accessorKey: "code", header: "Code", cell: ({ getValue }) => <span className="num">{getValue<string>()}</span> },
  {
    accessorKey: "meteringReference",
    header: "Metering reference",
    cell: ({ getValue }) => METERING_REFERENCE_LABELS[getValue<SiteTableRow["meteringReference"]>()],
  },
  {
    accessorKey: "closureTolerancePct",
    header: "Balance tolerance (%)",
    meta: { numeric: true },
    sortingFn: (a, b) => Math.sign(cmpDecimalText(a.original.closureTolerancePct, b.original.closureTolerancePct)),
    cell: ({ getValue }) => <NumberCell value={getValue<string>()} unit="%" />,
  },
  { accessorKey: "factorSet", header: "Factor set", cell: ({ getValue }) => <span className="num">{getValue<string>()}</span> },
  {
    accessorKey: "emissionsMethod",
    header: "Emissions method",
    cell: ({ getValue }) => EMISSIONS_METHOD_LABELS[getValue<keyof typeof EMISSIONS_METHOD_LABELS>()] ?? getValue<string>(),
  },
  { accessorKey: "gwp", header: "GWP" },
  { accessorKey: "streamCount", header: "Active streams", meta: { numeric: true }, cell: ({ getValue }) => <NumberCell value={String(getValue<number>())} /> },
  {
    id: "status",
    accessorFn: (r) => (r.archived ? "archived" : "active"),
    header: "Status",
    cell: ({ row }) => (row.original.archived ? <Status tone="locked">Archived</Status> : <Status tone="ok">Active</Status>),
  },
];
