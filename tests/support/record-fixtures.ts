// A released job for the build record, mail and customer-link tests: a few readings with their
// stored verdicts, an accepted out-of-spec bore, torque records with lubricant, a photo, a build
// plan, and a Release row whose hash is the release engineer's own (so verification matches).
// Every figure is an invented test fixture, not a reference value.
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { CANONICAL_VERSION, itemDigests, releaseHash } from "@/lib/server/release/hash";
import { buildSnapshot, gaugeRecord } from "@/lib/server/release/hash-snapshot";
import { loadJobRecord } from "@/lib/server/release/repo";
import { deliverPendingMail } from "@/lib/server/mail/outbox-worker";
import { putObject } from "@/lib/server/uploads/storage";
import { Attachment, Flag, FlagDisposition, Job, MailOutbox, Reading, Release } from "@/models";
import type { Verdict } from "@/lib/domain";
import type { JsonValue } from "@/lib/schemas/json";
import { createShop, type TestShop } from "./factories";

type Fixture = {
  station: string;
  value: number;
  unit?: string;
  verdict: Verdict;
  min: number;
  max: number;
  nominal?: number;
  lubricant?: string;
};

export const ACCEPT_REASON = "Customer agreed: within the piston maker's extended fit range for this bore";

const BORE = { min: 4.0295, max: 4.0305, nominal: 4.03 };
const FIXTURES: Fixture[] = [
  ...["top", "mid", "bottom"].flatMap((d, i) =>
    ["A", "B"].map((a, j) => ({
      station: `bore/1/${d}/${a}`,
      value: 4.03 + (i + j) * 0.0001,
      verdict: "in_spec" as const,
      ...BORE,
    })),
  ),
  { station: "bore/2/top/A", value: 4.0309, verdict: "out_of_spec", ...BORE },
  { station: "main-brg/1/front/A", value: 2.4523, verdict: "in_spec", min: 2.45, max: 2.46 },
  { station: "main/1/front/A", value: 2.4502, verdict: "in_spec", min: 2.449, max: 2.451 },
  {
    station: "torque/main-caps",
    value: 68,
    unit: "lbf_ft",
    verdict: "in_spec",
    min: 65,
    max: 70,
    lubricant: "engine-oil",
  },
  {
    station: "torque/rod-bolts",
    value: 66,
    unit: "lbf_ft",
    verdict: "in_spec",
    min: 65,
    max: 70,
    lubricant: "moly-paste",
  },
];

const CHARACTERISTIC: Record<string, string> = {
  bore: "bore_diameter",
  "main-brg": "main_bearing_bore",
  main: "main_journal_diameter",
  torque: "fastener_torque",
};

export const BUILD_PLAN = {
  format: "tenthwise.build-plan",
  version: 1,
  lengthUnit: "in",
  volumeUnit: "cc",
  bore: 4.03,
  stroke: 3.48,
  rodLength: 5.7,
  compressionHeight: 1.56,
  pistonTop: "dish",
  pistonVolumeCc: 5,
  chamberCc: 64,
  gasketBore: 4.1,
  gasketThickness: 0.039,
  deckHeight: 9.025,
  intakeLobeLift: 0.3,
  exhaustLobeLift: 0.31,
  rockerRatio: 1.5,
  intakeLash: 0.016,
  exhaustLash: 0.018,
  notes: "Test plan",
};

async function addReadings(s: TestShop, takenAt: Date) {
  const ids: Record<string, string> = {};
  const earlier = randomUUID();
  // A first, wrong reading of bore 1 that the machinist corrected: kept, superseded.
  await Reading.create({
    id: earlier,
    shopId: s.shop.id,
    jobId: s.job.id,
    stationId: "bore/1/top/A",
    characteristic: "bore_diameter",
    value: 4.0321,
    unit: "in",
    instrumentId: s.instrument.id,
    takenBy: s.users.machinist.id,
    takenAt: new Date(takenAt.getTime() - 60_000),
    deviceId: "test-tablet",
    verdict: "out_of_spec",
    limitMin: BORE.min,
    limitMax: BORE.max,
    deviation: 0.0021,
  });
  for (const f of FIXTURES) {
    const id = randomUUID();
    ids[f.station] = id;
    await Reading.create({
      id,
      shopId: s.shop.id,
      jobId: s.job.id,
      stationId: f.station,
      characteristic: CHARACTERISTIC[f.station.split("/")[0]],
      value: f.value,
      unit: f.unit ?? "in",
      instrumentId: f.unit ? null : s.instrument.id,
      lubricant: f.lubricant ?? null,
      takenBy: s.users.machinist.id,
      takenAt,
      deviceId: "test-tablet",
      verdict: f.verdict,
      limitMin: f.min,
      limitMax: f.max,
      deviation: f.nominal !== undefined ? Number((f.value - f.nominal).toFixed(6)) : null,
      supersedes: f.station === "bore/1/top/A" ? earlier : null,
    });
  }
  return ids;
}

async function addAcceptedFlag(s: TestShop, readingId: string) {
  const at = new Date();
  const flag = await Flag.create({
    shopId: s.shop.id,
    jobId: s.job.id,
    readingId,
    stationId: "bore/2/top/A",
    characteristic: "bore_diameter",
    value: 4.0309,
    unit: "in",
    limitMin: BORE.min,
    limitMax: BORE.max,
    deviation: 0.0009,
    verdict: "out_of_spec",
    reason: "out_of_spec",
    state: "disposed",
    disposition: "accept",
    dispositionReason: ACCEPT_REASON,
    disposedBy: s.users.lead.id,
    disposedAt: at,
  });
  await FlagDisposition.create({
    flagId: flag.id,
    disposition: "accept",
    reason: ACCEPT_REASON,
    userId: s.users.lead.id,
  });
  return flag.id;
}

export async function addJobPhoto(s: TestShop): Promise<string> {
  const id = randomUUID();
  const key = `${s.shop.id}/${randomUUID()}`;
  const img = await sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 40, g: 90, b: 160 } } })
    .jpeg()
    .toBuffer();
  await putObject(key, img, "image/jpeg");
  await putObject(`${key}-thumb.jpg`, await sharp(img).resize(320).jpeg().toBuffer(), "image/jpeg");
  await Attachment.create({
    id,
    shopId: s.shop.id,
    clientId: id,
    ownerType: "job",
    ownerId: String(s.job.id),
    objectKey: key,
    thumbKey: `${key}-thumb.jpg`,
    contentType: "image/jpeg",
    sizeBytes: img.length,
    originalName: "block-on-stand.jpg",
    uploadedBy: s.users.machinist.id,
  });
  return id;
}

/** Signs the job as the inspector would (same hash, same stored gauges), then locks it. */
export async function releaseJob(s: TestShop, signedAt = new Date()) {
  const record = await loadJobRecord(s.shop.id, s.job.id);
  const signedName = s.users.inspector.name;
  const gauges = record.instruments.map(gaugeRecord);
  const snapshot = buildSnapshot(record, { inspectorId: s.users.inspector.id, signedName, signedAt }, gauges);
  const release = await Release.create({
    shopId: s.shop.id,
    jobId: s.job.id,
    inspectorId: s.users.inspector.id,
    signedName,
    signedAt,
    checklist: {
      version: CANONICAL_VERSION,
      checks: [],
      gauges,
      digests: itemDigests(snapshot),
    } as unknown as JsonValue,
    hash: releaseHash(snapshot),
    canonicalVersion: CANONICAL_VERSION,
  });
  await Job.update({ status: "released", lockedAt: signedAt }, { where: { id: s.job.id } });
  return { id: release.id, hash: release.hash, signedName };
}

export async function createRecordJob(opts: { release?: boolean; photo?: boolean } = {}) {
  const s = await createShop();
  await Job.update({ buildPlan: BUILD_PLAN, status: "review" }, { where: { id: s.job.id } });
  const readings = await addReadings(s, new Date(Date.now() - 3600_000));
  const flagId = await addAcceptedFlag(s, readings["bore/2/top/A"]);
  const photoId = opts.photo === false ? null : await addJobPhoto(s);
  const release = opts.release === false ? null : await releaseJob(s);
  return { ...s, readings, flagId, photoId, release };
}

export type RecordJob = Awaited<ReturnType<typeof createRecordJob>>;

/** Sends what one shop has queued now: other tests' mail may be queued ahead of it. */
export async function deliverFor(shopId: number) {
  const due = await MailOutbox.findAll({ where: { shopId, sentAt: null }, attributes: ["id"] });
  return deliverPendingMail({ only: due.map((m) => m.id), budgetMs: 60_000 });
}
