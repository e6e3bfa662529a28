// Multi-row INSERTs for the bulk loader: rows are buffered per table and written a chunk at a
// time, a few statements in flight on one connection (the connector pipelines them), so Node
// builds the next chunk while MariaDB writes the last one.
import type { Connection } from "mariadb";
import type { Row } from "./clone";

// Bytes of SQL per statement, well under max_allowed_packet (16 MB by default).
const CHUNK_BYTES = 4 * 1024 * 1024;
const IN_FLIGHT = 3;

// A value's share of the statement; an object (a release's checklist, an event's JSON) is sent as
// its JSON text, so counting it as a number let a chunk of releases outgrow max_allowed_packet.
function size(v: unknown): number {
  if (typeof v === "string") return Buffer.byteLength(v) + 3;
  if (Buffer.isBuffer(v)) return 2 * v.length + 3;
  if (v instanceof Date || v === null || typeof v !== "object") return 28;
  return Buffer.byteLength(JSON.stringify(v)) + 3;
}

export class BulkWriter {
  private buffers = new Map<string, { columns: string[]; rows: unknown[][]; bytes: number }>();
  private inFlight: Promise<unknown>[] = [];
  readonly written = new Map<string, number>();

  constructor(private conn: Connection) {}

  async add(table: string, rows: Row[]): Promise<void> {
    if (rows.length === 0) return;
    let b = this.buffers.get(table);
    if (!b) this.buffers.set(table, (b = { columns: Object.keys(rows[0]), rows: [], bytes: 0 }));
    for (const row of rows) {
      const values = b.columns.map((c) => row[c]);
      b.rows.push(values);
      b.bytes += values.reduce((n: number, v) => n + size(v), 0);
    }
    if (b.bytes >= CHUNK_BYTES) await this.flush(table);
  }

  private async flush(table: string) {
    const b = this.buffers.get(table);
    if (!b || b.rows.length === 0) return;
    const tuple = `(${b.columns.map(() => "?").join(",")})`;
    const sql = `INSERT INTO ${table} (${b.columns.map((c) => `\`${c}\``).join(",")}) VALUES ${b.rows
      .map(() => tuple)
      .join(",")}`;
    const params = b.rows.flat();
    this.written.set(table, (this.written.get(table) ?? 0) + b.rows.length);
    this.buffers.set(table, { columns: b.columns, rows: [], bytes: 0 });
    const p = this.conn.query(sql, params);
    p.catch(() => {}); // awaited below; this only keeps a failure from being reported twice
    this.inFlight.push(p);
    if (this.inFlight.length >= IN_FLIGHT) await this.inFlight.shift();
  }

  /** Writes what is buffered, parents before children, and waits for every statement. */
  async finish(order: readonly string[]): Promise<void> {
    for (const t of order) await this.flush(t);
    await Promise.all(this.inFlight.splice(0));
  }
}
