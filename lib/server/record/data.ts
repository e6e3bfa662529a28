import "server-only";
import {
  EXPANSION_COEFFICIENTS,
  FASTENER_CAUTION,
  characteristicWords,
  currentReadings,
  type SpecLimit,
} from "@/lib/domain";
import { env } from "@/lib/server/core/env";
import { notFound } from "@/lib/server/core/errors";
import { checkRelease } from "@/lib/server/release/hash-verify";
import { listReleases, loadJobRecord, userNames, type JobRecord, type ReleaseRow } from "@/lib/server/release/repo";
import { when, withUnit } from "@/lib/server/record/format";
import { recordPhotos, type RecordPhotos } from "@/lib/server/record/photos";
import { planOf } from "@/lib/server/record/plan";
import { derivedLines, readingSections, tallyOf } from "@/lib/server/record/readings";
import { loadRecordParties, type RecordParties } from "@/lib/server/record/repo";
import { flagLines, gaugeLines } from "@/lib/server/record/review";
import type { BearingRecordLine, BuildRecord, Line, ReleaseStamp } from "@/lib/schemas/record";
import { bearingRecordLines } from "@/lib/server/bearings/record";

// Assembles the build record of one job: everything the PDF and the customer's page print. The
// job's record is loaded once and threaded through: the sections, the photos and the check of
// each printed release all read the same rows.

export const SAFETY_NOTICE = [
  "The figures in this record are what was measured and computed at the bench. They do not replace the fastener " +
    "or engine maker's instructions: the maker's torque, stretch, lubricant and clearance specifications govern.",
  FASTENER_CAUTION,
  "Follow local codes and licensed practice when lifting, cleaning with solvents, assembling and first running the engine.",
];

const material = (m: string | null) =>
  m ? ((EXPANSION_COEFFICIENTS as Record<string, { label: string }>)[m]?.label ?? m) : "";

function engineLines(e: RecordParties["engine"]): Line[] {
  const layout =
    e.layout === "v" ? `V${e.cylinders}` : e.layout === "flat" ? `flat ${e.cylinders}` : `inline ${e.cylinders}`;
  const rows: [string, string][] = [
    ["Engine", e.description],
    ["Layout", `${layout}, ${e.mains} main bearings${e.fuel ? `, ${e.fuel}` : ""}`],
    [
      "Nominal bore and stroke",
      `${withUnit(e.nominalBore, e.unitSystem)} x ${withUnit(e.nominalStroke, e.unitSystem)}`,
    ],
    [
      "Block / head / pistons",
      [material(e.blockMaterial), material(e.headMaterial), material(e.pistonMaterial)]
        .map((x) => x || "-")
        .join(" / "),
    ],
    [
      "Serials",
      [
        e.blockSerial && `block ${e.blockSerial}`,
        e.crankSerial && `crank ${e.crankSerial}`,
        e.headSerials && `heads ${e.headSerials}`,
      ]
        .filter(Boolean)
        .join(", "),
    ],
  ];
  return rows.filter(([, v]) => v).map(([label, value]) => ({ label, value }));
}

function verifyUrl(jobCode: string, hash: string): string {
  return `${env().APP_URL.replace(/\/$/, "")}/verify?job=${encodeURIComponent(jobCode)}&hash=${hash}`;
}

/** A release as printed, checked against the record already loaded for this copy. */
function stamp(r: ReleaseRow, record: JobRecord, names: Map<number, string>): ReleaseStamp {
  const check = checkRelease(record, r, names);
  return {
    id: r.id,
    status: r.voidedAt ? "void" : "standing",
    inspectorName: names.get(r.inspectorId) ?? r.signedName,
    signedAt: when(r.signedAt),
    hash: r.hash,
    canonicalVersion: r.canonicalVersion,
    voidedAt: r.voidedAt ? when(r.voidedAt) : null,
    voidedByName: r.voidedBy ? (names.get(r.voidedBy) ?? null) : null,
    voidReason: r.voidReason ?? null,
    check: { status: check.status, words: check.words },
    verifyUrl: verifyUrl(record.job.code, r.hash),
  };
}

/** Limits still at a starter sheet's typical figures, each as its characteristic and stations. */
function commonPracticeLines(spec: SpecLimit[]): string[] {
  return spec
    .filter((l) => l.commonPractice)
    .map((l) => characteristicWords(l.characteristic) + (l.stationPattern === "*" ? "" : ` (${l.stationPattern})`));
}

/** The release to print: the one asked for, else the standing one, else the latest (void). */
function pickRelease(releases: ReleaseRow[], releaseId?: number): ReleaseRow | null {
  if (releaseId !== undefined) {
    const r = releases.find((x) => x.id === releaseId);
    if (!r) throw notFound("Release");
    return r;
  }
  return releases.find((r) => !r.voidedAt) ?? releases[0] ?? null;
}

const contact = (...xs: (string | null | undefined)[]) => xs.filter((x): x is string => !!x && x.trim() !== "");

/** What a build record is made of, once loaded: the one pure step from rows to printed words. */
export type RecordInputs = {
  record: JobRecord;
  parties: RecordParties;
  releases: ReleaseRow[];
  names: Map<number, string>;
  photos: RecordPhotos;
  /** The bearing section's lines (lib/server/bearings/record.ts). */
  bearings?: BearingRecordLine[];
  releaseId?: number;
  now?: Date;
};

export function assembleBuildRecord(i: RecordInputs): BuildRecord {
  const { record, parties, releases, names } = i;
  const { job } = record;
  const chosen = pickRelease(releases, i.releaseId);
  const { sections, torque, current } = readingSections(record, { names, photosByReading: i.photos.byReading });
  const earlier = releases.filter((r) => chosen && r.id !== chosen.id && r.signedAt <= chosen.signedAt);
  return {
    generatedAt: when(i.now ?? new Date()),
    pageSize: parties.shop.unitSystem === "mm" ? "A4" : "LETTER",
    shop: { name: parties.shop.name, contact: contact(parties.shop.address, parties.shop.phone, parties.shop.email) },
    customer: { name: parties.customer.name, contact: contact(parties.customer.phone, parties.customer.email) },
    job: {
      id: job.id,
      code: job.code,
      title: job.title,
      status: job.status,
      units: job.unitSystem === "mm" ? "mm and N·m" : "in and lbf·ft",
      specRevision: job.specRevision,
    },
    engine: engineLines(parties.engine),
    plan: planOf(job.buildPlan, parties.engine.cylinders),
    bearings: i.bearings ?? [],
    sections,
    torque,
    derived: derivedLines(record, current),
    flags: flagLines(record, names),
    gauges: gaugeLines(record, current),
    photos: i.photos.photos,
    tally: tallyOf(current),
    release: chosen ? stamp(chosen, record, names) : null,
    earlierReleases: earlier.map((r) => stamp(r, record, names)),
    safety: SAFETY_NOTICE,
    commonPractice: commonPracticeLines(record.spec),
  };
}

export async function loadBuildRecord(
  shopId: number,
  jobId: number,
  opts: { releaseId?: number; now?: Date } = {},
): Promise<BuildRecord> {
  const record = await loadJobRecord(shopId, jobId);
  const { job } = record;
  const [parties, releases] = await Promise.all([
    loadRecordParties(shopId, job.customerId, job.engineId),
    listReleases(jobId),
  ]);
  pickRelease(releases, opts.releaseId); // an unknown release is a 404 before the photos are fetched
  const names = await userNames(shopId, [
    ...record.readings.map((r) => r.takenBy),
    ...record.dispositions.map((d) => d.userId),
    ...record.flags.map((f) => f.disposedBy),
    ...releases.flatMap((r) => [r.inspectorId, r.voidedBy]),
  ]);
  const [photos, bearings] = await Promise.all([
    recordPhotos(shopId, jobId, [...currentReadings(record.readings).values()]),
    bearingRecordLines(shopId, jobId),
  ]);
  return assembleBuildRecord({ record, parties, releases, names, photos, bearings, ...opts });
}
