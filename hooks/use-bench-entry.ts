"use client";

import { startTransition, useCallback, useEffect, useMemo, useRef, useState } from "react";
import {
  coreReading,
  defaultGauge,
  evaluateReading,
  expectedFigure,
  isDialBoreGauge,
  jobLock,
  jobLockReason,
  LUBRICANT_LABELS,
  type Lubricant,
  type Station,
} from "@/lib/domain";
import type { JobPack } from "@/lib/schemas/sync";
import type { LocalReading } from "@/lib/offline/db";
import { buildReading, dialGroup, parseEntry } from "@/lib/offline/entry";
import { patchJobPrefs, type JobPrefs } from "@/lib/offline/meta";
import { usableRaw } from "@/lib/offline/preview";
import { recordReading, resendReading, type NewReading } from "@/lib/offline/readings";
import { nextOpenStation, type StationView } from "@/lib/offline/route-status";
import { useBench } from "@/components/bench/bench-context";
import { asksBeforeCorrecting, correctionQuestion } from "@/components/bench/correction";
import { afterPaint } from "./use-after-paint";
import { createEntryStore, type LastEntry } from "./use-entry-store";

// One entry at the bench, from Enter to the next station. The verdict is computed at once from
// the core and painted before anything else; the write (reading + outbox, one transaction) runs
// alongside; the move to the next station follows both; the sync engine is only nudged:
// entry never waits for sync.
interface Args {
  pack: JobPack;
  views: StationView[];
  readings: LocalReading[];
  prefs: JobPrefs;
  stationId: string;
  moveTo: (id: string) => void;
}

export const gaugeKey = (s: Station) => s.gaugeKind ?? s.characteristic;

export function chosenGauge(station: Station, pack: JobPack, prefs: JobPrefs) {
  const expected = expectedFigure(pack.spec, station.id, pack.shape);
  return defaultGauge(station.characteristic, pack.instruments, prefs.gauges[gaugeKey(station)], expected);
}

function modeOf(station: Station | undefined, pack: JobPack, prefs: JobPrefs, settingFor?: string) {
  const instrument = station ? chosenGauge(station, pack, prefs) : undefined;
  const group = station ? dialGroup(station) : undefined;
  const dialOn = !!group && prefs.dialMode && isDialBoreGauge(instrument);
  const needSetting = dialOn && (settingFor === group || prefs.dialSettings[group!] === undefined);
  return { instrument, group, dialOn, needSetting };
}

export function useBenchEntry({ pack, views, readings, prefs, stationId, moveTo }: Args) {
  const { db, engine, actor, deviceId } = useBench();
  const [store] = useState(createEntryStore);
  const [settingFor, setSettingFor] = useState<string>();
  const seq = useRef(0);
  // Set at Enter, shown after the paint; until then the next entry already goes there.
  // Kept until the move has rendered, so a figure a gauge sends meanwhile never lands on the old station.
  const pendingMove = useRef<string | null>(null);
  useEffect(() => {
    if (pendingMove.current === stationId) pendingMove.current = null;
  }, [stationId]);
  // What was saved at each station before the live query caught up: keeps supersedes and the
  // confirm rule right even when a gauge sends the next reading within milliseconds.
  const justSaved = useRef(new Map<string, { id: string; count: number }>());
  // The station the machinist asked to measure again, and the correction last asked about.
  const measuringAgain = useRef<string | null>(null);
  const asked = useRef<{ stationId: string; draft: string } | null>(null);
  const raw = useMemo(() => usableRaw(readings, pack.instruments), [readings, pack.instruments]);
  const mode = modeOf(views.find((v) => v.station.id === stationId)?.station, pack, prefs, settingFor);

  const savedAhead = useCallback(
    (stationId: string) => {
      const saved = justSaved.current.get(stationId);
      return saved && !readings.some((r) => r.id === saved.id) ? saved : undefined;
    },
    [readings],
  );
  const latest = useCallback(
    (v: StationView) => {
      const saved = savedAhead(v.station.id);
      if (saved) return { id: saved.id, count: saved.count, rejected: undefined };
      const cur = v.current;
      return {
        id: cur && cur.state !== "rejected" ? cur.id : undefined,
        count: v.count,
        rejected: cur?.state === "rejected" ? cur.id : undefined,
      };
    },
    [savedAhead],
  );

  const write = useCallback(
    (reading: NewReading, known: ReturnType<typeof latest>) => {
      const w = known.rejected
        ? resendReading(db, known.rejected, reading).then(() => known.rejected!)
        : recordReading(db, reading, { deviceId, takenBy: actor.userId }).then((r) => r.id);
      return w.then((id) => void justSaved.current.set(reading.stationId, { id, count: known.count + 1 }));
    },
    [db, deviceId, actor.userId],
  );

  const finish = useCallback(
    (entry: Omit<LastEntry, "seq">, saving: Promise<unknown>, typed: string) => {
      store.set({ last: { ...entry, seq: ++seq.current }, draft: "", error: undefined, ask: undefined });
      if (!entry.stayed) {
        // Shown once the verdict has painted and the write has committed, so neither waits on it.
        // A station saved moments ago that the live query does not show yet is done, not open.
        const shown = views.filter((v) => v.station.id === entry.stationId || !savedAhead(v.station.id));
        const next = nextOpenStation(shown, entry.stationId) ?? entry.stationId;
        pendingMove.current = next;
        const painted = new Promise<void>((r) => afterPaint(r));
        void Promise.all([painted, saving.catch(() => undefined)]).then(() => {
          if (pendingMove.current !== next) return;
          startTransition(() => moveTo(next));
        });
      }
      saving.then(
        () => {
          performance.mark("tw:reading-committed");
          engine.afterEntry();
        },
        (err: unknown) =>
          store.set({
            draft: typed,
            error: `Not saved on this tablet (${err instanceof Error ? err.message : String(err)}); press Save again`,
          }),
      );
    },
    [engine, moveTo, views, store, savedAhead],
  );

  const save = useCallback(() => {
    const view = views.find((v) => v.station.id === (pendingMove.current ?? stationId));
    if (!view) return;
    const { station } = view;
    const { draft } = store.get();
    if (jobLock(pack.job).locked) return store.set({ error: pack.job.lockReason ?? jobLockReason(pack.job)! });
    // The mode worked out for this render, unless a gauge's next reading arrived before the move painted.
    const m = station.id === stationId ? mode : modeOf(station, pack, prefs, settingFor);
    if (m.needSetting) {
      const parsed = parseEntry(draft, "the setting size");
      if ("error" in parsed) return store.set({ error: parsed.error });
      store.set({ draft: "", error: undefined });
      setSettingFor(undefined);
      void patchJobPrefs(db, pack.job.id, { dialSettings: { ...prefs.dialSettings, [m.group!]: parsed.value } });
      return;
    }
    const known = latest(view);
    const built = buildReading(draft, {
      pack,
      station,
      instrument: m.instrument,
      dialSetting: m.dialOn ? prefs.dialSettings[m.group!] : undefined,
      lubricant: prefs.lubricant as Lubricant | undefined,
      supersedes: known.id,
    });
    if ("error" in built) return store.set({ error: built.error });
    const r = built.reading;
    const question = {
      view,
      keptId: known.id,
      last: store.get().last,
      measuringAgain: measuringAgain.current === station.id,
    };
    const answered = asked.current?.stationId === station.id && asked.current.draft === draft;
    if (!answered && asksBeforeCorrecting(question)) {
      asked.current = { stationId: station.id, draft };
      return store.set({ ask: correctionQuestion(question, station, r.value!), error: undefined });
    }
    asked.current = null;
    measuringAgain.current = null;
    const saving = write(r, known); // started first: the store works while the verdict is worked out
    let ev: ReturnType<typeof evaluateReading> | undefined;
    let note: string | undefined;
    try {
      ev = evaluateReading(coreReading({ ...r, value: r.value! }, m.instrument), pack.shape, pack.spec, raw);
      note = ev.verdict ? undefined : "No limit for this station on the job's spec; the figure is logged";
    } catch (err) {
      note = err instanceof Error ? err.message : String(err);
    }
    const stayed = ev?.verdict === "out_of_spec" && known.count === 0;
    finish(
      {
        stationId: station.id,
        label: station.label,
        value: r.value,
        unit: r.unit,
        verdict: ev?.verdict,
        deviation: ev?.deviation,
        deviationUnit: ev?.unit,
        ...(r.lubricant ? { lubricant: LUBRICANT_LABELS[r.lubricant] } : {}),
        note,
        stayed,
      },
      saving,
      draft,
    );
  }, [views, stationId, mode, pack, prefs, settingFor, db, raw, latest, finish, write, store]);

  const skip = useCallback(
    (reason: string) => {
      const view = views.find((v) => v.station.id === (pendingMove.current ?? stationId));
      if (!view) return;
      const { station } = view;
      const known = latest(view);
      const reading: NewReading = {
        jobId: pack.job.id,
        stationId: station.id,
        value: null,
        unit: station.unit,
        skipped: true,
        skipReason: reason,
        ...(known.id ? { supersedes: known.id } : {}),
      };
      finish(
        {
          stationId: station.id,
          label: station.label,
          value: null,
          unit: station.unit,
          skipped: true,
          note: `Skipped: ${reason}`,
          stayed: false,
        },
        write(reading, known),
        "",
      );
    },
    [views, stationId, pack.job.id, finish, write, latest],
  );

  /** A jump by the machinist wins over a move still waiting for the paint; a question asked is dropped. */
  const cancelMove = useCallback(() => {
    pendingMove.current = null;
    asked.current = null;
    if (store.get().ask) store.set({ ask: undefined });
  }, [store]);
  /** "Measure again": the next figure at this station is the correction asked for. */
  const measureAgain = useCallback((id: string) => void (measuringAgain.current = id), []);
  const askSetting = useCallback(() => setSettingFor(mode.group), [mode.group]);
  return { store, save, skip, cancelMove, measureAgain, askSetting, ...mode };
}
