import "server-only";
import { Readable } from "node:stream";
import { ZipArchive } from "archiver";
import { BOM, csvField, type Cell } from "@/lib/server/readings/csv-export";
import { AUDIT, CSV_FILES, type ArchiveFile, type Column } from "@/lib/server/archive/files";
import { pageRows, type ArchiveShopRow, type Row } from "@/lib/server/archive/repo";

// The shop archive as a zip written while it is downloaded: each file's rows are read a page at a
// time and handed to the zip as they come, so memory stays one page whatever the shop's size.
// The format (files, columns, units, encodings) is documented in docs/archive-format.md.

export const ARCHIVE_FORMAT = "tenthwise.shop-archive";
export const ARCHIVE_VERSION = 1;
export const PAGE_ROWS = 500;
export const ARCHIVE_FILES = [...CSV_FILES.map((f) => f.name), AUDIT.name, "manifest.json"];

const pad = (n: number) => String(n).padStart(2, "0");

function dateOnly(v: unknown): string {
  if (v instanceof Date) return `${v.getUTCFullYear()}-${pad(v.getUTCMonth() + 1)}-${pad(v.getUTCDate())}`;
  return v === null || v === undefined ? "" : String(v);
}

function jsonText(v: unknown): string | null {
  if (v === null || v === undefined) return null;
  return typeof v === "string" ? v : JSON.stringify(v);
}

/** One value as its CSV cell (numbers in plain decimal, times ISO 8601 UTC, yes/no). */
function cellOf(c: Column, v: unknown): Cell {
  if (v === null || v === undefined) return null;
  if (c.kind === "number") return typeof v === "bigint" ? v.toString() : Number(v);
  if (c.kind === "time") return v instanceof Date ? v.toISOString() : String(v);
  if (c.kind === "date") return dateOnly(v);
  if (c.kind === "bool") return Number(v) ? "yes" : "no";
  if (c.kind === "json") return jsonText(v);
  return String(v);
}

/** One value as JSON (times ISO 8601 UTC; JSON columns parsed back into structure). */
function jsonValueOf(c: Column, v: unknown): unknown {
  if (v === null || v === undefined) return null;
  if (c.kind === "json") return typeof v === "string" ? JSON.parse(v) : v;
  return cellOf(c, v);
}

/** Every row of one file for the shop, a page at a time. */
async function* rowsOf(file: ArchiveFile, shopId: number, pageSize: number): AsyncGenerator<Row[]> {
  const select = [...file.columns.map((c, i) => `${c.sql} AS c${i}`), ...file.key.map((k, i) => `${k} AS k${i}`)].join(
    ", ",
  );
  const query = { select, from: file.from, shopColumn: file.shopColumn, key: file.key };
  let from: unknown[] | null = null;
  for (;;) {
    const rows = await pageRows(query, shopId, from, pageSize);
    if (rows.length > 0) yield rows;
    if (rows.length < pageSize) return;
    const last = rows[rows.length - 1];
    from = file.key.map((_, i) => last[`k${i}`]);
  }
}

type Counts = Record<string, number>;

async function* csvText(file: ArchiveFile, shopId: number, counts: Counts, pageSize: number): AsyncGenerator<string> {
  counts[file.name] = 0;
  yield `${BOM}${file.columns.map((c) => csvField(c.header)).join(",")}\r\n`;
  for await (const rows of rowsOf(file, shopId, pageSize)) {
    counts[file.name] += rows.length;
    yield rows.map((r) => file.columns.map((c, i) => csvField(cellOf(c, r[`c${i}`]))).join(",") + "\r\n").join("");
  }
}

async function* jsonLines(file: ArchiveFile, shopId: number, counts: Counts, pageSize: number): AsyncGenerator<string> {
  counts[file.name] = 0;
  for await (const rows of rowsOf(file, shopId, pageSize)) {
    counts[file.name] += rows.length;
    const objects = rows.map((r) =>
      Object.fromEntries(file.columns.map((c, i) => [c.header, jsonValueOf(c, r[`c${i}`])])),
    );
    yield objects.map((o) => `${JSON.stringify(o)}\n`).join("");
  }
}

/** The zip as a Node stream; entries are produced one after another as the reader pulls. */
export function shopArchive(
  shop: ArchiveShopRow,
  exportedBy: { id: number; name: string },
  { pageRows: pageSize = PAGE_ROWS } = {},
): Readable {
  const zip = new ZipArchive({ zlib: { level: 6 } });
  const counts: Counts = {};
  const exportedAt = new Date().toISOString();
  for (const file of CSV_FILES)
    zip.append(Readable.from(csvText(file, shop.id, counts, pageSize)), { name: file.name });
  zip.append(Readable.from(jsonLines(AUDIT, shop.id, counts, pageSize)), { name: AUDIT.name });
  // Last, once the audit trail's entry is written, so it counts every file's rows (the zip takes its
  // sources in order but starts reading each as it is queued).
  zip.on("entry", (entry) => {
    if (entry.name !== AUDIT.name) return;
    const files = Object.entries(counts).map(([name, rows]) => ({ name, rows }));
    const body = { format: ARCHIVE_FORMAT, version: ARCHIVE_VERSION, exportedAt, exportedBy, shop, files };
    zip.append(`${JSON.stringify(body, null, 2)}\n`, { name: "manifest.json" });
    void zip.finalize();
  });
  return zip;
}
