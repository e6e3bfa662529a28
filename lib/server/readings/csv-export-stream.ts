import "server-only";
import { benchRoute, currentValues } from "@/lib/domain";
import type { StoredReading } from "@/lib/schemas/readings";
import { settleAll } from "@/lib/server/core/sql-driver";
import { withReads } from "@/lib/server/core/sql-read";
import { jobContextOn } from "@/lib/server/jobs/repo";
import { BOM, csvLine } from "@/lib/server/readings/csv-export";
import {
  csvHeader,
  decisionsBy,
  derivedRows,
  readingRow,
  unitsOf,
  type RowContext,
  type Units,
} from "@/lib/server/readings/csv-export-rows";
import { flagDecisions } from "@/lib/server/flags/repo";
import { stationsWithReadings } from "@/lib/server/readings/csv-repo";
import { currentJobReadings, jobReadingPage } from "@/lib/server/readings/repo";
import { findInstruments, shopGaugesOn } from "@/lib/server/readings/gauge-repo";
import type { InstrumentInfo } from "@/lib/server/sync/ingest-evaluate";
import { toRaw } from "@/lib/server/sync/ingest-evaluate";
import { peopleNames } from "@/lib/server/users/repo";

// The readings CSV written while it is downloaded, in constant memory whatever the job's size: the
// current readings (one per station) are picked as the job's rows stream past (repo.ts's
// currentJobReadings); with history, the rest are read a page
// at a time per station in bench order (stations off the route last, together, in taken order),
// each page with its own flags and gauges, and handed on before the next is read. Every read goes
// through the driver (sql-read.ts), side by side where one does not need another's answer.

export const CSV_PAGE_ROWS = 500;

type Shared = {
  units: Units;
  current: Set<string>;
  instruments: Map<number, InstrumentInfo>;
  takers: Map<number, string>;
};

/** The job's stations in bench order, each its own group; stations off the route form the last group. */
function stationGroups(route: string[], withReadings: string[]): string[][] {
  const has = new Set(withReadings);
  const onRoute = new Set(route);
  const off = withReadings.filter((id) => !onRoute.has(id));
  return [...route.filter((id) => has.has(id)).map((id) => [id]), ...(off.length ? [off] : [])];
}

async function rowsOf(shopId: number, jobId: number, page: StoredReading[], shared: Shared): Promise<string> {
  const gaugeIds = page.flatMap((r) =>
    r.instrumentId && !shared.instruments.has(r.instrumentId) ? [r.instrumentId] : [],
  );
  const [gauges, flags] = await Promise.all([
    findInstruments(undefined, shopId, gaugeIds),
    flagDecisions(
      shopId,
      jobId,
      page.map((r) => r.id),
    ),
  ]);
  for (const [id, g] of gauges) shared.instruments.set(id, g);
  return pageRows(page, shared, decisionsBy(flags, "readingId"));
}

function pageRows(page: StoredReading[], shared: Shared, decisions: RowContext["decisions"]): string {
  const ctx: RowContext = { ...shared, decisions };
  return page.map((r) => csvLine(readingRow(r, shared.units, ctx))).join("");
}

async function* historyRows(shopId: number, jobId: number, route: string[], shared: Shared): AsyncGenerator<string> {
  for (const stations of stationGroups(route, await stationsWithReadings(jobId))) {
    let from: StoredReading | null = null;
    for (;;) {
      const page = await jobReadingPage(jobId, stations, from, CSV_PAGE_ROWS);
      if (page.length) yield await rowsOf(shopId, jobId, page, shared);
      if (page.length < CSV_PAGE_ROWS) break;
      from = page[page.length - 1];
    }
  }
}

/**
 * The job's readings CSV (format in csv-export.ts, rows in csv-export-rows.ts): the job is looked up
 * first (404 before anything is sent), then `lines` yields the file a piece at a time.
 */
export async function readingsCsv(shopId: number, jobId: number, opts: { history?: boolean } = {}) {
  // In one round trip on one connection: the job (a 404 before anything is sent), its current
  // readings, the shop's people and gauges, and the flags of its computed values and (without
  // history, where each page reads its own) of its readings; the CSV prints those of current ones.
  const [ctx, currents, takers, instruments, flags] = await withReads((read, stream) =>
    settleAll([
      jobContextOn(read, shopId, jobId),
      currentJobReadings(jobId, read, stream),
      peopleNames(shopId, read),
      shopGaugesOn(read, shopId),
      flagDecisions(shopId, jobId, opts.history ? [] : "all", true, read),
    ]),
  );
  const units = unitsOf(ctx.job.unitSystem);
  let route: string[] = [];
  try {
    route = benchRoute(ctx.shape).sections.flatMap((s) => s.stations.map((st) => st.id));
  } catch {
    // An engine the core cannot lay out: readings still export, in the order they were taken.
  }
  async function* lines(): AsyncGenerator<string> {
    const shared: Shared = { units, current: new Set(currents.map((r) => r.id)), instruments, takers };
    yield `${BOM}${csvLine(csvHeader(units))}`;
    if (opts.history) yield* historyRows(shopId, jobId, route, shared);
    else {
      const rank = new Map(route.map((id, i) => [id, i]));
      const at = (r: StoredReading) => rank.get(r.stationId) ?? Number.MAX_SAFE_INTEGER;
      // Sorted stably from the taken order: one reading per station, a route's length at most.
      yield pageRows(
        [...currents].sort((a, b) => at(a) - at(b)),
        shared,
        decisionsBy(flags, "readingId"),
      );
    }
    const values = currentValues(currents);
    const raws = values.map((r) => toRaw(r, r.instrumentId ? instruments.get(r.instrumentId) : undefined));
    yield derivedRows(ctx, raws, units, decisionsBy(flags, "derivedKey")).map(csvLine).join("");
  }
  return { code: ctx.job.code, lines };
}

/** Text pieces as a byte stream read at the reader's pace (each piece made when the reader asks). */
export function textStream(pieces: AsyncGenerator<string>): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  return new ReadableStream<Uint8Array>({
    // Each pull enqueues something or closes: a pull that enqueued nothing would not be called again.
    async pull(controller) {
      for (;;) {
        const next = await pieces.next();
        if (next.done) return controller.close();
        if (next.value) return controller.enqueue(encoder.encode(next.value));
      }
    },
    async cancel() {
      await pieces.return(undefined);
    },
  });
}
