// An in-memory stand-in for the sync server, following the contract in lib/schemas/sync.ts:
// upsert by client id (a replay is accepted again, never stored twice), all-or-nothing batches
// (one refused reading holds the rest), per-item results, a change feed with a cursor.
// It checks far less than the real server; it exists to drive the client engine through the
// replies it must handle. Its verdicts come from lib/domain, like the real one's.
import { benchRoute, evaluateReading, type EngineShape, type SpecLimit } from "@/lib/domain";
import type {
  BenchFlag,
  BenchInstrument,
  JobPack,
  PushReadingInput,
  PushResult,
  ServerReading,
  SyncFeed,
} from "@/lib/schemas/sync";

export const SHAPE: EngineShape = {
  cylinders: 4,
  layout: "inline",
  mains: 5,
  valvesPerCylinder: 2,
  unitSystem: "inch",
  nominalSizes: { bore: 4.03 },
};
export const SPEC: SpecLimit[] = [
  {
    characteristic: "bore_diameter",
    stationPattern: "bore/*",
    limitType: "nominal_tol",
    unit: "in",
    nominal: 4.03,
    tolPlus: 0.0005,
    tolMinus: 0.0005,
    required: true,
  },
];

/** A test shop's gauges, one of each kind a station needs (invented); only the bore gauge has a range. */
export const BENCH_GAUGES: BenchInstrument[] = (
  [
    [21, "bore_gauge_digital", "Test bore gauge", "in", [2, 6]],
    [22, "outside_mic", "Test micrometer", "in", null],
    [23, "feeler", "Test feeler set", "in", null],
    [24, "dial_indicator", "Test dial indicator", "in", null],
    [25, "stretch_gauge", "Test stretch gauge", "in", null],
    [26, "deck_gauge", "Test deck gauge", "in", null],
    [27, "torque_wrench", "Test torque wrench", "lbf_ft", null],
  ] as const
).map(([id, kind, label, unit, range]) => ({
  id,
  kind,
  label,
  serial: `T-${id}`,
  unit,
  resolution: unit === "lbf_ft" ? 1 : 0.0001,
  expandedU: 0,
  coverageK: 2,
  rangeMin: range?.[0] ?? null,
  rangeMax: range?.[1] ?? null,
  calibrationDue: null,
  dialPlusMeansSmaller: true,
  active: true,
}));

export function makePack(jobId: number, over: Partial<JobPack["job"]> = {}): JobPack {
  return {
    job: {
      id: jobId,
      code: `T-${jobId}`,
      title: "Test job",
      status: "measuring",
      unitSystem: "in",
      locked: false,
      lockedAt: null,
      lockReason: null,
      specRevision: 1,
      dueDate: null,
      customer: "C",
      engine: "E",
      ...over,
    },
    shape: SHAPE,
    spec: SPEC,
    route: benchRoute(SHAPE),
    instruments: BENCH_GAUGES,
    readings: [],
    flags: [],
    cursor: "0",
  };
}

type Handler = (url: URL, init: RequestInit) => Promise<Response> | Response;
const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });
const same = (a: PushReadingInput, b: PushReadingInput) =>
  JSON.stringify({ ...a, entryMode: a.entryMode ?? "direct" }) ===
  JSON.stringify({ ...b, entryMode: b.entryMode ?? "direct" });

export class FakeServer {
  readonly stored = new Map<string, { sent: PushReadingInput; row: ServerReading }>();
  readonly locked = new Set<number>();
  readonly flags: BenchFlag[] = [];
  readonly changes: { id: number; readingId?: string; flagId?: number }[] = [];
  pushes = 0;
  /** Run before the server handles a request: throw to fail in transit, or return a reply. */
  before?: (url: URL, init: RequestInit) => Response | void | Promise<Response | void>;
  /** Run after the server handled a push (it is stored): throw to lose the answer. */
  after?: () => void | Promise<void>;
  uploads = new Map<string, FormData>();
  uploadStatus = 201;
  status = 0;

  readonly fetch = async (input: RequestInfo | URL, init: RequestInit = {}): Promise<Response> => {
    const url = new URL(String(input));
    const early = await this.before?.(url, init);
    if (early) return early;
    const route: Handler | undefined =
      url.pathname === "/api/sync"
        ? init.method === "POST"
          ? this.push
          : this.pull
        : url.pathname === "/api/attachments"
          ? this.upload
          : undefined;
    if (!route) return json(404, { error: { code: "not_found", message: "No such route" } });
    const res = await route(url, init);
    if (init.method === "POST" && url.pathname === "/api/sync") await this.after?.();
    return res;
  };

  private check(r: PushReadingInput): { code: "invalid" | "job_locked" | "conflict"; reason: string } | undefined {
    if (this.locked.has(r.jobId))
      return { code: "job_locked", reason: `Job ${r.jobId} is released; readings are locked` };
    if (!r.skipped && (r.value === undefined || r.value === null)) return { code: "invalid", reason: "Enter a value" };
    const have = this.stored.get(r.id);
    if (have && !same(have.sent, r)) return { code: "conflict", reason: "This id already holds a different reading" };
    return undefined;
  }

  private serverRow(r: PushReadingInput): ServerReading {
    const ev =
      r.value == null
        ? undefined
        : evaluateReading({ stationId: r.stationId, value: r.value, unit: r.unit }, SHAPE, SPEC);
    return {
      id: r.id,
      jobId: r.jobId,
      stationId: r.stationId,
      characteristic: "bore_diameter",
      value: r.value ?? null,
      unit: r.unit,
      valueCanonical: null,
      entryMode: r.entryMode ?? "direct",
      dialSetting: r.dialSetting ?? null,
      dialDeviation: r.dialDeviation ?? null,
      instrumentId: r.instrumentId ?? null,
      partTempC: null,
      gaugeTempC: null,
      lubricant: null,
      skipped: !!r.skipped,
      skipReason: r.skipReason ?? null,
      note: null,
      supersedes: r.supersedes ?? null,
      supersededBy: null,
      takenAt: r.takenAt,
      receivedAt: new Date().toISOString(),
      takenBy: 7,
      deviceId: "dev",
      verdict: ev?.verdict ?? null,
      verdictNote: null,
      limitMin: ev?.limits?.min ?? null,
      limitMax: ev?.limits?.max ?? null,
      deviation: ev?.deviation ?? null,
    };
  }

  private push = async (_url: URL, init: RequestInit): Promise<Response> => {
    this.pushes++;
    if (this.status) return json(this.status, { error: { code: "oops", message: "Server trouble" } });
    const { readings } = JSON.parse(String(init.body)) as { deviceId: string; readings: PushReadingInput[] };
    const problems = readings.map((r) => this.check(r));
    if (problems.some(Boolean)) {
      const results: PushResult[] = readings.map((r, index) => {
        const p = problems[index];
        return p
          ? { index, id: r.id, status: "rejected", code: p.code, reason: p.reason }
          : { index, id: r.id, status: "held" };
      });
      const allLocked = problems.every((p) => !p || p.code === "job_locked");
      return json(allLocked ? 409 : 422, {
        error: { code: allLocked ? "job_locked" : "invalid", message: "Some readings were refused", fields: {} },
        results,
        cursor: "0",
      });
    }
    const results: PushResult[] = readings.map((r, index) => {
      const replay = this.stored.has(r.id);
      if (!replay) {
        this.stored.set(r.id, { sent: r, row: this.serverRow(r) });
        this.changes.push({ id: this.changes.length + 1, readingId: r.id });
      }
      const row = this.stored.get(r.id)!.row;
      return {
        index,
        id: r.id,
        status: "accepted",
        replay,
        verdict: row.verdict,
        evaluation: {
          verdict: row.verdict,
          verdictNote: null,
          unit: row.unit,
          limitMin: row.limitMin,
          limitMax: row.limitMax,
          deviation: row.deviation,
        },
      };
    });
    return json(200, { results, cursor: String(this.changes.length) });
  };

  private pull = (url: URL): Response => {
    const since = Number(url.searchParams.get("since") ?? "0");
    const jobs = (url.searchParams.get("jobs") ?? "").split(",").map(Number);
    const rows = this.changes.filter((c) => c.id > since);
    const feed: SyncFeed = {
      cursor: String(this.changes.length),
      more: false,
      jobs: [],
      limits: [],
      missing: [],
      readings: rows
        .flatMap((c) => (c.readingId ? [this.stored.get(c.readingId)!.row] : []))
        .filter((r) => jobs.includes(r.jobId)),
      flags: rows.flatMap((c) => this.flags.filter((f) => f.id === c.flagId)),
    };
    return json(200, feed);
  };

  private upload = async (_url: URL, init: RequestInit): Promise<Response> => {
    const form = init.body as FormData;
    if (this.uploadStatus < 300) this.uploads.set(String(form.get("clientId")), form);
    return json(
      this.uploadStatus,
      this.uploadStatus < 300 ? { id: form.get("clientId") } : { error: { code: "x", message: "Upload refused" } },
    );
  };

  /** Another tablet's reading, as the feed would carry it. */
  addForeign(r: PushReadingInput): void {
    this.stored.set(r.id, { sent: r, row: { ...this.serverRow(r), deviceId: "tab-other", takenBy: 9 } });
    this.changes.push({ id: this.changes.length + 1, readingId: r.id });
  }
}
