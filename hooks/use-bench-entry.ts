"use client";

import { startTransition, useCallback, useMemo, useRef, useState } from "react";
import { evaluateReading, type Lubricant, type MeasureUnit, type Station, type Verdict } from "@/lib/domain";
import type { JobPack } from "@/lib/schemas/sync";
import type { LocalReading } from "@/lib/offline/db";
import { buildReading, dialGroup, isDialGauge, parseEntry, pickGauge } from "@/lib/offline/entry";
import { patchJobPrefs, type JobPrefs } from "@/lib/offline/meta";
import { gaugeU, usableRaw } from "@/lib/offline/preview";
import { recordReading, resendReading, type NewReading } from "@/lib/offline/readings";
import { nextOpenStation, type StationView } from "@/lib/offline/route-status";
import { useBench } from "@/components/bench/bench-context";

// One entry at the bench, from Enter to the next station. The verdict is computed at once from
// the core and painted before the database write finishes; the write (reading + outbox, one
// transaction) runs alongside, and the sync engine is only nudged afterwards: entry never waits.
export interface LastEntry {
  seq: number;
  stationId: string;
  label: string;
  value: number | null;
  unit: MeasureUnit;
  verdict?: Verdict;
  deviation?: number;
  deviationUnit?: MeasureUnit;
  note?: string;
  skipped?: boolean;
  stayed: boolean;
}

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
  return pickGauge(station, pack.instruments, prefs.gauges[gaugeKey(station)]);
}

export function useBenchEntry({ pack, views, readings, prefs, stationId, moveTo }: Args) {
  const { db, engine, actor, deviceId } = useBench();
  const [draft, setDraft] = useState("");
  const [error, setError] = useState<string>();
  const [last, setLast] = useState<LastEntry>();
  const [settingFor, setSettingFor] = useState<string>();
  const seq = useRef(0);
  // What was saved at each station before the live query caught up: keeps supersedes and the
  // confirm rule right even when a gauge sends the next reading within milliseconds.
  const justSaved = useRef(new Map<string, { id: string; count: number }>());
  const raw = useMemo(() => usableRaw(readings, pack.instruments), [readings, pack.instruments]);
  const view = views.find((v) => v.station.id === stationId);
  const station = view?.station;
  const instrument = station ? chosenGauge(station, pack, prefs) : undefined;
  const group = station ? dialGroup(station) : undefined;
  const dialOn = !!group && prefs.dialMode && isDialGauge(instrument);
  const needSetting = dialOn && (settingFor === group || prefs.dialSettings[group!] === undefined);

  const finish = useCallback((entry: Omit<LastEntry, "seq">, write: Promise<unknown>, typed: string) => {
    setLast({ ...entry, seq: ++seq.current });
    setDraft("");
    setError(undefined);
    if (!entry.stayed) startTransition(() => moveTo(nextOpenStation(views, entry.stationId) ?? entry.stationId));
    write.then(
      () => {
        performance.mark("tw:reading-committed");
        engine.afterEntry();
      },
      (err: unknown) => {
        setDraft(typed);
        setError(`Not saved on this tablet (${err instanceof Error ? err.message : String(err)}); press Save again`);
      },
    );
  }, [engine, moveTo, views]);

  /** The station's latest reading as far as this screen knows (live query, or a save it has not seen yet). */
  const latest = useCallback((v: StationView) => {
    const saved = justSaved.current.get(v.station.id);
    if (saved && !readings.some((r) => r.id === saved.id)) return { id: saved.id, count: saved.count, rejected: undefined };
    const cur = v.current;
    return { id: cur && cur.state !== "rejected" ? cur.id : undefined, count: v.count, rejected: cur?.state === "rejected" ? cur.id : undefined };
  }, [readings]);

  const write = useCallback((reading: NewReading, known: ReturnType<typeof latest>) => {
    const w = known.rejected
      ? resendReading(db, known.rejected, reading).then(() => known.rejected!)
      : recordReading(db, reading, { deviceId, takenBy: actor.userId }).then((r) => r.id);
    return w.then((id) => void justSaved.current.set(reading.stationId, { id, count: known.count + 1 }));
  }, [db, deviceId, actor.userId]);

  const save = useCallback(() => {
    if (!view || !station) return;
    if (pack.job.locked) return setError(pack.job.lockReason ?? "This job is released; readings are locked");
    if (needSetting) {
      const parsed = parseEntry(draft, "the setting size");
      if ("error" in parsed) return setError(parsed.error);
      setDraft("");
      setError(undefined);
      setSettingFor(undefined);
      void patchJobPrefs(db, pack.job.id, { dialSettings: { ...prefs.dialSettings, [group!]: parsed.value } });
      return;
    }
    const known = latest(view);
    const supersedes = known.id;
    const built = buildReading(draft, {
      pack, station, instrument, dialSetting: dialOn ? prefs.dialSettings[group!] : undefined,
      lubricant: prefs.lubricant as Lubricant | undefined, supersedes,
    });
    if ("error" in built) return setError(built.error);
    const r = built.reading;
    const U = gaugeU(instrument, r.unit);
    let ev: ReturnType<typeof evaluateReading> | undefined;
    let note: string | undefined;
    try {
      ev = evaluateReading({ stationId: r.stationId, value: r.value!, unit: r.unit, ...(U !== undefined ? { uncertainty: U } : {}) }, pack.shape, pack.spec, raw);
      note = ev.verdict ? undefined : "No limit for this station on the job's spec; the figure is logged";
    } catch (err) {
      note = err instanceof Error ? err.message : String(err);
    }
    const stayed = ev?.verdict === "out_of_spec" && known.count === 0;
    finish({ stationId: station.id, label: station.label, value: r.value, unit: r.unit, verdict: ev?.verdict, deviation: ev?.deviation, deviationUnit: ev?.unit, note, stayed }, write(r, known), draft);
  }, [view, station, pack, needSetting, draft, db, prefs, group, instrument, dialOn, raw, finish, write, latest]);

  const skip = useCallback((reason: string) => {
    if (!view || !station) return;
    const known = latest(view);
    const reading: NewReading = { jobId: pack.job.id, stationId: station.id, value: null, unit: station.unit, skipped: true, skipReason: reason, ...(known.id ? { supersedes: known.id } : {}) };
    finish({ stationId: station.id, label: station.label, value: null, unit: station.unit, skipped: true, note: `Skipped: ${reason}`, stayed: false }, write(reading, known), "");
  }, [view, station, pack.job.id, finish, write, latest]);

  return { draft, setDraft, error, setError, last, save, skip, instrument, dialOn, needSetting, group, askSetting: () => setSettingFor(group) };
}
