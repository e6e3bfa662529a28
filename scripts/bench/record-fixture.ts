// BENCHMARK DATA ONLY: a fully measured, released small-block V8 for `npm run bench:record`, built
// in memory and turned into a BuildRecord by the same assembly the server uses (assembleBuildRecord):
// every station of the V8's route (figures from scripts/bench/sync-readings.ts), verdicts from the
// core's evaluateReading against the demo street spec, a flag with an "accept" decision for each
// reading out of spec, the demo inch gauges, a build plan, ten photos through the upload's
// thumbnail step, and a release whose fingerprint is the release hash of that record.
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { benchRoute, currentReadings, evaluateReading, parseStationId, stationWords } from "@/lib/domain";
import { toSpecLimit } from "@/lib/server/jobs/context";
import { assembleBuildRecord } from "@/lib/server/record/data";
import { buildSnapshot, gaugeRecord } from "@/lib/server/release/hash-snapshot";
import { CANONICAL_VERSION, itemDigests, releaseHash } from "@/lib/server/release/hash";
import type { InstrumentRow, JobRecord, LimitRow, ReleaseRow } from "@/lib/server/release/repo";
import { instrumentInfo, storedEvaluation, toRaw } from "@/lib/server/sync/ingest-evaluate";
import { makeThumbnail } from "@/lib/server/uploads/content";
import type { JsonValue } from "@/lib/schemas/json";
import type { StoredReading } from "@/lib/schemas/readings";
import type { BearingRecordLine, BuildRecord, PhotoLine } from "@/lib/schemas/record";
import { DEMO_GAUGES } from "../seed/demo-gauges";
import { STREET_V8_INCH } from "../seed/demo-specs";
import { benchReadings, V8 } from "./sync-readings";
import { BENCH_PARTIES as PARTIES, BENCH_PLAN as PLAN } from "./record-fixture-parties";

const SHOP_ID = 1;
const JOB_ID = 1;
const MACHINIST = 2;
const INSPECTOR = 3;
const T0 = Date.UTC(2026, 10, 30, 8, 0);

function instruments(): InstrumentRow[] {
  const when = new Date(T0);
  return DEMO_GAUGES.filter((g) => g.unit === "in" || g.unit === "lbf_ft").map(({ master, ...g }, i) => ({
    ...g,
    id: i + 1,
    shopId: SHOP_ID,
    coverageK: 2,
    dialPlusMeansSmaller: true,
    active: true,
    certificateAttachmentId: null,
    masterLabel: master?.label ?? null,
    masterSize: master?.size ?? null,
    masterU: master?.expandedU ?? null,
    createdAt: when,
    updatedAt: when,
  }));
}

function limits(): LimitRow[] {
  return STREET_V8_INCH.map((l, i) => ({
    id: i + 1,
    jobId: JOB_ID,
    min: null,
    max: null,
    nominal: null,
    tolPlus: null,
    tolMinus: null,
    perInchMin: null,
    perInchMax: null,
    isoClass: null,
    gaugeKind: null,
    label: null,
    ...l,
    sortOrder: i,
    commonPractice: false,
    createdAt: new Date(T0),
    updatedAt: new Date(T0),
  }));
}

/** A gauge of the right unit whose range holds the figure, as the tablet would offer. */
function gaugeFor(gauges: InstrumentRow[], unit: string, value: number): InstrumentRow | undefined {
  return gauges.find((g) => g.unit === unit && (g.rangeMin ?? 0) <= value && value <= (g.rangeMax ?? Infinity));
}

function readings(record: Omit<JobRecord, "readings" | "flags" | "dispositions">): StoredReading[] {
  const pushed = benchReadings([JOB_ID], benchRoute(V8).total, new Date(T0).toISOString());
  return pushed.map((p, i) => {
    const takenAt = new Date(T0 + i * 40_000);
    const g = gaugeFor(record.instruments, p.unit, p.value as number);
    const row = {
      id: p.id,
      stationId: p.stationId,
      value: p.value as number,
      unit: p.unit,
      partTempC: null,
      gaugeTempC: null,
      lubricant: p.lubricant ?? null,
      instrumentId: g?.id ?? null,
      takenAt,
    };
    const ev = evaluateReading(toRaw(row, g ? instrumentInfo(g) : undefined), record.shape, record.spec);
    const { unit: _u, ...verdict } = storedEvaluation(ev, p.unit, false);
    return {
      ...row,
      ...verdict,
      shopId: SHOP_ID,
      jobId: JOB_ID,
      characteristic: parseStationId(p.stationId).characteristic ?? "",
      valueCanonical: null,
      entryMode: "direct" as const,
      dialSetting: null,
      dialDeviation: null,
      skipped: false,
      skipReason: null,
      note: i % 37 === 5 ? "Checked twice; same figure." : null,
      takenBy: MACHINIST,
      receivedAt: takenAt,
      deviceId: "bench-tablet",
      supersedes: null,
    };
  });
}

/** An accepted flag per reading out of spec, with the decision's words. */
function flagsOf(rows: StoredReading[]): Pick<JobRecord, "flags" | "dispositions"> {
  const out = rows.filter((r) => r.verdict === "out_of_spec");
  const at = new Date(T0 + 4 * 3600_000);
  const reason = "Customer agreed after measuring again; within the part maker's extended range (benchmark data)";
  const flags = out.map((r, i) => ({
    id: i + 1,
    shopId: SHOP_ID,
    jobId: JOB_ID,
    readingId: r.id,
    derivedKey: null,
    stationId: r.stationId,
    characteristic: r.characteristic,
    value: r.value as number,
    unit: r.unit,
    limitMin: r.limitMin,
    limitMax: r.limitMax,
    deviation: r.deviation,
    verdict: "out_of_spec" as const,
    reason: "out_of_spec" as const,
    state: "disposed" as const,
    disposition: "accept" as const,
    operation: null,
    dispositionReason: reason,
    disposedBy: INSPECTOR,
    disposedAt: at,
    closedAt: null,
    closedByReadingId: null,
    judgedAt: r.takenAt,
    jobCode: "BENCH-V8",
    createdAt: r.takenAt,
    updatedAt: at,
  }));
  const dispositions = flags.map((f, i) => ({
    id: i + 1,
    flagId: f.id,
    disposition: "accept" as const,
    operation: null,
    reason,
    userId: INSPECTOR,
    createdAt: at,
  }));
  return { flags, dispositions };
}

/** Ten 3000×2250 phone-sized pictures, reduced by the upload's own thumbnail step. */
async function photos(current: StoredReading[]): Promise<{ photos: PhotoLine[]; byReading: Map<string, string[]> }> {
  const byReading = new Map<string, string[]>();
  const lines = await Promise.all(
    Array.from({ length: 10 }, async (_, i) => {
      const big = await sharp({
        create: {
          width: 3000,
          height: 2250,
          channels: 3,
          background: "#808080",
          noise: { type: "gaussian", mean: 90 + i * 10, sigma: 40 },
        },
      })
        .jpeg({ quality: 90 })
        .toBuffer();
      const thumb = await makeThumbnail(big, "image/jpeg", `photo-${i + 1}.jpg`);
      const reading = current[i * 17];
      const n = `Photo ${i + 1}`;
      byReading.set(reading.id, [n]);
      return {
        id: randomUUID(),
        caption: `${n}: ${stationWords(reading.stationId)}`,
        thumb,
        note: `photo-${i + 1}.jpg`,
      };
    }),
  );
  return { photos: lines, byReading };
}

// The bearing section of a V8: five mains and eight rods, halves chosen by the selection, the
// clearance predicted beside the one measured once installed (invented bench figures).
const shellPair = (set: string, role: "main" | "rod") =>
  role === "main"
    ? { upper: `${set}, upper (block side)`, lower: `${set}, lower (cap side)` }
    : { upper: `${set}, upper (rod side)`, lower: `${set}, lower (cap side)` };
const bearings: BearingRecordLine[] = [
  ...[22, 21, 23, 22, 24].map((c, i) => ({
    point: `Main ${i + 1}${i === 2 ? " (thrust)" : ""}`,
    ...shellPair(i === 2 ? "Bench thrust, standard" : "Bench mains, standard", "main"),
    predicted: `0.00${c} in ± 0.0003 in, in spec`,
    measured: `0.00${c + (i % 2)} in`,
    difference: i % 2 ? "+0.0001 in" : "0.0000 in",
  })),
  ...[20, 21, 19, 20, 22, 20, 21, 20].map((c, i) => ({
    point: `Rod ${i + 1}`,
    ...shellPair(i === 2 ? "Bench rods, 0.001 in thicker" : "Bench rods, standard", "rod"),
    predicted: `0.00${c} in ± 0.0003 in, in spec`,
    measured: `0.00${c} in`,
    difference: "0.0000 in",
  })),
];

export type RecordFixture = { build(now?: Date): BuildRecord; stations: number; photos: number };

/** The fixture, built once; build() assembles a fresh BuildRecord (as each download does). */
export async function fullV8Record(): Promise<RecordFixture> {
  const lim = limits();
  const base = {
    job: {
      id: JOB_ID,
      shopId: SHOP_ID,
      customerId: 1,
      engineId: 1,
      templateId: null,
      code: "BENCH-V8",
      title: "Benchmark V8, every station measured",
      unitSystem: "in" as const,
      status: "released" as const,
      dueDate: null,
      notes: null,
      buildPlan: PLAN,
      finishedBore: 4.03,
      finishedMainJournal: 2.449,
      finishedRodJournal: 2.099,
      specRevision: 1,
      lockedAt: new Date(T0 + 5 * 3600_000),
      createdAt: new Date(T0),
      updatedAt: new Date(T0),
    },
    customerName: PARTIES.customer.name,
    engineDescription: PARTIES.engine.description,
    shape: { ...V8, finishedSizes: { bore: 4.03, mainJournal: 2.449, rodJournal: 2.099 } },
    spec: lim.map(toSpecLimit),
    limits: lim,
    instruments: instruments(),
    studies: new Map(),
  };
  const rows = readings(base);
  const record: JobRecord = { ...base, readings: rows, ...flagsOf(rows) };
  const signedAt = new Date(T0 + 5 * 3600_000);
  const sig = { inspectorId: INSPECTOR, signedName: "Bench Inspector", signedAt };
  const gauges = record.instruments.map(gaugeRecord);
  const snapshot = buildSnapshot(record, sig, gauges);
  const hash = releaseHash(snapshot);
  const release: ReleaseRow = {
    id: 1,
    shopId: SHOP_ID,
    jobId: JOB_ID,
    ...sig,
    checklist: { version: CANONICAL_VERSION, checks: [], gauges, digests: itemDigests(snapshot) } as JsonValue,
    hash,
    canonicalVersion: CANONICAL_VERSION,
    voidedAt: null,
    voidedBy: null,
    voidReason: null,
    recordKey: null,
    recordSha256: null,
    recordBytes: null,
    recordStoredAt: null,
    createdAt: signedAt,
    updatedAt: signedAt,
  };
  const names = new Map([
    [MACHINIST, "Bench Machinist"],
    [INSPECTOR, "Bench Inspector"],
  ]);
  const pics = await photos([...currentReadings(rows).values()]);
  return {
    build: (now?: Date) =>
      assembleBuildRecord({ record, parties: PARTIES, releases: [release], names, photos: pics, bearings, now }),
    stations: rows.length,
    photos: pics.photos.length,
  };
}
