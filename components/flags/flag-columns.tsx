"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import type { FlagListItem } from "@/lib/schemas/flag";
import { DecisionTag, ReasonTag } from "./flag-tags";
import { age, deviationText, limitsText, when, withUnit } from "./format";

// The queue's columns. Ids of sortable columns are the server's sort keys (GET /api/flags?sort=).
const col = createColumnHelper<FlagListItem>();
const fixed = { enableSorting: false } as const;

export const flagColumns = [
  col.accessor("jobCode", {
    id: "job",
    header: "Job",
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
      <Link
        href={`/desk/flags/${row.original.id}`}
        className="flex flex-col font-semibold text-steel underline-offset-2 hover:underline"
        data-testid="open-flag"
      >
        <span>{row.original.station}</span>
        <span className="text-xs font-normal text-muted">
          {row.original.characteristicLabel}
          {row.original.derived ? " (computed)" : ""}
        </span>
      </Link>
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
    cell: ({ row }) => (
      <span className="tabular whitespace-nowrap text-sm">
        {limitsText(row.original.limitMin, row.original.limitMax, row.original.unit)}
      </span>
    ),
  }),
  col.accessor("deviation", {
    id: "deviation",
    header: "Deviation",
    cell: ({ row }) => (
      <span className="whitespace-nowrap text-sm">{deviationText(row.original.deviation, row.original.unit)}</span>
    ),
  }),
  col.accessor("verdict", {
    id: "verdict",
    header: "Verdict",
    cell: ({ row }) => (
      <span className="whitespace-nowrap">
        <VerdictBadge verdict={row.original.verdict} size="sm" />
      </span>
    ),
  }),
  col.accessor("reason", {
    id: "reason",
    header: "Reason",
    cell: ({ row }) => <ReasonTag reason={row.original.reason} />,
  }),
  col.display({
    id: "gauge",
    header: "Gauge",
    ...fixed,
    cell: ({ row }) => {
      const g = row.original.gauge;
      if (row.original.derived) return <span className="text-sm text-muted">computed from readings</span>;
      return g ? (
        <span className="flex flex-col text-sm">
          <span>{g.label}</span>
          <span className="font-mono text-xs text-muted">{g.serial}</span>
        </span>
      ) : (
        <span className="text-sm text-muted">none recorded</span>
      );
    },
  }),
  col.display({
    id: "taken",
    header: "Who and when",
    ...fixed,
    cell: ({ row }) => (
      <span className="flex flex-col text-sm">
        <span>{row.original.takenBy ?? (row.original.derived ? "—" : "unknown")}</span>
        <span className="text-xs text-muted">{when(row.original.takenAt ?? row.original.createdAt)}</span>
      </span>
    ),
  }),
  col.accessor("createdAt", {
    id: "age",
    header: "Age",
    cell: ({ row }) => <span className="tabular whitespace-nowrap text-sm">{age(row.original.createdAt)}</span>,
  }),
  col.accessor("state", {
    id: "state",
    header: "Decision",
    cell: ({ row }) => (
      <DecisionTag
        state={row.original.state}
        disposition={row.original.disposition}
        operation={row.original.operation}
      />
    ),
  }),
];
