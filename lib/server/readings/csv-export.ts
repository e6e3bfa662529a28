import "server-only";

// CSV as a spreadsheet opens it without surprises. The choices, on purpose:
// - UTF-8 with a byte order mark (EF BB BF), so spreadsheet programs detect UTF-8 and show
//   "lbf·ft", "µm" and people's names correctly instead of guessing a legacy code page.
// - RFC 4180: comma-separated fields, CRLF line ends, a header row; a field holding a comma,
//   a double quote, CR or LF is wrapped in double quotes and its quotes doubled.
// - Numbers in plain decimal notation with a point (0.0000001, never 1e-7), no thousands
//   separators, no locale: a spreadsheet set to decimal commas imports it with its
//   "from text/CSV" dialog, choosing comma as the delimiter.
// - Dates and times in ISO 8601 UTC (2026-12-01T09:30:00.000Z).
// - Text cells that begin with = + - @ (or a tab or CR) get a leading apostrophe, so a
//   spreadsheet never runs a cell as a formula (OWASP "CSV injection"); numbers are untouched.
//
// The readings export (csv-export-rows.ts), one row per reading or computed value, columns in
// this order: row ("reading" or "derived"), station (id), station (words), characteristic,
// value, unit, min, max, verdict, deviation, gauge serial, taken by, taken at (UTC, ISO 8601),
// superseded? ("yes"/"no"), lubricant (torque readings, in words), skip reason (skipped
// readings), decision (the latest decision on the row's flag: "Measure again", "Machine again
// (operation)", "Accepted as is", or "Flagged, no decision yet" / "Flag closed, no decision").
// Figures are in the job's units (named in the headers); min and max are rounded to the unit's
// display resolution (0.0001 in, 0.001 mm, 1 lbf·ft, 1 N·m: the core's roundToResolution, plain
// decimal rounding, a half away from zero), values and deviations are written as stored.
export const BOM = "\uFEFF";

export type Cell = string | number | null | undefined;

/** A number in plain decimal notation with a point; empty for null/undefined/non-finite. */
export function plainNumber(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "";
  const s = String(x);
  if (!s.includes("e")) return s; // a number's text writes its exponent with a small e
  // Twelve significant digits is finer than any gauge (see lib/domain cleanDecimal).
  const fixed = Math.abs(x) < 1 ? x.toFixed(Math.min(20, 12 - Math.floor(Math.log10(Math.abs(x))))) : x.toFixed(0);
  return fixed.includes(".") ? fixed.replace(/0+$/, "").replace(/\.$/, "") : fixed;
}

// The first characters that make a spreadsheet read a cell as a formula: = + - @ tab CR.
const FORMULA_START = new Set([61, 43, 45, 64, 9, 13]);
const NEEDS_QUOTES = /[",\r\n]/;

function textCell(s: string): string {
  return FORMULA_START.has(s.charCodeAt(0)) ? `'${s}` : s;
}

export function csvField(cell: Cell): string {
  // A number's text is digits, a point and a sign: never quoted, never a formula.
  if (typeof cell === "number") return plainNumber(cell);
  if (cell === null || cell === undefined || cell === "") return "";
  const s = textCell(cell);
  return NEEDS_QUOTES.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** One record and its CRLF. */
export const csvLine = (cells: Cell[]): string => `${cells.map(csvField).join(",")}\r\n`;

/** The whole file: BOM, header, rows, CRLF after every record. */
export function toCsv(header: string[], rows: Cell[][]): string {
  return `${BOM}${[header, ...rows].map(csvLine).join("")}`;
}
