"use client";

import Link from "next/link";
import { StatusTag } from "@/components/admin/status-tag";
import type { ReleaseRecord, Verification } from "@/lib/schemas/release";
import { useVerification } from "./release-queries";

// Every release of the job, newest first. A voided one stays on the record, marked VOID with who
// voided it and why. The fingerprint is the SHA-256 of the canonical record (release-hash.ts).
const stamp = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
const groups = (hash: string) => hash.match(/.{1,8}/g)!;

const VERIFY_TONE = { match: "good", changed: "bad", void: "off" } as const;
const VERIFY_WORDS = { match: "Matches", changed: "Changed since release", void: "Void" } as const;

function VerifyNow({ jobId }: { jobId: number }) {
  const v = useVerification(jobId, true);
  if (v.isPending)
    return (
      <p className="text-sm text-muted" role="status">
        Checking the record against the database…
      </p>
    );
  if (v.isError) return <p className="text-sm text-fail">Could not check: {v.error.message}</p>;
  const r: Verification = v.data;
  return (
    <div className="flex flex-col gap-1" data-testid="verification" data-status={r.status}>
      <div className="flex flex-wrap items-center gap-2">
        <StatusTag tone={VERIFY_TONE[r.status]}>{VERIFY_WORDS[r.status]}</StatusTag>
        <button
          type="button"
          className="min-h-11 text-sm font-semibold text-steel underline"
          onClick={() => v.refetch()}
        >
          Check again
        </button>
      </div>
      <p className="text-sm">{r.words}</p>
      {r.differences.length > 0 && (
        <ul className="ml-4 list-disc text-sm">
          {r.differences.slice(0, 12).map((d) => (
            <li key={`${d.section}:${d.id}`}>
              {d.label}: {d.change}
            </li>
          ))}
          {r.differences.length > 12 && <li>and {r.differences.length - 12} more</li>}
        </ul>
      )}
    </div>
  );
}

function Entry({ r, verifyHref }: { r: ReleaseRecord; verifyHref: string }) {
  const isVoid = r.status === "void";
  return (
    <li
      className={`flex flex-col gap-2 rounded-tool border-2 p-4 ${isVoid ? "border-rule bg-paper" : "border-pass bg-panel"}`}
      data-release={r.id}
      data-status={r.status}
    >
      <div className="flex items-start justify-between gap-3">
        <div className="flex flex-wrap items-center gap-2">
          <StatusTag tone={isVoid ? "off" : "good"}>{isVoid ? "VOID" : "Released"}</StatusTag>
          <span className="font-semibold">Signed by {r.inspectorName}</span>
          <span className="text-sm text-muted">{stamp(r.signedAt)}</span>
        </div>
        {isVoid && (
          <span
            aria-hidden="true"
            className="shrink-0 rotate-[-6deg] rounded-tool border-4 border-fail px-2 text-3xl font-black tracking-widest text-fail"
          >
            VOID
          </span>
        )}
      </div>
      <div className="flex flex-col">
        <span className="text-sm text-muted">Fingerprint (SHA-256, canonical record version {r.canonicalVersion})</span>
        <code className="flex flex-wrap gap-x-2 font-mono text-sm" data-testid="release-hash" data-hash={r.hash}>
          {groups(r.hash).map((g, i) => (
            <span key={i}>{g}</span>
          ))}
        </code>
      </div>
      {isVoid && (
        <p className="text-sm" data-testid="void-reason">
          <span className="font-semibold">
            Voided {r.voidedAt ? stamp(r.voidedAt) : ""}
            {r.voidedByName ? ` by ${r.voidedByName}` : ""}.
          </span>{" "}
          Reason: {r.voidReason}
        </p>
      )}
      <Link href={verifyHref} className="text-sm font-medium text-steel underline">
        Public verification page for this fingerprint
      </Link>
    </li>
  );
}

export function ReleaseRecords({
  jobId,
  jobCode,
  releases,
}: {
  jobId: number;
  jobCode: string;
  releases: ReleaseRecord[];
}) {
  const standing = releases.find((r) => r.status === "standing");
  return (
    <section aria-labelledby="record-h" className="flex flex-col gap-3 rounded-tool border-2 border-rule bg-panel p-4">
      <h2 id="record-h" className="text-xl font-semibold">
        Release record
      </h2>
      {releases.length === 0 ? (
        <p className="text-muted">Not released yet.</p>
      ) : (
        <>
          {standing && <VerifyNow jobId={jobId} />}
          <ol className="flex flex-col gap-3">
            {releases.map((r) => (
              <Entry key={r.id} r={r} verifyHref={`/verify?job=${encodeURIComponent(jobCode)}&hash=${r.hash}`} />
            ))}
          </ol>
        </>
      )}
    </section>
  );
}
