import "server-only";
import type { UnitSystem } from "@/lib/schemas/enums";
import { models } from "@/lib/server/core/db";
import { notFound } from "@/lib/server/core/errors";

// The parties of a build record (the shop, the customer and the engine, as plain objects), and the
// facts of the record file kept for each signed release.
export type RecordParties = {
  shop: { name: string; address: string | null; phone: string | null; email: string | null; unitSystem: UnitSystem };
  customer: { name: string; email: string | null; phone: string | null };
  engine: {
    description: string;
    layout: string;
    cylinders: number;
    mains: number;
    unitSystem: UnitSystem;
    nominalBore: number;
    nominalStroke: number;
    blockMaterial: string;
    headMaterial: string | null;
    pistonMaterial: string | null;
    blockSerial: string | null;
    crankSerial: string | null;
    headSerials: string | null;
    fuel: string | null;
  };
};

export async function loadRecordParties(shopId: number, customerId: number, engineId: number): Promise<RecordParties> {
  const { Customer, Engine, Shop } = models();
  const [shop, customer, engine] = await Promise.all([
    Shop.findByPk(shopId),
    Customer.findOne({ where: { id: customerId, shopId } }),
    Engine.findOne({ where: { id: engineId, shopId } }),
  ]);
  if (!shop || !engine) throw notFound("Job");
  return {
    shop: {
      name: shop.name,
      address: shop.address ?? null,
      phone: shop.phone ?? null,
      email: shop.email ?? null,
      unitSystem: shop.unitSystem,
    },
    customer: { name: customer?.name ?? "", email: customer?.email ?? null, phone: customer?.phone ?? null },
    engine: {
      description: engine.description,
      layout: engine.layout,
      cylinders: engine.cylinders,
      mains: engine.mains,
      unitSystem: engine.unitSystem,
      nominalBore: engine.nominalBore,
      nominalStroke: engine.nominalStroke,
      blockMaterial: engine.blockMaterial,
      headMaterial: engine.headMaterial ?? null,
      pistonMaterial: engine.pistonMaterial ?? null,
      blockSerial: engine.blockSerial ?? null,
      crankSerial: engine.crankSerial ?? null,
      headSerials: engine.headSerials ?? null,
      fuel: engine.fuel ?? null,
    },
  };
}

/** A release as the record's file store needs it. */
export type ReleaseFileRow = {
  id: number;
  standing: boolean;
  signedAt: Date;
  recordKey: string | null;
  recordSha256: string | null;
};

/** The job's code and its releases, newest first; 404 for another shop's job. */
export async function releasesForRecord(
  shopId: number,
  jobId: number,
): Promise<{ jobCode: string; releases: ReleaseFileRow[] }> {
  const { Job, Release } = models();
  const job = await Job.findOne({ where: { id: jobId, shopId }, attributes: ["id", "code"] });
  if (!job) throw notFound("Job");
  const rows = await Release.findAll({
    where: { jobId, shopId },
    attributes: ["id", "signedAt", "voidedAt", "recordKey", "recordSha256"],
    order: [
      ["signedAt", "DESC"],
      ["id", "DESC"],
    ],
  });
  return {
    jobCode: job.code,
    releases: rows.map((r) => ({
      id: r.id,
      standing: !r.voidedAt,
      signedAt: r.signedAt,
      recordKey: r.recordKey ?? null,
      recordSha256: r.recordSha256 ?? null,
    })),
  };
}

export type RecordFileFacts = { key: string; sha256: string; bytes: number; storedAt: Date };

/**
 * Keeps the stored file's facts on the release, only if the release still has the file `previousKey`
 * names (null: none yet). False when another process kept one first: the caller serves theirs.
 */
export async function keepRecordFile(
  releaseId: number,
  previousKey: string | null,
  f: RecordFileFacts,
): Promise<boolean> {
  const { Release } = models();
  const [changed] = await Release.update(
    { recordKey: f.key, recordSha256: f.sha256, recordBytes: f.bytes, recordStoredAt: f.storedAt },
    { where: { id: releaseId, recordKey: previousKey } },
  );
  return changed === 1;
}

export async function findRecordFile(releaseId: number): Promise<{ key: string; sha256: string } | null> {
  const { Release } = models();
  const r = await Release.findByPk(releaseId, { attributes: ["id", "recordKey", "recordSha256"] });
  return r?.recordKey && r.recordSha256 ? { key: r.recordKey, sha256: r.recordSha256 } : null;
}
