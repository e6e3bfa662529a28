import "server-only";
import { createHash } from "node:crypto";
import { notFound } from "@/lib/server/core/errors";
import { verifyRelease } from "@/lib/server/release/hash-verify";
import { buildRecordPdf, fileNameFor } from "@/lib/server/record/pdf";
import { findRecordFile, keepRecordFile, releasesForRecord, type ReleaseFileRow } from "@/lib/server/record/repo";
import { deleteObject, getObjectBuffer, putObject } from "@/lib/server/uploads/storage";

// A signed release's build record is rendered once and kept in object storage with its SHA-256
// on the release row; the customer's link, the e-mail and the desk all hand out those same bytes.
// It is stored right after the signature commits. The signature never waits on storage: if storing
// fails (after retries), the release stands without a file, and the first reader (the mail
// worker, usually within seconds) renders it from the signed job, which the release has locked,
// and stores it then; a conditional update makes sure only one such copy is ever kept. A draft and
// a voided release are rendered on demand, since they say DRAFT or VOID and are never kept.

export type RecordFile = { pdf: Buffer; fileName: string; sha256: string; kept: boolean };

const sha256 = (b: Buffer) => createHash("sha256").update(b).digest("hex");
const keyOf = (shopId: number, releaseId: number, sha: string) =>
  `${shopId}/records/release-${releaseId}-${sha.slice(0, 16)}.pdf`;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Three tries, 0.25 s then 1 s apart: a store that blinks does not leave a release without its file. */
async function putWithRetry(key: string, pdf: Buffer, waits = [250, 1000]): Promise<void> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await putObject(key, pdf, "application/pdf");
    } catch (err) {
      if (attempt >= waits.length) throw err;
      await sleep(waits[attempt]);
    }
  }
}

/** The kept file's bytes, or null when storage lost it or they no longer give the kept SHA-256. */
async function readKept(file: { key: string; sha256: string }): Promise<Buffer | null> {
  const pdf = await getObjectBuffer(file.key);
  if (pdf && sha256(pdf) === file.sha256) return pdf;
  console.error(`[tenthwise] build record ${file.key} is ${pdf ? "damaged" : "missing"} in storage; storing it again`);
  return null;
}

/**
 * Renders the record of a signed release and keeps it, in place of `previousKey` (null: none yet).
 * When another process kept one first, that one is returned and ours is removed.
 */
export async function storeReleaseRecord(
  shopId: number,
  jobId: number,
  releaseId: number,
  previousKey: string | null = null,
): Promise<RecordFile> {
  const { pdf, fileName } = await buildRecordPdf(shopId, jobId, { releaseId });
  const sha = sha256(pdf);
  const key = keyOf(shopId, releaseId, sha);
  await putWithRetry(key, pdf);
  if (await keepRecordFile(releaseId, previousKey, { key, sha256: sha, bytes: pdf.length, storedAt: new Date() })) {
    if (previousKey && previousKey !== key) await deleteObject(previousKey).catch(() => undefined);
    return { pdf, fileName, sha256: sha, kept: true };
  }
  const theirs = await findRecordFile(releaseId);
  if (theirs?.key !== key) await deleteObject(key).catch(() => undefined);
  const bytes = theirs ? await readKept(theirs) : null;
  if (!theirs || !bytes) throw new Error(`The build record of release ${releaseId} could not be kept; try again`);
  return { pdf: bytes, fileName, sha256: theirs.sha256, kept: true };
}

/** Stores the record just after signing; a failure is logged, and the first reader stores it. */
export async function storeAfterSigning(shopId: number, jobId: number, releaseId: number): Promise<void> {
  try {
    await storeReleaseRecord(shopId, jobId, releaseId);
  } catch (err) {
    console.error(`[tenthwise] build record of release ${releaseId} not stored at signing: ${String(err)}`);
  }
}

async function keptFile(shopId: number, jobId: number, code: string, r: ReleaseFileRow): Promise<RecordFile> {
  const kept = r.recordKey && r.recordSha256 ? { key: r.recordKey, sha256: r.recordSha256 } : null;
  const pdf = kept ? await readKept(kept) : null;
  if (pdf && kept) {
    return { pdf, fileName: fileNameFor(code, "standing"), sha256: kept.sha256, kept: true };
  }
  return storeReleaseRecord(shopId, jobId, r.id, r.recordKey);
}

/**
 * The record file for a job: the kept file of the release asked for (else the standing one); a
 * draft or a voided release rendered now. `liveCheck` (the shop's desk) renders a fresh copy
 * instead of a kept one when the database no longer gives the signed fingerprint, so it says so.
 */
export async function recordFile(
  shopId: number,
  jobId: number,
  opts: { releaseId?: number; liveCheck?: boolean } = {},
): Promise<RecordFile> {
  const { jobCode, releases } = await releasesForRecord(shopId, jobId);
  const chosen =
    opts.releaseId !== undefined
      ? releases.find((r) => r.id === opts.releaseId)
      : (releases.find((r) => r.standing) ?? releases[0]);
  if (opts.releaseId !== undefined && !chosen) throw notFound("Release");
  const fresh = async () => {
    const { pdf, fileName } = await buildRecordPdf(shopId, jobId, { releaseId: chosen?.id });
    return { pdf, fileName, sha256: sha256(pdf), kept: false };
  };
  if (!chosen || !chosen.standing) return fresh();
  // A copy made now checks itself; only a kept one can be older than a change to the database.
  const kept = chosen.recordKey !== null;
  if (opts.liveCheck && kept && (await verifyRelease(shopId, jobId, chosen.id)).status !== "match") return fresh();
  return keptFile(shopId, jobId, jobCode, chosen);
}
