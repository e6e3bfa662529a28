import Link from "next/link";
import { StatusTag } from "@/components/admin/status-tag";
import { Wordmark } from "@/components/ui/logo";
import { Notice } from "@/components/ui/notice";
import { publicVerifySchema, type PublicVerification } from "@/lib/schemas/release";
import { verifyByHash } from "@/lib/server/release/hash-verify";

export const metadata = { title: "Verify a build record" };

// Public: anyone holding a build record checks that the shop's record still matches what was
// released. It shows only the status, the job code and the dates (see verifyByHash).
const TONE = { match: "good", changed: "bad", void: "off" } as const;
const WORDS = { match: "Matches", changed: "Changed since release", void: "Void" } as const;
const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) ?? "";

async function check(hash: string, job: string): Promise<{ result?: PublicVerification | null; error?: string }> {
  if (!hash) return {};
  const parsed = publicVerifySchema.safeParse({ hash, job: job || undefined });
  if (!parsed.success) return { error: parsed.error.issues[0]?.message ?? "Check the fingerprint" };
  return { result: await verifyByHash(parsed.data.hash, parsed.data.job) };
}

function Result({ r }: { r: PublicVerification }) {
  return (
    <section
      aria-labelledby="result-h"
      className="flex flex-col gap-2 rounded-tool border-2 border-rule bg-panel p-4"
      data-testid="public-verification"
      data-status={r.status}
    >
      <h2 id="result-h" className="text-xl font-semibold">
        Job {r.jobCode}
      </h2>
      <StatusTag tone={TONE[r.status]}>{WORDS[r.status]}</StatusTag>
      <p>{r.words}</p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 text-sm">
        <dt className="text-muted">Released</dt>
        <dd>{r.signedAt.replace("T", " ").slice(0, 16)} UTC</dd>
        {r.voidedAt && (
          <>
            <dt className="text-muted">Voided</dt>
            <dd>{r.voidedAt.replace("T", " ").slice(0, 16)} UTC</dd>
          </>
        )}
      </dl>
    </section>
  );
}

export default async function VerifyPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const q = await searchParams;
  const hash = first(q.hash).trim();
  const job = first(q.job).trim();
  const { result, error } = await check(hash, job);
  return (
    <main className="mx-auto flex max-w-2xl flex-col gap-5 px-4 py-8">
      <Link href="/" aria-label="Tenthwise">
        <Wordmark />
      </Link>
      <h1 className="text-3xl font-semibold">Verify a build record</h1>
      <p className="text-muted">
        Enter the fingerprint printed on the build record. The shop&apos;s record is checked against it now: it either
        still matches what the inspector released, has changed since, or was voided. Nothing else about the job is shown
        here.
      </p>
      <form
        method="get"
        action="/verify"
        className="flex flex-col gap-3 rounded-tool border-2 border-rule bg-panel p-4"
      >
        <label className="flex flex-col gap-1.5">
          <span className="font-medium">Fingerprint (64 characters)</span>
          <input
            name="hash"
            defaultValue={hash}
            spellCheck={false}
            autoComplete="off"
            className={`min-h-12 rounded-tool border-2 bg-paper px-3 font-mono text-sm ${error ? "border-fail" : "border-rule"}`}
          />
          {error && <span className="text-sm font-medium text-fail">{error}</span>}
        </label>
        <label className="flex flex-col gap-1.5">
          <span className="font-medium">Job code (optional)</span>
          <input name="job" defaultValue={job} className="min-h-12 rounded-tool border-2 border-rule bg-paper px-3" />
        </label>
        <div>
          <button
            type="submit"
            className="inline-flex min-h-11 items-center rounded-tool bg-steel px-4 font-semibold text-steel-ink"
          >
            Check
          </button>
        </div>
      </form>
      {result && <Result r={result} />}
      {result === null && (
        <Notice tone="error" title="No release has this fingerprint">
          Check that every character was copied{job ? " and that the job code is right" : ""}. A record that was never
          released has no fingerprint.
        </Notice>
      )}
    </main>
  );
}
