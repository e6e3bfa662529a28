"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { gaugeRangeWords, instrumentKindWords, unitWords } from "@/lib/domain";
import type { StudyDraftRow } from "@/lib/offline/db";
import { startDraft } from "@/lib/offline/study-drafts";
import type { DraftGauge, StudyKind } from "@/lib/offline/study-draft-shape";
import type { StudyGauge } from "@/lib/schemas/bench-gauges";
import { useBench } from "@/components/bench/bench-context";
import { STUDY_KIND_HINTS, STUDY_KIND_WORDS } from "./words";

const KINDS: StudyKind[] = ["type1", "grr"];
const PRESSED = "aria-pressed:border-steel aria-pressed:bg-steel aria-pressed:text-steel-ink";

export function draftGauge(g: StudyGauge): DraftGauge {
  return {
    id: g.id,
    kind: g.kind,
    label: g.label,
    serial: g.serial,
    unit: g.unit,
    resolution: g.resolution,
    rangeMin: g.rangeMin ?? null,
    rangeMax: g.rangeMax ?? null,
    dialPlusMeansSmaller: g.dialPlusMeansSmaller,
    master: g.master,
  };
}

interface Props {
  gauges: StudyGauge[];
  offline: boolean;
  drafts: StudyDraftRow[];
  onStarted: (kind: StudyKind) => void;
}

/** Which study, then which gauge; a run of the same kind already kept is replaced only when confirmed. */
export function GaugeChoice({ gauges, offline, drafts, onStarted }: Props) {
  const { db, actor } = useBench();
  const [kind, setKind] = useState<StudyKind>("type1");
  const [replacing, setReplacing] = useState<StudyGauge>();
  const kept = drafts.find((d) => d.draft.kind === kind)?.draft;
  const start = async (g: StudyGauge) => {
    const gauge = draftGauge(g);
    await startDraft(
      db,
      actor.userId,
      kind === "type1"
        ? { kind, gauge, reference: null, readings: [] }
        : { kind, gauge, design: null, measurements: [] },
    );
    onStarted(kind);
  };
  return (
    <section className="flex flex-col gap-3" aria-labelledby="start-title">
      <h2 id="start-title" className="text-xl font-semibold">
        Start a study
      </h2>
      <div className="grid gap-2 sm:grid-cols-2" role="group" aria-label="Kind of study">
        {KINDS.map((k) => (
          <button
            key={k}
            type="button"
            aria-pressed={kind === k}
            onClick={() => setKind(k)}
            className={`min-h-16 rounded-tool border-2 border-rule bg-panel p-3 text-left ${PRESSED}`}
          >
            <span className="block text-lg font-semibold">{STUDY_KIND_WORDS[k]}</span>
            <span className="block text-sm">{STUDY_KIND_HINTS[k]}</span>
          </button>
        ))}
      </div>
      {offline && (
        <Notice>
          No connection: these are the gauges this tablet last heard of. The study is kept here as you go.
        </Notice>
      )}
      {gauges.length === 0 && <Notice tone="error">No gauges on file for this shop; ask the admin to add them.</Notice>}
      {replacing && kept && (
        <Notice tone="error" title={`You already have a ${STUDY_KIND_WORDS[kind].toLowerCase()} on this tablet`}>
          <p>
            {kept.gauge.label} ({kept.gauge.serial}), not yet saved. Starting one on {replacing.label} throws those
            figures away.
          </p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button onClick={() => onStarted(kind)}>Carry on with the kept one</Button>
            <Button tone="danger" onClick={() => void start(replacing)}>
              Throw it away and start
            </Button>
          </div>
        </Notice>
      )}
      <ul className="grid gap-2 sm:grid-cols-2" aria-label="Gauges">
        {gauges.map((g) => (
          <li key={g.id}>
            <button
              type="button"
              onClick={() => (kept ? setReplacing(g) : void start(g))}
              className="min-h-16 w-full rounded-tool border-2 border-rule bg-panel px-3 py-2 text-left"
            >
              <span className="block font-semibold">{g.label}</span>
              <span className="block text-sm text-muted">
                {instrumentKindWords(g.kind)} · {g.serial} · reads {g.resolution} {unitWords(g.unit)}
                {gaugeRangeWords(g) ? ` · ${gaugeRangeWords(g)}` : ""}
              </span>
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
