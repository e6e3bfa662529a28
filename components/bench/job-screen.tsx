"use client";

import { lazy, memo, Suspense, useCallback, useEffect, useMemo, useRef, useState } from "react";
import { FastenerCaution, Notice } from "@/components/ui/notice";
import { findLimit, jobLock, jobLockReason } from "@/lib/domain";
import { Button } from "@/components/ui/button";
import { chosenGauge, useBenchEntry } from "@/hooks/use-bench-entry";
import { useGaugeKeys } from "@/hooks/use-gauge-keys";
import type { JobPack } from "@/lib/schemas/sync";
import type { LocalReading } from "@/lib/offline/db";
import { gaugesFor, isDialBoreGauge, onSamePart } from "@/lib/domain";
import { dialGroup } from "@/lib/offline/entry";
import { patchJobPrefs, type JobPrefs } from "@/lib/offline/meta";
import { derivedFor } from "@/lib/offline/preview";
import { nextOpenStation, OPEN_STATES, routeProgress, stationViews } from "@/lib/offline/route-status";
import { useBench } from "./bench-context";
import { BearingHalves } from "./bearing-halves";
import { DerivedPanel } from "./derived-panel";
import { EntryPanel } from "./entry-panel";
import { LastEntryCard } from "./last-entry";
import { LubricantPicker } from "./lubricant-picker";
import { PhotoButton } from "./photo-button";
import { RefusedNotice } from "./refused-notice";
import { SectionStrip } from "./section-strip";
import { StationHeader } from "./station-header";

// One job at the bench: section progress on top; in landscape, where-am-I and the last verdict
// on the left and entry on the right; in portrait and on a phone one column with the entry and
// keypad right under the station and its verdict, so nothing needed for an entry is scrolled to.
// Opened on a tap only, so their code stays out of the first load (precached for offline use).
const RouteSheet = lazy(() => import("./route-sheet").then((m) => ({ default: m.RouteSheet })));
const SkipSheet = lazy(() => import("./skip-sheet").then((m) => ({ default: m.SkipSheet })));

const GRID = [
  "grid grid-cols-[minmax(0,1fr)] items-start gap-4 [grid-template-areas:'where'_'last'_'entry'_'more']",
  "lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)] lg:grid-rows-[auto_auto_1fr]",
  "lg:[grid-template-areas:'where_entry'_'last_entry'_'more_entry']",
  "landscape:md:grid-cols-[minmax(0,5fr)_minmax(0,6fr)] landscape:md:grid-rows-[auto_auto_1fr]",
  "landscape:md:[grid-template-areas:'where_entry'_'last_entry'_'more_entry']",
].join(" ");

export const JobScreen = memo(function JobScreen({
  pack,
  readings,
  prefs,
}: {
  pack: JobPack;
  readings: LocalReading[];
  prefs: JobPrefs;
}) {
  const { db } = useBench();
  const views = useMemo(() => stationViews(pack, readings), [pack, readings]);
  const progress = useMemo(() => routeProgress(pack, views), [pack, views]);
  const sections = progress.sections;
  const [stationId, setStationId] = useState(() => nextOpenStation(views) ?? views[0]?.station.id ?? "");
  const [sheet, setSheet] = useState<"route" | "skip" | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  // A job fetched just now can open before its readings have arrived: until the machinist (or an
  // entry) moves, the screen follows the first open station, never a measured one.
  const moved = useRef(false);
  useEffect(() => {
    const first = moved.current ? undefined : nextOpenStation(views);
    if (first) setStationId(first);
  }, [views]);
  const moveTo = useCallback((id: string) => {
    moved.current = true;
    setStationId(id);
  }, []);
  const entry = useBenchEntry({ pack, views, readings, prefs, stationId, moveTo });
  useEffect(() => entry.store.subscribe(() => void (entry.store.get().last && (moved.current = true))), [entry.store]);
  const sheetNow = useRef(sheet);
  sheetNow.current = sheet;
  const refocus = useGaugeKeys({
    input: inputRef,
    store: entry.store,
    typingSheetOpen: () => sheetNow.current === "skip",
    closeOtherSheet: () => setSheet((open) => (open === "route" ? null : open)),
  });
  const view = views.find((v) => v.station.id === stationId) ?? views[0];
  const lock = jobLock(pack.job);

  useEffect(() => {
    if (!sheet) inputRef.current?.focus();
  }, [stationId, sheet]);

  // Stable props, so an entry repaints only the readout and the verdict (the memoised parts
  // keep their DOM): the Enter-to-verdict time is what bench:entry measures.
  const jobId = pack.job.id;
  const onPrefs = useCallback((patch: Partial<JobPrefs>) => void patchJobPrefs(db, jobId, patch), [db, jobId]);
  const { cancelMove, measureAgain } = entry;
  const jump = useCallback(
    (id: string) => {
      cancelMove();
      moved.current = true;
      setStationId(id);
      setSheet(null);
    },
    [cancelMove],
  );
  const again = useCallback(
    (id: string) => {
      measureAgain(id);
      jump(id);
    },
    [measureAgain, jump],
  );
  const pickSection = useCallback(
    (sid: string) => {
      const mine = views.filter((v) => v.station.section === sid);
      jump((mine.find((v) => OPEN_STATES.includes(v.state)) ?? mine[0]).station.id);
    },
    [views, jump],
  );
  const openRoute = useCallback(() => setSheet("route"), []);
  const pickLubricant = useCallback((l: string) => onPrefs({ lubricant: l }), [onPrefs]);
  const currentId = view?.current && view.current.state !== "rejected" ? view.current.id : undefined;
  const photoOwner = useMemo(
    () =>
      currentId
        ? { jobId, ownerType: "reading" as const, ownerId: currentId }
        : { jobId, ownerType: "job" as const, ownerId: String(jobId) },
    [jobId, currentId],
  );
  const gauges = useMemo(
    () => (view ? gaugesFor(view.station.characteristic, pack.instruments) : []),
    [view, pack.instruments],
  );
  // Only the part on screen: the core works out nothing else after each entry.
  const partStation = view?.station.id;
  const shownDerived = useMemo(
    () => (partStation ? derivedFor(pack, readings, onSamePart(partStation)) : []),
    [pack, readings, partStation],
  );

  if (!view)
    return (
      <Notice tone="error">
        This job has no stations on its route; ask the lead to check the engine&apos;s shape.
      </Notice>
    );
  const station = view.station;
  const inSection = views.filter((v) => v.station.section === station.section);
  const section = sections.find((s) => s.id === station.section);

  const dialCapable = !!dialGroup(station) && isDialBoreGauge(chosenGauge(station, pack, prefs));
  const refused = views.filter((v) => v.state === "rejected");

  return (
    <main
      className="mx-auto flex max-w-7xl flex-col gap-3 px-4 py-3"
      data-testid="job-screen"
      data-job={pack.job.id}
      data-spec-revision={pack.job.specRevision}
      onClick={refocus}
    >
      <SectionStrip sections={sections} current={station.section} onPick={pickSection} onAll={openRoute} />
      {lock.locked && (
        <Notice
          tone="error"
          title={`This job is ${lock.reason === "closed" || lock.reason === "released" ? lock.reason : "locked"}`}
        >
          {pack.job.lockReason ?? jobLockReason(pack.job)} New readings cannot be taken.
        </Notice>
      )}
      {refused.length > 0 && <RefusedNotice views={refused} onFix={jump} />}
      <div className={GRID}>
        <div className="flex flex-col gap-3 [grid-area:where]">
          <p className="truncate text-sm text-muted">
            <span className="font-semibold text-ink">{pack.job.title}</span> ·{" "}
            <span className="font-mono">{pack.job.code}</span> · {pack.job.engine} ·{" "}
            <span data-testid="required-progress" data-done={progress.done} data-required={progress.required}>
              {progress.required
                ? `${progress.done} of ${progress.required} required stations done`
                : "no required stations"}
            </span>
          </p>
          <StationHeader
            view={view}
            sectionLabel={section?.label ?? station.section}
            index={inSection.indexOf(view) + 1}
            of={inSection.length}
            shape={pack.shape}
            commonPractice={!!findLimit(pack.spec, station.characteristic, station.id)?.commonPractice}
          />
          {station.torque && <LubricantPicker value={prefs.lubricant} onPick={pickLubricant} />}
          {station.section === "bolt" && <FastenerCaution />}
          <BearingHalves stationId={station.id} bearings={pack.bearings} derived={shownDerived} />
        </div>
        <div className="[grid-area:last]">
          <LastEntryCard store={entry.store} onAgain={again} />
        </div>
        <div className="[grid-area:entry]">
          <EntryPanel
            station={station}
            store={entry.store}
            save={entry.save}
            instrument={entry.instrument}
            dialOn={entry.dialOn}
            needSetting={entry.needSetting}
            group={entry.group}
            askSetting={entry.askSetting}
            gauges={gauges}
            prefs={prefs}
            onPrefs={onPrefs}
            inputRef={inputRef}
            locked={lock.locked}
            dialCapable={dialCapable}
          />
        </div>
        <div className="flex flex-col gap-3 [grid-area:more]">
          <div className="grid grid-cols-2 gap-3">
            <Button big tone="quiet" onClick={() => setSheet("skip")} disabled={lock.locked}>
              Skip…
            </Button>
            <PhotoButton jobId={pack.job.id} owner={photoOwner} onDone={refocus} />
          </div>
          <DerivedPanel values={shownDerived} />
        </div>
      </div>
      <Suspense
        fallback={
          sheet ? <p className="fixed inset-x-0 top-1/3 z-40 text-center text-lg font-semibold">Opening…</p> : null
        }
      >
        {sheet === "route" && (
          <RouteSheet
            sections={sections}
            views={views}
            current={station.id}
            onPick={jump}
            onClose={() => setSheet(null)}
          />
        )}
        {sheet === "skip" && (
          <SkipSheet
            station={station.label}
            onSkip={(r) => {
              entry.skip(r);
              setSheet(null);
            }}
            onClose={() => setSheet(null)}
          />
        )}
      </Suspense>
    </main>
  );
});
