"use client";

import { createColumnHelper, type RowData } from "@tanstack/react-table";
import Link from "next/link";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import type { FlagListItem } from "@/lib/schemas/flag";
import { FoldedDetail, GaugeText, takenBy, takenWhen } from "./flag-cells";
import { DecisionTag, ReasonTag } from "./flag-tags";
import { age, deviationText, limitsText, withUnit } from "./format";

// The queue's columns. Ids of sortable columns are the server's sort keys (GET /api/flags?sort=).
// On a tablet the station, value, verdict, age and decision stay as columns; the others are hidden
// below their width (meta.className) and fold into the station's cell (FoldedDetail).
declare module "@tanstack/react-table" {
  // The generics must match the library's declaration to merge with it.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    className?: string;
  }
}

const col = createColumnHelper<FlagListItem>();
const fixed = { enableSorting: false } as const;
const fromLaptop = { meta: { className: "hidden lg:table-cell" } };
const fromDesktop = { meta: { className: "hidden xl:table-cell" } };
const link = "font-semibold text-steel underline-offset-2 hover:underline";

export const flagColumns = [
  col.accessor("jobCode", {
    id: "job",
    header: "Job",
    ...fromLaptop,
    cell: ({ row }) => (
      <span className="flex flex-col">
        <span className="font-mono text-sm">{row.original.jobCode}</span>
        <span className="text-xs text-muted">{row.original.jobTitle}</span>
      </span>
    ),
  }),
  col.accessor("station", {
    id: "station",
    header: "Station",
    cell: ({ row }) => (
      <span className="flex flex-col gap-0.5">
        <Link
          href={`/desk/flags/${row.original.id}`}
          className={`flex min-h-11 flex-col justify-center ${link}`}
          data-testid="open-flag"
        >
          <span>{row.original.station}</span>
          <span className="text-xs font-normal text-muted">
            {row.original.characteristicLabel}
            {row.original.derived ? " (computed)" : ""}
          </span>
        </Link>
        <FoldedDetail flag={row.original} />
      </span>
    ),
  }),
  col.accessor("value", {
    id: "value",
    header: "Value",
    cell: ({ row }) => (
      <span className="tabular whitespace-nowrap">{withUnit(row.original.value, row.original.unit)}</span>
    ),
  }),
  col.display({
    id: "limits",
    header: "Limits",
    ...fixed,
    ...fromDesktop,
    cell: ({ row }) => (
      <span className="tabular whitespace-nowrap text-sm">
        {limitsText(row.original.limitMin, row.original.limitMax, row.original.unit)}
      </span>
    ),
  }),
  col.accessor("deviation", {
    id: "deviation",
    header: "Deviation",
    ...fromDesktop,
    cell: ({ row }) => (
      <span className="whitespace-nowrap text-sm">{deviationText(row.original.deviation, row.original.unit)}</span>
    ),
  }),
  col.accessor("verdict", {
    id: "verdict",
    header: "Verdict",
    cell: ({ row }) => (
      <span className="flex flex-col items-start gap-1 whitespace-nowrap">
        <VerdictBadge verdict={row.original.verdict} size="sm" />
        <span className="xl:hidden">
          <ReasonTag reason={row.original.reason} />
        </span>
      </span>
    ),
  }),
  col.accessor("reason", {
    id: "reason",
    header: "Reason",
    ...fromDesktop,
    cell: ({ row }) => <ReasonTag reason={row.original.reason} />,
  }),
  col.display({
    id: "gauge",
    header: "Gauge",
    ...fixed,
    ...fromDesktop,
    cell: ({ row }) => (
      <span className="text-sm">
        <GaugeText flag={row.original} />
      </span>
    ),
  }),
  col.display({
    id: "taken",
    header: "Who and when",
    ...fixed,
    ...fromDesktop,
    cell: ({ row }) => (
      <span className="flex flex-col text-sm">
        <span>{takenBy(row.original)}</span>
        <span className="text-xs text-muted">{takenWhen(row.original)}</span>
      </span>
    ),
  }),
  col.accessor("judgedAt", {
    id: "age",
    header: "Age",
    cell: ({ row }) => <span className="tabular whitespace-nowrap text-sm">{age(row.original.judgedAt)}</span>,
  }),
  col.accessor("state", {
    id: "state",
    header: "Decision",
    cell: ({ row }) => (
      <Link
        href={`/desk/flags/${row.original.id}#decide`}
        className="inline-flex min-h-11 items-center rounded-tool"
        data-testid="flag-decision"
      >
        <DecisionTag
          state={row.original.state}
          disposition={row.original.disposition}
          operation={row.original.operation}
        />
        <span className="sr-only">, {row.original.station}</span>
      </Link>
    ),
  }),
];
