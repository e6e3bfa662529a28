import "server-only";
import type { Canvas, Column } from "@/lib/server/record/pdf-canvas";
import { F, MUTED } from "@/lib/server/record/pdf-styles";
import type { BearingRecordLine } from "@/lib/schemas/record";

// The record's bearing selection: the halves chosen for each point and where each went, the
// clearance predicted for them (± its U, k = 2) and the clearance measured once installed.

const T = F.table;
const COLUMNS: Column<BearingRecordLine>[] = [
  { title: "Bearing", width: 13, cell: (b) => [{ text: b.point, font: F.bold, size: T }] },
  { title: "Upper half", width: 24, cell: (b) => [{ text: b.upper, size: T }] },
  { title: "Lower half", width: 24, cell: (b) => [{ text: b.lower, size: T }] },
  { title: "Predicted", width: 15, cell: (b) => [{ text: b.predicted, size: T }] },
  { title: "Measured", width: 12, cell: (b) => [{ text: b.measured, size: T }] },
  { title: "Difference", width: 12, cell: (b) => [{ text: b.difference, size: T }] },
];

export function bearingSection(c: Canvas, lines: BearingRecordLine[] | undefined): void {
  if (!lines?.length) return;
  c.heading("Bearing shell selection");
  c.table(COLUMNS, lines);
  c.text([
    {
      text:
        "Predicted: housing bore less both walls less the journal, before assembly. Measured: installed bore less " +
        "journal at the bench. The engine and bearing maker's clearances govern.",
      size: F.small,
      colour: MUTED,
    },
  ]);
}
