"use client";

import { useEffect, useState } from "react";
import { Notice } from "@/components/ui/notice";
import type { BenchJobSummary, JobPack } from "@/lib/schemas/sync";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import { useBench } from "./bench-context";

// The jobs waiting for measurement. Online, every listed job is downloaded to the tablet in the
// background, so the machinist can pull the network and still open any of them; offline, the
// jobs already on the tablet are listed.
type Item = {
  id: number;
  code: string;
  title: string;
  sub: string;
  /** Required stations done, as the server last counted them (lib/domain/progress.ts). */
  progress?: { done: number; required: number } | null;
  status: string;
  onTablet: boolean;
  pending: number;
};

export function JobPicker() {
  const { db } = useBench();
  const [remote, setRemote] = useState<BenchJobSummary[] | null>(null);
  const [offline, setOffline] = useState(false);
  const [failed, setFailed] = useState<Record<number, string>>({});
  const [local] = useDexieQuery(db, ["jobs"], () => db.jobs.toArray(), [], []);
  const [pending] = useDexieQuery(
    db,
    ["outbox"],
    async () => {
      const counts = new Map<number, number>();
      await db.outbox.each((o) => void counts.set(o.jobId, (counts.get(o.jobId) ?? 0) + 1));
      return counts;
    },
    [],
    new Map<number, number>(),
  );

  useEffect(() => {
    let stop = false;
    const net = Promise.all([import("@/lib/offline/transport"), import("@/lib/offline/packs")]);
    net
      .then(async ([{ getJson }, { savePack }]) => {
        const { jobs } = await getJson<{ jobs: BenchJobSummary[] }>(fetch, "/api/bench/jobs");
        if (stop) return;
        setRemote(jobs);
        for (const j of jobs) {
          await getJson<JobPack>(fetch, `/api/bench/jobs/${j.id}`)
            .then((p) => savePack(db, p))
            .catch((err: unknown) => {
              if (!stop) setFailed((f) => ({ ...f, [j.id]: err instanceof Error ? err.message : String(err) }));
            });
        }
      })
      .catch(() => !stop && setOffline(true));
    return () => void (stop = true);
  }, [db]);

  const onTablet = new Set(local.filter((j) => !j.gone).map((j) => j.jobId));
  const items: Item[] = remote
    ? remote.map((j) => ({
        id: j.id,
        code: j.code,
        title: j.title,
        sub: `${j.customer} · ${j.engine}${j.openFlags ? ` · ${j.openFlags} open flags` : ""}`,
        progress: j.progress,
        status: j.status,
        onTablet: onTablet.has(j.id),
        pending: pending.get(j.id) ?? 0,
      }))
    : local.map((j) => ({
        id: j.jobId,
        code: j.pack.job.code,
        title: j.pack.job.title,
        sub: `${j.pack.job.customer} · ${j.pack.job.engine}`,
        status: j.pack.job.status,
        onTablet: !j.gone,
        pending: pending.get(j.jobId) ?? 0,
      }));

  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-5 px-4 py-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-3xl font-semibold">Jobs on the bench</h1>
        {/* A plain link, like the jobs': the studies' shell is precached and opens offline. */}
        <a
          href="/bench/studies"
          className="inline-flex min-h-12 items-center rounded-tool border-2 border-rule bg-panel px-4 font-semibold"
        >
          Gauge studies
        </a>
      </div>
      {offline && (
        <Notice title="Offline">
          Showing the jobs already on this tablet. Readings you take are kept here and sent when the network is back.
        </Notice>
      )}
      {remote === null && !offline && <p className="text-muted">Asking the server for the jobs…</p>}
      {items.length === 0 && (remote !== null || offline) && (
        <p className="rounded-tool border-2 border-dashed border-rule p-6 text-muted">
          {offline
            ? "No job has been downloaded to this tablet yet; connect once to get them."
            : "No jobs are waiting for measurement."}
        </p>
      )}
      <ul className="grid gap-3 md:grid-cols-2">
        {items.map((j) => (
          <li key={j.id}>
            {/* A plain link: a full navigation the service worker answers from its cache, online or not. */}
            <a
              href={`/bench/job?id=${j.id}`}
              data-job={j.id}
              className="flex min-h-24 flex-col gap-1 rounded-tool border-2 border-rule bg-panel p-4 active:border-steel"
            >
              <span className="flex items-center justify-between gap-2 text-sm">
                <span className="font-mono text-muted">{j.code}</span>
                <span className="font-semibold capitalize text-muted">{j.status}</span>
              </span>
              <span className="text-xl font-semibold">{j.title}</span>
              <span className="text-sm text-muted">{j.sub}</span>
              {j.progress && (
                <span
                  className="text-sm tabular text-muted"
                  data-testid="required-progress"
                  data-done={j.progress.done}
                  data-required={j.progress.required}
                >
                  {j.progress.required
                    ? `${j.progress.done} of ${j.progress.required} required stations done`
                    : "No required stations"}
                </span>
              )}
              <span
                className={`text-sm font-semibold ${j.onTablet ? "text-pass" : "text-muted"}`}
                data-testid="on-tablet"
                data-ready={j.onTablet}
              >
                {j.onTablet
                  ? "✓ Ready offline"
                  : failed[j.id]
                    ? `Not downloaded: ${failed[j.id]}`
                    : "Downloading to the tablet…"}
                {j.pending ? ` · ${j.pending} waiting to send` : ""}
              </span>
            </a>
          </li>
        ))}
      </ul>
    </main>
  );
}
