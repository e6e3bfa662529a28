import "server-only";
import { characteristicWords, stationWords } from "@/lib/domain";
import type { Difference, PublicVerification, Verification } from "@/lib/schemas/release";
import { AppError, notFound } from "@/lib/server/core/errors";
import { itemDigests, releaseHash, SECTIONS, type ItemDigests, type ReleaseSnapshot } from "@/lib/server/release/hash";
import { buildSnapshot } from "@/lib/server/release/hash-snapshot";
import {
  findReleaseByHash,
  listReleases,
  loadJobRecord,
  userNames,
  type JobRecord,
  type ReleaseRow,
} from "@/lib/server/release/repo";
import { toReleaseRecord } from "@/lib/server/release/sign";

// Verification: rebuild the canonical document from the database as it is NOW (the gauges from
// the snapshot stored at signing, see hash.ts) and compare its hash with the one signed.

type Stored = { gauges?: ReleaseSnapshot["gauges"]; digests?: ItemDigests };

const SECTION_WORDS: Record<string, string> = {
  readings: "Reading",
  limits: "Limit",
  flags: "Flag",
  dispositions: "Flag decision",
  gauges: "Gauge",
};

function labelOf(section: string, id: string, s: ReleaseSnapshot): string {
  const row = (
    s[section as keyof ReleaseSnapshot] as { id: string | number; [k: string]: unknown }[] | undefined
  )?.find((r) => String(r.id) === id);
  if (section === "readings" && row) return `Reading at ${stationWords(String(row.stationId))}`;
  if (section === "limits" && row)
    return `Limit for ${characteristicWords(String(row.characteristic)).toLowerCase()} (${String(row.stationPattern)})`;
  if (section === "flags") return `Flag #${id}`;
  if (section === "gauges" && row) return `Gauge ${String(row.serial)}`;
  return `${SECTION_WORDS[section] ?? section} ${id}`;
}

/** Which records differ between the digests stored at signing and those of the database now. */
export function differences(now: ReleaseSnapshot, stored: ItemDigests | undefined): Difference[] {
  if (!stored) return [];
  const current = itemDigests(now);
  const out: Difference[] = [];
  if (current.job !== stored.job)
    out.push({ section: "job", id: String(now.job.id), label: "The job header or its build plan", change: "changed" });
  if (current.release !== stored.release)
    out.push({ section: "release", id: "", label: "The signature (signer, typed name or time)", change: "changed" });
  for (const section of SECTIONS) {
    const was = stored[section] ?? {};
    const is = current[section];
    for (const id of Object.keys(is)) {
      if (!(id in was)) out.push({ section, id, label: labelOf(section, id, now), change: "added" });
      else if (was[id] !== is[id]) out.push({ section, id, label: labelOf(section, id, now), change: "changed" });
    }
    for (const id of Object.keys(was))
      if (!(id in is)) out.push({ section, id, label: `${SECTION_WORDS[section]} ${id}`, change: "removed" });
  }
  return out;
}

/** The hash of the job's rows now, with the signature and gauges stored in the release. */
function recompute(record: JobRecord, release: ReleaseRow) {
  const stored = (release.checklist ?? {}) as Stored;
  const snapshot = buildSnapshot(
    record,
    { inspectorId: release.inspectorId, signedName: release.signedName, signedAt: release.signedAt },
    stored.gauges ?? [],
  );
  return { snapshot, stored, hash: releaseHash(snapshot) };
}

const day = (d: Date) => d.toISOString().replace("T", " ").slice(0, 16) + " UTC";

/**
 * One release checked against its job's record as already loaded (no queries), so a caller that
 * has the record (the build record, printing several releases) never loads it again.
 */
export function checkRelease(record: JobRecord, release: ReleaseRow, names: Map<number, string>): Verification {
  const shown = toReleaseRecord(release, names);
  if (release.voidedAt) {
    const who = shown.voidedByName ? ` by ${shown.voidedByName}` : "";
    return {
      status: "void",
      words:
        `VOID: this release was voided on ${day(release.voidedAt)}${who}. ` +
        `Reason: ${release.voidReason ?? "none given"}. A new release is needed.`,
      release: shown,
      recomputedHash: null,
      differences: [],
    };
  }
  const { snapshot, stored, hash } = recompute(record, release);
  if (hash === release.hash) {
    return {
      status: "match",
      words:
        "Matches: the record in the database now gives the same fingerprint as the release signed on " +
        `${day(release.signedAt)}.`,
      release: shown,
      recomputedHash: hash,
      differences: [],
    };
  }
  const diffs = differences(snapshot, stored.digests);
  const what = diffs.length
    ? ` ${diffs.length} record(s) differ: ${diffs
        .slice(0, 3)
        .map((d) => `${d.label} (${d.change})`)
        .join("; ")}${diffs.length > 3 ? "; …" : ""}.`
    : "";
  return {
    status: "changed",
    words:
      "Changed since release: the record in the database no longer gives the fingerprint signed on " +
      `${day(release.signedAt)}.${what}`,
    release: shown,
    recomputedHash: hash,
    differences: diffs,
  };
}

/** The latest release of a job (or the one asked for), checked against the database now. */
export async function verifyRelease(shopId: number, jobId: number, releaseId?: number): Promise<Verification> {
  const record = await loadJobRecord(shopId, jobId); // 404 for another shop's job
  const releases = await listReleases(jobId);
  const release = releaseId ? releases.find((r) => r.id === releaseId) : releases[0];
  if (!release)
    throw releaseId
      ? notFound("Release")
      : new AppError("not_found", "This job has not been released yet, so there is nothing to verify");
  return checkRelease(record, release, await userNames(shopId, [release.inspectorId, release.voidedBy]));
}

/**
 * For anyone holding a record's fingerprint (printed on the build record), with no account. It
 * says only whether the record still matches, the job code and the signing (and voiding) date:
 * no names, customer, readings, reasons or what changed. The fingerprint is 256 bits, so it cannot
 * be guessed to list other jobs.
 */
export async function verifyByHash(hash: string, jobCode?: string): Promise<PublicVerification | null> {
  const release = await findReleaseByHash(hash);
  if (!release || (jobCode && release.jobCode.toLowerCase() !== jobCode.toLowerCase())) return null;
  const base = {
    jobCode: release.jobCode,
    signedAt: release.signedAt.toISOString(),
    voidedAt: release.voidedAt?.toISOString() ?? null,
  };
  if (release.voidedAt)
    return {
      ...base,
      status: "void",
      words:
        `Void: this release of job ${release.jobCode} was withdrawn by the shop on ${day(release.voidedAt)}. ` +
        "Ask the shop for the current record.",
    };
  const { hash: now } = recompute(await loadJobRecord(release.shopId, release.jobId), release);
  return now === release.hash
    ? {
        ...base,
        status: "match",
        words:
          `Matches: the shop's record of job ${release.jobCode} is unchanged since it was released on ` +
          `${day(release.signedAt)}.`,
      }
    : {
        ...base,
        status: "changed",
        words:
          `Changed since release: the shop's record of job ${release.jobCode} no longer matches what was ` +
          `released on ${day(release.signedAt)}. Ask the shop.`,
      };
}
