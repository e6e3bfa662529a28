"use client";

import { useSearchParams } from "next/navigation";
import { useEffect, useState } from "react";
import { Notice } from "@/components/ui/notice";
import { useDexieQuery } from "@/hooks/use-dexie-query";
import { draftsOf } from "@/lib/offline/study-drafts";
import type { StudyGauge } from "@/lib/schemas/bench-gauges";
import { useBench } from "@/components/bench/bench-context";
import type { GaugeStudyRecord } from "@/lib/schemas/gauge-studies";
import { DraftList } from "./draft-list";
import { SavedNotice } from "./saved-notice";
import { GaugeChoice } from "./gauge-choice";
import { GrrRun } from "./grr-run";
import { Type1Run } from "./type1-run";

// Gauge studies on the tablet: carry on a run kept here, or start one on a gauge. Which run is open
// is in the address (?run=type1), so a reload lands back on it with every figure kept.
export function StudiesHome() {
  const { db, actor } = useBench();
  const run = useSearchParams().get("run");
  const [drafts, draftError] = useDexieQuery(db, ["studyDrafts"], () => draftsOf(db, actor.userId), [actor], null);
  const [gauges, setGauges] = useState<{ gauges: StudyGauge[]; offline: boolean } | { error: string }>();

  useEffect(() => {
    let stop = false;
    import("@/lib/offline/study-api")
      .then(({ studyGauges }) => studyGauges(db))
      .then(
        (g) => !stop && setGauges(g),
        (err: unknown) => !stop && setGauges({ error: err instanceof Error ? err.message : String(err) }),
      );
    return () => void (stop = true);
  }, [db]);

  const [saved, setSaved] = useState<GaugeStudyRecord>();
  // The history API, not the router: no server round trip, so it works offline (Next keeps
  // useSearchParams in step with pushState).
  const open = (kind: string | null) =>
    window.history.pushState(null, "", kind ? `/bench/studies?run=${kind}` : "/bench/studies");
  const onSaved = (study: GaugeStudyRecord) => {
    setSaved(study);
    open(null);
  };
  const draft = drafts?.find((d) => d.draft.kind === run)?.draft;
  if (draft?.kind === "type1") return <Type1Run draft={draft} onClose={() => open(null)} onSaved={onSaved} />;
  if (draft?.kind === "grr") return <GrrRun draft={draft} onClose={() => open(null)} onSaved={onSaved} />;

  return (
    <main className="mx-auto flex max-w-4xl flex-col gap-5 px-4 py-5">
      <div>
        <h1 className="text-2xl font-bold">Gauge studies</h1>
        <p className="text-muted">
          How well a gauge repeats in your hands, against the tolerances it judges. Every figure is kept on this tablet
          as you go; saving the study needs the server.
        </p>
      </div>
      {saved && <SavedNotice study={saved} />}
      {draftError && <Notice tone="error">This tablet could not read its studies: {draftError.message}</Notice>}
      {drafts && drafts.length > 0 && <DraftList rows={drafts} onOpen={open} />}
      {gauges === undefined && <p className="text-muted">Loading the shop&apos;s gauges…</p>}
      {gauges && "error" in gauges && <Notice tone="error">{gauges.error}</Notice>}
      {gauges && "gauges" in gauges && (
        <GaugeChoice gauges={gauges.gauges} offline={gauges.offline} drafts={drafts ?? []} onStarted={open} />
      )}
    </main>
  );
}
